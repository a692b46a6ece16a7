import { useParams } from 'react-router';
import { formatStationTime } from '../../../../shared/station-time';
import { useUnitZone } from '../../../components/station-time/use-station-zone';
import { useHandover } from '../api/handover';
import { kindLabels } from '../components/board-item';

/** A clean page for the paper binder: notes, items with acknowledgements, both signatures and times. */
export function HandoverPrintPage() {
  const board = useHandover(Number(useParams().id));
  const zone = useUnitZone(board.data?.handover.unitId);
  const stamp = (iso: string | null) => (iso && zone ? formatStationTime(iso, zone.timeZone) : '—');
  if (!board.data) return <p>{board.error ? board.error.message : 'Loading…'}</p>;
  const { handover: h, items, amendments } = board.data;
  return (
    <article className="print-sheet mx-auto max-w-3xl bg-white p-6 text-black">
      <h1 className="text-2xl font-bold">Shift handover</h1>
      <p>
        Shift from {stamp(h.shiftStart)} · handover due {stamp(h.handoverAt)} · status {h.status} · times in station time ({zone?.timeZone ?? '…'})
      </p>
      <h2 className="mt-4 text-lg font-bold">Notes</h2>
      <div className="order-body" dangerouslySetInnerHTML={{ __html: h.notesHtml || '<p>(none)</p>' }} />
      <h2 className="mt-4 text-lg font-bold">Items</h2>
      <ol className="list-decimal pl-6">
        {items.map((i) => (
          <li key={i.id} className="mb-2 break-inside-avoid">
            <strong>{i.title}</strong> — {kindLabels[i.kind] ?? i.kind}, priority {i.priority}
            {i.reference ? `, ref ${i.reference}` : ''}
            {i.detail ? <div>{i.detail}</div> : null}
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
      <button type="button" className="no-print mt-4 rounded-md border border-black px-3 py-1" onClick={() => window.print()}>
        Print
      </button>
    </article>
  );
}
