import { useParams } from 'react-router';
import { stationLocalLabel } from '../../../../shared/shift-time';
import { ShiftCondenserPanel } from '../../../components/condenser/shift-condenser-panel';
import { useHandover } from '../api/handover';
import { useHandoverHeader, type HandoverHeader } from '../api/get-handover-header';
import { kindLabels } from '../components/board-item';
import { Button } from '../../../components/ui/button';

const roleWords: Record<string, string> = { shift_lead: 'shift lead', operator: 'operator', trainee: 'trainee' };
const crewLine = (crew: HandoverHeader['outgoingCrew']) =>
  crew ? `Crew ${crew.name}${crew.members.length ? ` — ${crew.members.map((m) => `${m.name} (${roleWords[m.role] ?? m.role})`).join(', ')}` : ''}` : 'no crew set';

/** A clean page for the paper binder: who, where and when; notes, items with files and acknowledgements, the condenser as handed over, both signatures. */
export function HandoverPrintPage() {
  const id = Number(useParams().id);
  const board = useHandover(id);
  const header = useHandoverHeader(id);
  if (!board.data || !header.data) return <p>{board.error?.message ?? header.error?.message ?? 'Loading…'}</p>;
  const { handover: h, items, amendments } = board.data;
  const head = header.data;
  const stamp = (iso: string | null) => (iso ? stationLocalLabel(new Date(iso), head.timeZone) : '—');
  return (
    <article className="print-sheet mx-auto max-w-3xl bg-white p-6 text-black">
      <h1 className="text-2xl font-bold">Shift handover — {head.station.name}, {head.unit.name}</h1>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 text-sm" data-testid="print-header">
        <dt className="font-bold">Shift change</dt>
        <dd>
          {head.handoverAtLocal} station time ({head.timeZone}); shift from {head.shiftStartLocal}; status {h.status}
        </dd>
        <dt className="font-bold">Outgoing</dt>
        <dd>{crewLine(head.outgoingCrew)}</dd>
        <dt className="font-bold">Incoming</dt>
        <dd>{crewLine(head.incomingCrew)}</dd>
      </dl>
      <h2 className="mt-4 text-lg font-bold">Notes</h2>
      <div className="order-body" dangerouslySetInnerHTML={{ __html: h.notesHtml || '<p>(none)</p>' }} />
      {h.condenserSnapshot ? (
        <div className="mt-4 break-inside-avoid">
          <ShiftCondenserPanel state={h.condenserSnapshot.state} frozenAt={h.condenserSnapshot.frozenAt} rulesOpen />
        </div>
      ) : (
        <p className="mt-4 text-sm">Condenser over the shift: recorded when the handover is submitted{h.status === 'draft' ? ' (not yet submitted)' : ' (none stored for this handover)'}.</p>
      )}
      <h2 className="mt-4 text-lg font-bold">Items</h2>
      <ol className="list-decimal pl-6">
        {items.map((i) => (
          <li key={i.id} className="mb-2 break-inside-avoid">
            <strong>{i.title}</strong> — {kindLabels[i.kind] ?? i.kind}, priority {i.priority}
            {i.reference ? `, ref ${i.reference}` : ''}
            {i.detail ? <div>{i.detail}</div> : null}
            <div className="text-sm" data-testid={`print-attachments-${i.id}`}>
              Attachments: {i.attachments.length ? i.attachments.map((a) => `${a.fileName} (${a.mime === 'application/pdf' ? 'PDF' : 'photo'}, ${Math.ceil(a.size / 1024)} kB)`).join('; ') : 'none'}
            </div>
            <div className="text-sm">Acknowledged: {i.acknowledgedBy.map((a) => `${a.name} ${stamp(a.at)}`).join('; ') || 'none'}</div>
            {i.queries.map((q) => (
              <div key={q.id} className="text-sm">
                Q ({q.askedBy}): {q.question} — A ({q.answeredBy ?? '—'}): {q.answer ?? 'unanswered'}
              </div>
            ))}
          </li>
        ))}
      </ol>
      {amendments.length ? (
        <>
          <h2 className="mt-4 text-lg font-bold">Amendments</h2>
          <ul className="pl-6">
            {amendments.map((a) => (
              <li key={a.id}>
                {stamp(a.at)} {a.author}: {a.text} (reason: {a.reason})
              </li>
            ))}
          </ul>
        </>
      ) : null}
      <table className="mt-8 w-full border-collapse text-left">
        <tbody>
          <tr>
            <th className="border border-black p-2">Handed over by (outgoing)</th>
            <td className="border border-black p-2">{h.submittedBy ?? '—'}</td>
            <td className="border border-black p-2">{stamp(h.submittedAt)}</td>
          </tr>
          <tr>
            <th className="border border-black p-2">Accepted by (incoming) — turnover time</th>
            <td className="border border-black p-2">{h.acceptedBy ?? '—'}</td>
            <td className="border border-black p-2">{stamp(h.acceptedAt)}</td>
          </tr>
        </tbody>
      </table>
      <p className="mt-2 text-xs">All times are station time ({head.timeZone}).</p>
      <Button tone="plain" size="sm" className="no-print mt-4" onClick={() => window.print()}>
        Print
      </Button>
    </article>
  );
}
