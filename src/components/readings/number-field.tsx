import type { ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { FieldShell } from '../ui/form-field';

type Props = { label: string; unit: ReactNode; error?: string; hint?: ReactNode; registration: UseFormRegisterReturn };

/** A reading box with its unit beside it; decimal keyboard on tablets. */
export function NumberField({ label, unit, error, hint, registration }: Props) {
  return (
    <FieldShell label={label} error={error} hint={hint}>
      {(id, describedBy) => (
        <div className="flex items-center gap-2">
          <input
            id={id}
            inputMode="decimal"
            autoComplete="off"
            aria-invalid={Boolean(error)}
            aria-describedby={describedBy}
            className="reading w-full min-w-0 rounded-md border border-line bg-field px-3 py-2 text-lg text-ink focus:outline-none focus:ring-2 focus:ring-focus aria-[invalid=true]:border-alarm"
            {...registration}
          />
          <span className="shrink-0 text-sm text-muted">{unit}</span>
        </div>
      )}
    </FieldShell>
  );
}
