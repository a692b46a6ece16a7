// How a round outside its unit's plausible ranges looks: a warning beside the box, a question before
// saving, and a mark on the saved round wherever it is listed.
import { useState } from 'react';
import { plausibleCatalog, type PlausibleKey } from '../../../shared/calc/plausibility';
import type { ImplausibleNotice } from '../../../shared/plausibility-display';
import { ApiError } from '../../lib/api-client';
import { Button } from '../ui/button';

const MARK = '◇';

export function PlausibleWarning({ text }: { text: string }) {
  return (
    <span className="block text-sm font-bold text-watch">
      <span aria-hidden="true">{MARK} </span>
      {text}
    </span>
  );
}

/** The mark on a saved round or a check: shape and words as well as colour. */
export function OutsidePlausibleTag({ keys }: { keys?: readonly PlausibleKey[] }) {
  const what = keys?.length ? `: ${keys.map((key) => plausibleCatalog[key].label).join(', ')}` : '';
  return (
    <span className="inline-flex items-center gap-1 rounded-full border-2 border-watch px-2 py-0.5 text-xs font-bold text-watch" data-testid="outside-plausible">
      <span aria-hidden="true">{MARK}</span>
      Outside plausible range{what}
    </span>
  );
}

type ConfirmProps = { notices: ImplausibleNotice[]; pending: boolean; onConfirm: () => void; onCancel: () => void };

/** Asked before a round with readings outside the plausible range is saved. */
export function ConfirmOutsidePlausible({ notices, pending, onConfirm, onCancel }: ConfirmProps) {
  return (
    <section role="alertdialog" aria-label="Outside the plausible range" className="flex flex-col gap-2 rounded-lg border-2 border-watch bg-panel p-3">
      <h3 className="font-bold">
        <span aria-hidden="true">{MARK} </span>This reading is outside the plausible range for this unit; check the instrument; save anyway?
      </h3>
      <ul className="list-disc pl-5 text-sm">
        {notices.map((n) => (
          <li key={n.key}>{n.message}</li>
        ))}
      </ul>
      <p className="text-sm text-muted">
        Saved anyway, the round is marked “outside plausible range” and the checks computed from these values are withheld. A suspect
        instrument is reported and handled as plant procedures say. The ranges are common practice (no source) unless your plant has set its own.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button onClick={onConfirm} disabled={pending}>
          {pending ? 'Saving…' : 'Save anyway, marked outside plausible range'}
        </Button>
        <Button tone="plain" onClick={onCancel}>
          Go back and check
        </Button>
      </div>
    </section>
  );
}

/**
 * The question before saving: what the form's own evaluation finds outside the plausible range, and
 * what the server found when it refused (its ranges in force when the reading was taken are the word).
 */
export function useOutsidePlausibleQuestion(live: ImplausibleNotice[]) {
  const [asking, setAsking] = useState(false);
  const [fromServer, setFromServer] = useState<ImplausibleNotice[]>([]);
  const notices = [...live, ...fromServer.filter((s) => !live.some((l) => l.key === s.key))];
  return {
    asking: asking && notices.length > 0,
    notices,
    keys: () => notices.map((n) => n.key),
    /** True when the save must wait for the person's answer (and the question is now shown). */
    mustAsk: (confirmed: boolean) => {
      setAsking(notices.length > 0 && !confirmed);
      return notices.length > 0 && !confirmed;
    },
    cancel: () => {
      setAsking(false);
      setFromServer([]);
    },
    /** True when the server refused for want of a confirmation; the question is then shown. */
    takeRefusal: (error: unknown) => {
      const details = error instanceof ApiError && error.code === 'OUTSIDE_PLAUSIBLE_RANGE' ? (error.details as { outside?: ImplausibleNotice[] } | undefined) : undefined;
      if (!details?.outside?.length) return false;
      setFromServer(details.outside);
      setAsking(true);
      return true;
    },
    reset: () => {
      setAsking(false);
      setFromServer([]);
    },
  };
}
