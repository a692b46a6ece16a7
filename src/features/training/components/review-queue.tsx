import { Link } from 'react-router';
import { trainingLevelLabels } from '../../../../shared/schemas/training';
import { Notice } from '../../../components/ui/notice';
import { useReviewQueue } from '../api/training';

/** The trainer's queue: tasks ready to sign off, new countersigned practice, entries still unsigned. */
export function ReviewQueue() {
  const queue = useReviewQueue(true);
  if (queue.error) return <Notice kind="error">{queue.error.message}</Notice>;
  if (!queue.data) return <p>Loading the queue…</p>;
  const q = queue.data;
  return (
    <section aria-label="Trainer's queue" className="flex flex-col gap-3">
      <h2 className="text-lg font-bold">Trainees</h2>
      <ul className="flex flex-wrap gap-2">
        {q.trainees.map((t) => (
          <li key={t.id}>
            <Link className="touch-target flex items-center rounded-md border border-line bg-panel px-3 py-2 underline" to={`/training/trainees/${t.id}`}>
              {t.name} — {t.signedOff} signed off, {t.left} left
            </Link>
          </li>
        ))}
      </ul>
      <h2 className="text-lg font-bold">Ready for sign-off</h2>
      {q.ready.length === 0 ? <p className="text-muted">Nothing ready.</p> : null}
      <ul className="flex flex-col gap-1">
        {q.ready.map((r) => (
          <li key={`${r.traineeId}-${r.taskKey}`} data-testid="ready-task">
            <Link className="underline" to={`/training/trainees/${r.traineeId}`}>
              {r.trainee}: {r.taskKey} {r.taskTitle}
            </Link>{' '}
            ({r.performances} of {r.required} performances countersigned)
          </li>
        ))}
      </ul>
      <h2 className="text-lg font-bold">Countersigned since the last decision</h2>
      {q.recentlyCountersigned.length === 0 ? <p className="text-muted">None.</p> : null}
      <ul className="flex flex-col gap-1 text-sm">
        {q.recentlyCountersigned.map((e) => (
          <li key={e.id}>
            {e.trainee} · {e.taskKey} · {e.performedOn} · {trainingLevelLabels[e.level]} · countersigned by {e.countersignedBy}
          </li>
        ))}
      </ul>
      <h2 className="text-lg font-bold">Still awaiting a countersign</h2>
      {q.awaiting.length === 0 ? <p className="text-muted">None.</p> : null}
      <ul className="flex flex-col gap-1 text-sm">
        {q.awaiting.map((e) => (
          <li key={e.id}>
            {e.trainee} · {e.taskKey} · {e.performedOn} · {trainingLevelLabels[e.level]}
            {e.supervisor ? ` · waits for ${e.supervisor}` : ''}
          </li>
        ))}
      </ul>
    </section>
  );
}
