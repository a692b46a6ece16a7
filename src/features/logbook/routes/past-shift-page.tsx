import { useEffect } from 'react';
import { can } from '../../../../shared/policies/permissions';
import { Link, useLocation, useParams } from 'react-router';
import type { CheckKey } from '../../../../shared/calc/check-catalog';
import type { Status } from '../../../../shared/calc/limits';
import { defaultDisplayPreferences, displayQuantity } from '../../../../shared/display';
import { formatStationTime } from '../../../../shared/station-time';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { StatusBadge } from '../../../components/ui/status-badge';
import { useMe } from '../../session';
import { usePastShift, type PastShift } from '../api/logbook';
import { ReviewedRecord } from '../components/reviewed-record';
import { HandedOverCondenser, ItemAttachments } from '../components/handover-record-extras';

// The checks shown for each round; the full set is on the round's own page.
const roundColumns: CheckKey[] = ['backpressure', 'expectedBackpressure', 'subcooling', 'ttd', 'cwRise', 'cleanlinessFactor', 'towerApproach'];

function limitText(band: { lowAlarm?: number | null; lowWatch?: number | null; highWatch?: number | null; highAlarm?: number | null } | undefined, key: CheckKey, results: PastShift['readings'][number]['current']['results']) {
  if (!band) return null;
  const quantity = results.checks[key].quantity;
  const show = (v: number | null | undefined) => (v == null ? null : `${displayQuantity(v, quantity, defaultDisplayPreferences).text} ${displayQuantity(v, quantity, defaultDisplayPreferences).unit}`);
  const parts = [band.highWatch != null ? `watch ≥ ${show(band.highWatch)}` : null, band.highAlarm != null ? `alarm ≥ ${show(band.highAlarm)}` : null, band.lowWatch != null ? `watch ≤ ${show(band.lowWatch)}` : null, band.lowAlarm != null ? `alarm ≤ ${show(band.lowAlarm)}` : null].filter(Boolean);
  return parts.length ? parts.join(', ') : null;
}

type HandoverProps = {
  title: string;
  board: NonNullable<PastShift['handoverGiven']>;
  doc: (kind: string, id: number) => number | undefined;
  comments: PastShift['comments'];
  mayComment: boolean;
  practice: ((itemId: number) => React.ReactNode) | null;
  timeZone: string;
};

function Handover({ title, board, doc, comments, mayComment, practice, timeZone }: HandoverProps) {
  const h = board.handover;
  const stamp = (iso: string) => formatStationTime(iso, timeZone);
  return (
    <section aria-label={title} className="flex flex-col gap-2">
      <h2 className="text-xl font-bold">{title}</h2>
      <p className="text-sm">
        Status: <strong>{h.status}</strong>
        {h.submittedAt ? ` · submitted by ${h.submittedBy} at ${stamp(h.submittedAt)}` : ''}
        {h.acceptedAt ? ` · turnover accepted by ${h.acceptedBy} at ${stamp(h.acceptedAt)}` : ' · not accepted'}
      </p>
      <ReviewedRecord label="Handover notes" documentId={doc('handover_notes', h.id)} comments={comments} mayComment={mayComment} timeZone={timeZone}>
        <div className="order-body" dangerouslySetInnerHTML={{ __html: h.notesHtml || '<p><em>No notes.</em></p>' }} />
      </ReviewedRecord>
      <HandedOverCondenser board={board} />
      {board.items.map((item) => (
        <ReviewedRecord key={item.id} label={`Handover item ${item.title}`} documentId={doc('handover_item', item.id)} comments={comments} mayComment={mayComment} timeZone={timeZone}>
          <p className="font-bold">
            {item.title} <span className="text-xs font-normal">({item.kind.replace(/_/g, ' ')}, {item.priority} priority{item.reference ? `, ref. ${item.reference}` : ''})</span>
          </p>
          {item.detail ? <p className="text-sm">{item.detail}</p> : null}
          <ItemAttachments item={item} />
          <p className="text-xs text-muted">Acknowledged: {item.acknowledgedBy.length ? item.acknowledgedBy.map((a) => `${a.name} ${stamp(a.at)}`).join('; ') : 'nobody'}</p>
          {item.queries.map((q) => (
            <p key={q.id} className="text-sm">
              ❓ {q.question} — {q.askedBy} · {q.answer ? `answer by ${q.answeredBy}: ${q.answer}` : 'unanswered'}
            </p>
          ))}
          {practice ? practice(item.id) : null}
        </ReviewedRecord>
      ))}
      {board.amendments.map((a) => (
        <ReviewedRecord key={a.id} label="Handover amendment" documentId={doc('handover_amendment', a.id)} comments={comments} mayComment={mayComment} timeZone={timeZone}>
          <p className="text-sm">
            Amendment by {a.author} at {stamp(a.at)} — <em>{a.reason}</em>: {a.text}
          </p>
        </ReviewedRecord>
      ))}
    </section>
  );
}

/** For a trainee: record training practice that came from this record. */
function PracticeLink({ unitId, shiftStart, what }: { unitId: number; shiftStart: string; what?: { readingSetId?: number; handoverItemId?: number } }) {
  const params = new URLSearchParams({ unitId: String(unitId), shiftStart });
  if (what?.readingSetId) params.set('readingSetId', String(what.readingSetId));
  if (what?.handoverItemId) params.set('handoverItemId', String(what.handoverItemId));
  return (
    <Link className="text-sm underline" to={`/training?${params}`}>
      Record as training practice
    </Link>
  );
}

export function PastShiftPage() {
  const params = useParams();
  const unitId = Number(params.unitId);
  const shiftStart = params.shiftStart ?? '';
  const shift = usePastShift(unitId, shiftStart);
  const { data: me } = useMe();
  const location = useLocation();
  const mayComment = Boolean(me && can(me.role, 'review.comment'));
  // Scroll to the record a search result or comment link points at, once it is on the page.
  useEffect(() => {
    if (shift.data && location.hash) document.getElementById(location.hash.slice(1))?.scrollIntoView({ block: 'center' });
  }, [shift.data, location.hash]);

  if (shift.error) return <Notice kind="error">{shift.error.message}</Notice>;
  if (!shift.data) return <p>Loading the shift…</p>;
  const s = shift.data;
  const stamp = (iso: string) => formatStationTime(iso, s.shift.timeZone);
  const docs = new Map(s.documents.map((d) => [`${d.kind}:${d.refId}`, d.id]));
  const doc = (kind: string, id: number) => docs.get(`${kind}:${id}`);
  const common = { comments: s.comments, mayComment, timeZone: s.shift.timeZone };
  const isTrainee = Boolean(me && can(me.role, 'training.practice'));
  const practice = isTrainee ? (itemId: number) => <PracticeLink unitId={s.unit.id} shiftStart={s.shift.start} what={{ handoverItemId: itemId }} /> : null;
  return (
    <section className="flex flex-col gap-5">
      <div>
        <Link to="/logbook" className="text-sm underline">
          ← Logbook history
        </Link>
        <h1 className="text-2xl font-bold">
          {s.unit.name}: shift {s.shift.startLocal} – {s.shift.endLocal}
        </h1>
        <p className="text-muted">
          {s.shift.crew ? `Crew ${s.shift.crew.name} on shift` : 'No crew rotation recorded'} · times in station time ({s.shift.timeZone}) · read-only record
          {s.shift.inProgress ? ' · this shift is still in progress' : ''}
        </p>
        {isTrainee ? <PracticeLink unitId={s.unit.id} shiftStart={s.shift.start} /> : null}
      </div>
      <CautionNote />

      <section aria-label="Log entries" className="flex flex-col gap-2">
        <h2 className="text-xl font-bold">Log</h2>
        {s.reviews.map((r) => (
          <p key={r.position} className="text-sm">
            ✔ End-of-shift review ({r.position.replace(/_/g, ' ')}) signed by {r.by} at {stamp(r.at)}
          </p>
        ))}
        {s.logEntries.length === 0 ? <p className="text-muted">No log entries.</p> : null}
        {s.logEntries.map((e) => (
          <ReviewedRecord key={e.id} label={`Log entry ${stamp(e.eventAt)}`} documentId={doc('log_entry', e.id)} {...common}>
            <p className="text-sm text-muted">
              {stamp(e.eventAt)} · {e.position.replace(/_/g, ' ')} · {e.category.replace(/_/g, ' ')} · {e.author}
              {e.writtenAsTrainee ? ' (trainee’s entry)' : ''}
              {e.late ? ` · late entry (written ${stamp(e.enteredAt)})` : ''}
            </p>
            <p className={e.amendments.length ? 'line-through decoration-1' : ''}>{e.text}</p>
            {e.amendments.map((a) => (
              <p key={a.id} className="text-sm">
                Amended by {a.author} at {stamp(a.amendedAt)} — <em>{a.reason}</em>: {a.text}
              </p>
            ))}
          </ReviewedRecord>
        ))}
      </section>

      <section aria-label="Rounds" className="flex flex-col gap-2">
        <h2 className="text-xl font-bold">Rounds, with the limits in force then</h2>
        {s.readings.length === 0 ? <p className="text-muted">No rounds.</p> : null}
        {s.readings.map((r) => (
          <ReviewedRecord key={r.reading.id} label={`Round ${stamp(r.reading.takenAt)}`} documentId={doc('round', r.reading.id)} {...common}>
            <p className="flex flex-wrap items-center gap-2 text-sm">
              <Link className="font-bold underline" to={`/rounds/${r.reading.id}`}>
                Round {stamp(r.reading.takenAt)}
              </Link>
              <StatusBadge status={r.current.worstStatus as Status} /> {r.reading.recordedBy}
              {r.reading.recordedAsTrainee ? ` (trainee${r.countersign ? `, countersigned by ${r.countersign.by}` : ', not countersigned'})` : ''}
              {r.current.amended ? ' · amended' : ''}
              {r.limitSet ? <span className="text-muted">· limit set of {stamp(r.limitSet.effectiveFrom)}</span> : null}
            </p>
            <table className="stack-table mt-1 w-full text-left text-sm">
              <tbody>
                {roundColumns.map((key) => {
                  const check = r.current.results.checks[key];
                  const shown = check.value === null ? null : displayQuantity(check.value, check.quantity, defaultDisplayPreferences);
                  return (
                    <tr key={key} className="border-t border-line">
                      <td className="py-1 pr-2 max-sm:font-bold">{check.label}</td>
                      <td data-label="Value" className="reading py-1 pr-2 text-right whitespace-nowrap">{shown ? `${shown.text} ${shown.unit}` : '—'}</td>
                      <td data-label="Status" className="py-1 pr-2">
                        <StatusBadge status={check.status} />
                      </td>
                      <td data-label="Limit" className="py-1 text-xs text-muted">{limitText(r.limitSet?.limits[key], key, r.current.results) ?? 'no limit set'}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            {r.amendments.map((a) => (
              <p key={a.id} className="text-sm">
                Amended by {a.amendedBy} at {stamp(a.amendedAt)} — <em>{a.reason}</em>
              </p>
            ))}
            {isTrainee ? <PracticeLink unitId={s.unit.id} shiftStart={s.shift.start} what={{ readingSetId: r.reading.id }} /> : null}
          </ReviewedRecord>
        ))}
      </section>

      <section aria-label="Flags" className="flex flex-col gap-2">
        <h2 className="text-xl font-bold">Flags during the shift</h2>
        {s.flags.length === 0 ? <p className="text-muted">No flags.</p> : null}
        {s.flags.map((f) => (
          <ReviewedRecord key={f.id} label={`Flag ${f.parameterLabel}`} documentId={doc('flag', f.id)} {...common}>
            <p className="flex flex-wrap items-center gap-2">
              <StatusBadge status={f.severity as Status} /> <strong>{f.parameterLabel}</strong> · {f.origin} · raised {stamp(f.raisedAt)}
              {f.raisedBy ? ` by ${f.raisedBy}` : ''} · {f.statusThen === 'open' ? 'open at the end of the shift' : `cleared ${stamp(f.clearedAt!)}`}
            </p>
            {f.comment ? <p className="text-sm">{f.comment}</p> : null}
            {f.statusThen === 'cleared' && f.clearComment ? <p className="text-sm">Cleared: {f.clearComment}</p> : null}
          </ReviewedRecord>
        ))}
      </section>

      <section aria-label="Time-limited conditions" className="flex flex-col gap-2">
        <h2 className="text-xl font-bold">Time-limited conditions</h2>
        {s.conditions.length === 0 ? <p className="text-muted">None in force.</p> : null}
        {s.conditions.map((c) => (
          <ReviewedRecord key={c.id} label={`Condition ${c.title}`} documentId={doc('condition', c.id)} {...common}>
            <p>
              <strong>{c.title}</strong> — {c.requiredAction}
            </p>
            <p className="text-sm text-muted">
              Deadline {c.limitLocal} · owner {c.owner} · at the end of the shift: {c.state.replace(/_/g, ' ')}
              {c.remainingMs !== null && c.state !== 'closed' ? ` (${Math.round(c.remainingMs / 60_000)} min left)` : ''}
            </p>
          </ReviewedRecord>
        ))}
      </section>

      <section aria-label="Standing orders" className="flex flex-col gap-2">
        <h2 className="text-xl font-bold">Standing orders in force</h2>
        {s.standingOrders.length === 0 ? <p className="text-muted">None.</p> : null}
        {s.standingOrders.map((o) => (
          <ReviewedRecord key={o.id} label={`Standing order ${o.title}`} documentId={doc('standing_order', o.id)} {...common}>
            <details>
              <summary className="font-bold">
                {o.title} <span className="text-sm font-normal text-muted">issued by {o.issuedBy}, {stamp(o.issuedAt)}</span>
              </summary>
              <div className="order-body" dangerouslySetInnerHTML={{ __html: o.bodyHtml }} />
            </details>
          </ReviewedRecord>
        ))}
      </section>

      {s.handoverReceived ? <Handover title="Handover received at the start" board={s.handoverReceived} doc={doc} practice={practice} {...common} /> : <p className="text-muted">No handover recorded at the start of this shift.</p>}
      {s.handoverGiven ? <Handover title="Handover given at the end" board={s.handoverGiven} doc={doc} practice={practice} {...common} /> : <p className="text-muted">No handover recorded at the end of this shift.</p>}
    </section>
  );
}
