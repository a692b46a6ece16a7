import { useState } from 'react';
import { Link } from 'react-router';
import { trainingAmendmentSchema, trainingLevelLabels } from '../../../../shared/schemas/training';
import { Button } from '../../../components/ui/button';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useZoneOfUnit } from '../../../components/station-time/use-station-zone';
import { formatStationTime } from '../../../../shared/station-time';
import { useMe } from '../../session';
import { useAmendTraining, type EntryView } from '../api/training';

const statusWords = { awaiting_countersign: '… awaiting countersign', countersigned: '✔ countersigned', rejected: '✖ rejected' };

function AmendEntry({ entry }: { entry: EntryView }) {
  const [open, setOpen] = useState(false);
  if (!open) {
    return (
      <Button tone="link" className="text-xs" onClick={() => setOpen(true)}>
        Add an amendment
      </Button>
    );
  }
  return <AmendEntryForm entryId={entry.id} onDone={() => setOpen(false)} />;
}

function AmendEntryForm({ entryId, onDone }: { entryId: number; onDone: () => void }) {
  const amend = useAmendTraining();
  const schema = throughContract((v: { reason: string; text: string }) => ({ target: 'entry', targetId: entryId, ...v }), trainingAmendmentSchema);
  const form = useSchemaForm(schema, { defaultValues: { reason: '', text: '' } });
  const input = 'rounded-md border border-line bg-field px-2 py-1';
  return (
    <form
      className="mt-1 flex flex-col gap-1 text-sm"
      noValidate
      onSubmit={form.submit(async (v) => {
        await amend.mutateAsync(v);
        onDone();
      })}
    >
      <label className="flex flex-col">
        Why
        <input className={input} {...form.register('reason')} {...form.describe('reason')} />
      </label>
      <FieldMessage {...form.messageFor('reason')} />
      <label className="flex flex-col">
        Correction
        <input className={input} {...form.register('text')} {...form.describe('text')} />
      </label>
      <FieldMessage {...form.messageFor('text')} />
      <FormFailure form={form} />
      <Button type="submit" tone="plain" size="xs" className="self-start">
        Save amendment
      </Button>
    </form>
  );
}

/** Training entries newest first, as recorded, with countersign state and amendments beside them. */
export function EntryList({ entries, mayAmend }: { entries: EntryView[]; mayAmend: boolean }) {
  const zoneOf = useZoneOfUnit(useMe().data?.crewId);
  // Each entry in its unit's station time (the person's station when it names no unit).
  const stamp = (iso: string, unitId: number | null) => (zoneOf ? formatStationTime(iso, zoneOf(unitId)) : '…');
  if (entries.length === 0) return <p className="text-muted">No practice recorded yet.</p>;
  return (
    <ul className="flex flex-col gap-2">
      {entries.map((e) => (
        <li key={e.id} className="rounded-md border border-line bg-panel p-2 text-sm" data-testid="training-entry">
          <p>
            <strong>
              {e.taskKey} v{e.taskVersion}
            </strong>{' '}
            {e.taskTitle} · {e.performedOn} · {trainingLevelLabels[e.level]}
            {e.supervisor ? ` · supervisor ${e.supervisor}` : ''}
          </p>
          <p>{e.note}</p>
          {e.unitId && e.shiftStart ? (
            <Link className="text-xs underline" to={`/logbook/units/${e.unitId}/shifts/${encodeURIComponent(e.shiftStart)}`}>
              From the shift of {stamp(e.shiftStart, e.unitId)}
              {e.readingSetId ? `, round #${e.readingSetId}` : ''}
              {e.handoverItemId ? `, handover item #${e.handoverItemId}` : ''}
            </Link>
          ) : null}
          <p className="text-xs font-bold">
            {statusWords[e.status]}
            {e.countersignedBy ? ` by ${e.countersignedBy} ${stamp(e.countersignedAt!, e.unitId)}` : ''}
            {e.rejectReason ? ` — ${e.rejectReason}` : ''}
          </p>
          {e.amendments.map((a) => (
            <p key={a.id} className="text-xs">
              Amended by {a.by} {stamp(a.at, e.unitId)} — <em>{a.reason}</em>: {a.text}
            </p>
          ))}
          {mayAmend ? <AmendEntry entry={e} /> : null}
        </li>
      ))}
    </ul>
  );
}
