import { useState } from 'react';
import type { StationSettings } from '../../../../shared/schemas/log';
import { formatStationTime } from '../../../../shared/station-time';
import { amendLogEntrySchema } from '../../../../shared/schemas/log';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, useSchemaForm } from '../../../components/form/schema-form';
import { useAmendEntry, type LogEntryView } from '../api/log';

function AmendInline({ entry, onDone }: { entry: LogEntryView; onDone: () => void }) {
  const amend = useAmendEntry();
  const form = useSchemaForm(amendLogEntrySchema, { defaultValues: { text: entry.amendments.at(-1)?.text ?? entry.text, reason: '' } });
  return (
    <form
      aria-label="Amend entry"
      noValidate
      className="mt-2 flex flex-col gap-1 text-sm"
      onSubmit={form.submit(async (input) => {
        await amend.mutateAsync({ id: entry.id, ...input });
        onDone();
      })}
    >
      <input aria-label="Corrected text" className="rounded-md border border-line bg-field px-2 py-1" {...form.register('text')} {...form.describe('text')} />
      <FieldMessage {...form.messageFor('text')} />
      <input aria-label="Reason for the amendment" placeholder="Why is it corrected?" className="rounded-md border border-line bg-field px-2 py-1" {...form.register('reason')} {...form.describe('reason')} />
      <FieldMessage {...form.messageFor('reason')} />
      <FormFailure form={form} />
      <div className="flex gap-2">
        <Button type="submit" size="sm">
          Save amendment
        </Button>
        <Button tone="link" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export function EntryList({ entries, settings }: { entries: LogEntryView[]; settings: StationSettings }) {
  const [amending, setAmending] = useState<number | null>(null);
  const label = (list: { key: string; label: string }[], key: string) => list.find((i) => i.key === key)?.label ?? key;
  const local = (iso: string) => formatStationTime(iso, settings.timeZone);
  if (!entries.length) return <p className="text-muted">No entries match.</p>;
  return (
    <ol className="flex flex-col gap-2" aria-label="Log entries">
      {entries.map((e) => {
        const amended = e.amendments.length > 0;
        return (
          <li key={e.id} className="rounded-lg border border-line bg-panel p-3" data-testid={`log-entry-${e.id}`}>
            <div className="flex flex-wrap items-baseline gap-2 text-sm">
              <span className="reading font-semibold">{local(e.eventAt)}</span>
              <span className="text-muted">
                {label(settings.positions, e.position)} · {label(settings.categories, e.category)} · {e.author}
              </span>
              {e.writtenAsTrainee ? (
                <span className="rounded-full border border-line px-2 text-xs font-bold" data-testid="trainee-entry">
                  ✎ trainee’s entry
                </span>
              ) : null}
              {e.late ? (
                <span className="rounded-full border-2 border-watch px-2 text-xs font-bold text-watch" title={`Entered ${local(e.enteredAt)}`}>
                  ▲ late entry, written {local(e.enteredAt)}
                </span>
              ) : null}
              {e.arrivedLate ? (
                <span className="rounded-full border-2 border-line px-2 text-xs font-bold" data-testid="arrived-late">
                  <span aria-hidden="true">⧗ </span>arrived late: written {local(e.enteredAt)}, arrived {local(e.receivedAt)}
                </span>
              ) : null}
              {e.carryToHandover ? <span className="rounded-full border border-accent px-2 text-xs font-bold text-accent">⇢ handover</span> : null}
              {e.enteredAfterReview ? <span className="text-xs font-bold text-watch">entered after the review</span> : null}
            </div>
            <p className={`mt-1 whitespace-pre-wrap ${amended ? 'text-muted line-through' : ''}`}>{e.text}</p>
            {e.amendments.map((a, i) => (
              <div key={a.id} className="mt-1 border-l-4 border-accent pl-2 text-sm">
                <p className={i < e.amendments.length - 1 ? 'text-muted line-through' : ''}>{a.text}</p>
                <p className="text-xs text-muted">
                  Amended by {a.author} at {local(a.amendedAt)} — {a.reason}
                  {a.afterReview ? ' · after the review' : ''}
                </p>
              </div>
            ))}
            {e.mayAmend && amending !== e.id ? (
              <Button tone="link" className="mt-1 text-sm" onClick={() => setAmending(e.id)}>
                Amend
              </Button>
            ) : null}
            {amending === e.id ? <AmendInline entry={e} onDone={() => setAmending(null)} /> : null}
          </li>
        );
      })}
    </ol>
  );
}
