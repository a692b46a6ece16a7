import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';

type FieldShellProps = { label: string; error?: string; hint?: ReactNode; children: (id: string, describedBy?: string) => ReactNode };

/** Label, control and its error message, wired for screen readers. */
export function FieldShell({ label, error, hint, children }: FieldShellProps) {
  const id = useId();
  const errorId = `${id}-error`;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-bold">
        {label}
      </label>
      {children(id, error ? errorId : undefined)}
      {hint && !error ? <p className="text-xs text-muted">{hint}</p> : null}
      {error ? (
        <p id={errorId} role="alert" className="text-sm font-bold text-alarm">
          ⚠ {error}
        </p>
      ) : null}
    </div>
  );
}

const controlClass =
  'rounded-md border border-line bg-field px-3 py-2 text-base text-ink focus:outline-none focus:ring-2 focus:ring-focus aria-[invalid=true]:border-alarm';

type TextFieldProps = InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; hint?: ReactNode };

export function TextField({ label, error, hint, ...input }: TextFieldProps) {
  return (
    <FieldShell label={label} error={error} hint={hint}>
      {(id, describedBy) => (
        <input id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy} className={controlClass} {...input} />
      )}
    </FieldShell>
  );
}

type SelectFieldProps = SelectHTMLAttributes<HTMLSelectElement> & { label: string; error?: string; hint?: ReactNode };

export function SelectField({ label, error, hint, children, ...select }: SelectFieldProps) {
  return (
    <FieldShell label={label} error={error} hint={hint}>
      {(id, describedBy) => (
        <select id={id} aria-invalid={Boolean(error)} aria-describedby={describedBy} className={controlClass} {...select}>
          {children}
        </select>
      )}
    </FieldShell>
  );
}
