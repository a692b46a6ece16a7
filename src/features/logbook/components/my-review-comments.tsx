import { Link } from 'react-router';
import { formatStationTime } from '../../../../shared/station-time';
import { useZoneOfUnit } from '../../../components/station-time/use-station-zone';
import { useMe } from '../../session';
import { useMyReviewComments } from '../api/logbook';

/** Trainers' comments on records the person wrote or their crew's shifts produced. */
export function MyReviewComments() {
  const comments = useMyReviewComments();
  const zoneOf = useZoneOfUnit(useMe().data?.crewId);
  if (!comments.data || comments.data.length === 0 || !zoneOf) return null;
  return (
    <section aria-label="Review comments for you" className="rounded-lg border border-line bg-panel p-3">
      <h2 className="font-bold">Review comments for you and your crew</h2>
      <ul className="mt-2 flex flex-col gap-2">
        {comments.data.map((c) => (
          <li key={c.id} className="border-t border-line pt-2" data-testid="my-review-comment">
            <p className="text-sm text-muted">
              {c.author} · {formatStationTime(c.createdAt, zoneOf(c.unitId))} station time · on “{c.about}”
            </p>
            <p>{c.body}</p>
            {c.unitId && c.shiftStart ? (
              <Link className="text-sm underline" to={`/logbook/units/${c.unitId}/shifts/${encodeURIComponent(c.shiftStart)}#record-${c.documentId}`}>
                Open that shift
              </Link>
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
