import { useState } from 'react';
import { Link } from 'react-router';
import { formatStationTime } from '../../../../shared/station-time';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { Notice } from '../../../components/ui/notice';
import { usePresence, useWatchUnit } from '../../../app/use-live-updates';
import { useCrews } from '../../../components/plant/crews';
import { useMe } from '../../session/api/get-me';
import { useCurrentHandover, useHandoverAction } from '../api/handover';
import { AddItemForm } from '../components/add-item-form';
import { BoardItemCard } from '../components/board-item';
import { HandoverNotes } from '../components/handover-notes';

const stamp = (iso: string, timeZone: string | undefined) => (timeZone ? formatStationTime(iso, timeZone) : '…');
const statusWord = { draft: '✎ Draft — being written', submitted: '⇢ Submitted — incoming crew acknowledging', accepted: '✔ Accepted — turnover done' };

export function HandoverPage() {
  const { data: me } = useMe();
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const viewing = usePresence(unitId);
  const current = useCurrentHandover(unitId);
  const crews = useCrews();
  const action = useHandoverAction();
  const [amend, setAmend] = useState({ reason: '', text: '' });
  const crewName = (id: number | null) => (id ? `Crew ${crews.data?.find((c) => c.id === id)?.name ?? id}` : 'no crew set');
  const change = current.data?.shiftChange;
  const board = current.data?.board;
  const h = board?.handover;
  const side = h && me ? (me.crewId === h.outgoingCrewId ? 'outgoing' : me.crewId === h.incomingCrewId ? 'incoming' : 'other') : 'other';
  const writer = side === 'outgoing' && me?.role !== 'trainee';

  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Shift handover</h1>
          <p className="text-muted">
            {unit ? `${unit.name} · ` : ''}
            {change ? `${crewName(change.outgoingCrewId)} hands over to ${crewName(change.incomingCrewId)} at ${formatStationTime(change.handoverAt, change.timeZone)} (station time, ${change.timeZone})` : ''}
          </p>
        </div>
        <UnitPicker />
      </div>
      {viewing.length ? (
        <p className="text-sm" data-testid="viewing">
          Viewing now: {viewing.join(', ')}
        </p>
      ) : null}
      <aside className="rounded-md border border-watch bg-panel px-4 py-2 text-sm" aria-label="Caution">
        <strong>Caution — </strong>the written handover supports, and does not replace, the face-to-face turnover and panel walkdown your
        procedures require.
      </aside>
      {current.error ? <Notice kind="error">{current.error.message}</Notice> : null}
      {current.data && !board ? <Notice kind="info">The outgoing crew has not started this shift’s handover yet.</Notice> : null}
      {board && h ? (
        <>
          <div className="flex flex-wrap items-center gap-3 rounded-lg border border-line bg-panel p-3">
            <strong data-testid="handover-status">{statusWord[h.status]}</strong>
            {h.submittedBy ? <span className="text-sm">Handed over by {h.submittedBy} at {stamp(h.submittedAt!, change?.timeZone)}</span> : null}
            {h.acceptedBy ? (
              <span className="text-sm font-bold" data-testid="turnover">
                Accepted by {h.acceptedBy} at {stamp(h.acceptedAt!, change?.timeZone)} — turnover time
              </span>
            ) : null}
            <Link to={`/handover/${h.id}/print`} className="ml-auto text-sm underline">
              Print view
            </Link>
          </div>
          {action.error ? <Notice kind="error">{action.error.message}</Notice> : null}
          <section aria-label="Notes">
            <h2 className="mb-1 font-bold">Notes</h2>
            <HandoverNotes board={board} editable={writer && h.status === 'draft'} />
          </section>
          <section aria-label="Items" className="flex flex-col gap-2">
            <h2 className="font-bold">Items ({board.items.length})</h2>
            {board.items.map((item) => (
              <BoardItemCard key={item.id} board={board} item={item} meId={me!.id} side={side} />
            ))}
          </section>
          {writer && h.status === 'draft' ? (
            <>
              <AddItemForm handoverId={h.id} />
              <button type="button" className="self-start rounded-md bg-accent px-4 py-2 font-bold text-on-accent" onClick={() => action.mutate({ kind: 'submit', id: h.id })}>
                Submit the handover
              </button>
            </>
          ) : null}
          {writer && h.status !== 'draft' ? (
            <form
              aria-label="Amend the handover"
              className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3 text-sm"
              onSubmit={(e) => {
                e.preventDefault();
                action.mutate({ kind: 'amend', id: h.id, body: amend }, { onSuccess: () => setAmend({ reason: '', text: '' }) });
              }}
            >
              <h3 className="font-bold">Amend (the handover is read-only once submitted)</h3>
              <input aria-label="Amendment" placeholder="What to add or correct" className="rounded-md border border-line bg-field px-2 py-1" value={amend.text} onChange={(e) => setAmend({ ...amend, text: e.target.value })} />
              <input aria-label="Reason" placeholder="Why" className="rounded-md border border-line bg-field px-2 py-1" value={amend.reason} onChange={(e) => setAmend({ ...amend, reason: e.target.value })} />
              <button type="submit" className="self-start rounded-md border border-line px-3 py-1 font-bold">
                Add amendment
              </button>
            </form>
          ) : null}
          {board.amendments.filter((a) => a.itemId === null).map((a) => (
            <p key={a.id} className="border-l-4 border-accent pl-2 text-sm">
              {a.text} <span className="text-muted">— amended by {a.author} at {stamp(a.at, change?.timeZone)}: {a.reason}</span>
            </p>
          ))}
          {side === 'incoming' && me?.role === 'shift_lead' && h.status === 'submitted' ? (
            <div className="flex flex-col gap-1 rounded-lg border-2 border-accent bg-panel p-3">
              {board.waiting.length ? <p className="text-sm">Waiting for: {board.waiting.join('; ')}</p> : <p className="text-sm font-bold">Every item is acknowledged and no question is open.</p>}
              <button type="button" className="self-start rounded-md bg-accent px-4 py-2 font-bold text-on-accent disabled:opacity-50" disabled={board.waiting.length > 0} onClick={() => action.mutate({ kind: 'accept', id: h.id })}>
                Accept the handover
              </button>
            </div>
          ) : null}
        </>
      ) : null}
    </section>
  );
}
