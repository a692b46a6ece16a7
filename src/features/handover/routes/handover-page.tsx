import { Link } from 'react-router';
import { mayAccept, mayAcknowledge, mayWriteHandover, withinWindow } from '../../../../shared/policies/handover';
import { formatStationTime } from '../../../../shared/station-time';
import { UnitPicker, useSelectedUnit } from '../../../components/readings/unit-picker';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useBoardPresence, useWatchUnit } from '../../../app/use-live-updates';
import { useCrews } from '../../../components/plant/crews';
import { ApiError } from '../../../lib/api-client';
import { handoverAmendmentContract } from '../lib/contracts';
import { FieldMessage, FormFailure, throughContract, useSchemaForm } from '../../../components/form/schema-form';
import { useMe } from '../../session';
import { useClientKey, useCurrentHandover, useHandoverAction, type ShiftChange } from '../api/handover';
import { AddItemForm } from '../components/add-item-form';
import { BoardItemCard } from '../components/board-item';
import { HandoverNotes } from '../components/handover-notes';
import { HandoverCondenser } from '../components/handover-condenser';

const statusWord = { draft: '✎ Draft — being written', submitted: '⇢ Submitted — incoming crew acknowledging', accepted: '✔ Accepted — turnover done' };

export function HandoverPage() {
  const { data: me } = useMe();
  const { unitId, unit } = useSelectedUnit();
  useWatchUnit(unitId);
  const viewing = useBoardPresence(unitId);
  const current = useCurrentHandover(unitId);
  const crews = useCrews();
  const action = useHandoverAction(unitId ?? 0);
  const crewName = (id: number | null) => (id ? `Crew ${crews.data?.find((c) => c.id === id)?.name ?? id}` : 'no crew set');
  const change = current.data?.shiftChange;
  const board = current.data?.board;
  const h = board?.handover;
  const zone = change?.timeZone ?? 'UTC';
  const stationTime = (iso: string) => formatStationTime(iso, zone);
  const actor = me ? { id: me.id, role: me.role, crewId: me.crewId } : null;
  const may = {
    write: Boolean(actor && h && mayWriteHandover(actor, h)),
    acknowledge: Boolean(actor && h && mayAcknowledge(actor, h)),
    accept: Boolean(actor && h && mayAccept(actor, h)),
  };
  const actionError = action.error instanceof ApiError ? (Object.values(action.error.fields)[0] ?? action.error.message) : action.error?.message;

  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-4">
        <div>
          <h1 className="text-2xl font-bold">Shift handover</h1>
          <p className="text-muted">
            {unit ? `${unit.name} · ` : ''}
            {change ? `${crewName(change.outgoingCrewId)} hands over to ${crewName(change.incomingCrewId)} at ${stationTime(change.handoverAt)} (station time, ${zone})` : ''}
          </p>
        </div>
        <UnitPicker />
      </div>
      {viewing.length ? (
        <p className="text-sm" data-testid="viewing">
          On this board now: {viewing.join(', ')}
        </p>
      ) : null}
      <aside className="rounded-md border border-watch bg-panel px-4 py-2 text-sm" aria-label="Caution">
        <strong>Caution — </strong>the written handover supports, and does not replace, the face-to-face turnover and panel walkdown your
        procedures require.
      </aside>
      {current.error ? <Notice kind="error">{current.error.message}</Notice> : null}
      {change && h?.status !== 'accepted' ? <WindowNote change={change} stationTime={stationTime} /> : null}
      {current.data && !board ? (
        current.data.mayStart ? (
          <div className="flex flex-col items-start gap-2 rounded-lg border border-line bg-panel p-3">
            <p>Nobody has started this shift’s handover yet. Start it to write notes; open flags, conditions, marked log entries and new standing orders come in by themselves.</p>
            <Button disabled={action.isPending} onClick={() => action.mutate({ kind: 'start' })}>
              Start this shift’s handover
            </Button>
            {actionError ? <Notice kind="error">{actionError}</Notice> : null}
          </div>
        ) : (
          <Notice kind="info">The outgoing crew has not started this shift’s handover yet.</Notice>
        )
      ) : null}
      {board && h ? (
        <>
          <div className="flex flex-wrap items-center gap-3 rounded-lg border border-line bg-panel p-3">
            <strong data-testid="handover-status">{statusWord[h.status]}</strong>
            {h.submittedBy ? <span className="text-sm">Handed over by {h.submittedBy} at {stationTime(h.submittedAt!)}</span> : null}
            {h.acceptedBy ? (
              <span className="text-sm font-bold" data-testid="turnover">
                Accepted by {h.acceptedBy} at {stationTime(h.acceptedAt!)} — turnover time
              </span>
            ) : null}
            <Link to={`/handover/${h.id}/print`} className="ml-auto text-sm underline">
              Print view
            </Link>
          </div>
          <div className="grid items-start gap-4 lg:grid-cols-2">
            <section aria-label="Notes">
              <h2 className="mb-1 font-bold">Notes</h2>
              <HandoverNotes key={h.id} board={board} editable={may.write && h.status === 'draft'} stationTime={stationTime} />
            </section>
            <HandoverCondenser board={board} />
          </div>
          <section aria-label="Items" className="flex flex-col gap-2">
            <h2 className="font-bold">Items ({board.items.length})</h2>
            {board.items.map((item) => (
              <BoardItemCard key={item.id} board={board} item={item} meId={me!.id} may={may} stationTime={stationTime} />
            ))}
          </section>
          {may.write && h.status === 'draft' ? (
            <>
              <AddItemForm handoverId={h.id} unitId={h.unitId} />
              <Button className="self-start" disabled={action.isPending} onClick={() => action.mutate({ kind: 'submit', id: h.id })}>
                Submit the handover
              </Button>
              {actionError ? <Notice kind="error">{actionError}</Notice> : null}
            </>
          ) : null}
          {may.write && h.status !== 'draft' ? <AmendHandoverForm handoverId={h.id} unitId={h.unitId} /> : null}
          {board.amendments
            .filter((a) => a.itemId === null)
            .map((a) => (
              <p key={a.id} className="border-l-4 border-accent pl-2 text-sm">
                {a.text} <span className="text-muted">— amended by {a.author} at {stationTime(a.at)}: {a.reason}</span>
              </p>
            ))}
          {may.accept && h.status === 'submitted' ? (
            <div className="flex flex-col gap-1 rounded-lg border-2 border-accent bg-panel p-3">
              {board.waiting.length ? <p className="text-sm">Waiting for: {board.waiting.join('; ')}</p> : <p className="text-sm font-bold">Every item is acknowledged and no question is open.</p>}
              <Button className="self-start" disabled={board.waiting.length > 0 || action.isPending} onClick={() => action.mutate({ kind: 'accept', id: h.id })}>
                Accept the handover
              </Button>
              {actionError ? <Notice kind="error">{actionError}</Notice> : null}
            </div>
          ) : null}
        </>
      ) : null}
    </section>
  );
}

/** An amendment to the submitted handover as a whole, with its reason. */
function AmendHandoverForm({ handoverId, unitId }: { handoverId: number; unitId: number }) {
  const action = useHandoverAction(unitId);
  const [clientKey, newClientKey] = useClientKey();
  const schema = throughContract((v: { text: string; reason: string }) => ({ ...v, clientKey }), handoverAmendmentContract);
  const form = useSchemaForm(schema, { defaultValues: { text: '', reason: '' } });
  const input = 'rounded-md border border-line bg-field px-2 py-1';
  return (
    <form
      aria-label="Amend the handover"
      noValidate
      className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3 text-sm"
      onSubmit={form.submit(async (body) => {
        await action.mutateAsync({ kind: 'amend', id: handoverId, body });
        form.reset();
        newClientKey();
      })}
    >
      <h3 className="font-bold">Amend the handover as a whole (the handover is read-only once submitted; amend an item on the item)</h3>
      <input aria-label="Amendment" placeholder="What to add or correct" className={input} {...form.register('text')} {...form.describe('text')} />
      <FieldMessage {...form.messageFor('text')} />
      <input aria-label="Reason" placeholder="Why" className={input} {...form.register('reason')} {...form.describe('reason')} />
      <FieldMessage {...form.messageFor('reason')} />
      <Button type="submit" tone="plain" size="sm" className="self-start" disabled={action.isPending}>
        Add amendment
      </Button>
      <FormFailure form={form} />
    </form>
  );
}

/** When submit and acceptance are open, in station time. */
function WindowNote({ change, stationTime }: { change: ShiftChange; stationTime: (iso: string) => string }) {
  const open = withinWindow({ opensAt: new Date(change.windowOpensAt), closesAt: new Date(change.windowClosesAt) }, new Date());
  return (
    <p className="text-sm text-muted" data-testid="handover-window">
      {open ? '● ' : '○ '}Submit and acceptance: from {stationTime(change.windowOpensAt)} to {stationTime(change.windowClosesAt)} (station time)
      {open ? ' — open now.' : ' — not open now; notes and items can be written at any time.'}
    </p>
  );
}
