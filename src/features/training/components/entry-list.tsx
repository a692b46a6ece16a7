import { useState } from 'react';
import { Link } from 'react-router';
import { trainingLevelLabels } from '../../../../shared/schemas/training';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useZoneOfUnit } from '../../../components/station-time/use-station-zone';
import { formatStationTime } from '../../../../shared/station-time';
import { useMe } from '../../session/api/get-me';
import { useAmendTraining, type EntryView } from '../api/training';

const statusWords = { awaiting_countersign: '… awaiting countersign', countersigned: '✔ countersigned', rejected: '✖ rejected' };

function AmendEntry({ entry }: { entry: EntryView }) {
  const amend = useAmendTraining();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [text, setText] = useState('');
  const fields = amend.error instanceof ApiError ? amend.error.fields : {};
  if (!open) {
    return (
      <button type="button" className="text-xs underline" onClick={() => setOpen(true)}>
        Add an amendment
      </button>
    );
  }
  return (
    <form
      className="mt-1 flex flex-col gap-1 text-sm"
      onSubmit={(e) => {
        e.preventDefault();
        amend.mutate({ target: 'entry', targetId: entry.id, reason, text }, { onSuccess: () => setOpen(false) });
      }}
    >
      <label className="flex flex-col">
        Why
        <input className="rounded-md border border-line bg-field px-2 py-1" value={reason} onChange={(e) => setReason(e.target.value)} />
      </label>
      {fields.reason ? <span role="alert" className="text-alarm">⚠ {fields.reason}</span> : null}
      <label className="flex flex-col">
        Correction
        <input className="rounded-md border border-line bg-field px-2 py-1" value={text} onChange={(e) => setText(e.target.value)} />
      </label>
      {fields.text ? <span role="alert" className="text-alarm">⚠ {fields.text}</span> : null}
      {amend.error && !Object.keys(fields).length ? <Notice kind="error">{amend.error.message}</Notice> : null}
      <button type="submit" className="self-start rounded-md border border-line px-2 py-1">
        Save amendment
      </button>
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
