import { Link } from 'react-router';
import { defaultDisplayPreferences, displayQuantity } from '../../../../shared/display';
import type { OverviewRound } from '../../../../shared/schemas/overview';
import { StatusBadge } from '../../../components/ui/status-badge';
import { formatAge, stationTime } from './clock';

type Props = { unitId: number; round: OverviewRound | null; timeZone: string; intervalMinutes: number; sinceFetchMs: number };

/** The latest round: when and by whom, its age counting on, an overdue warning, and its key checks. */
export function RoundSection({ unitId, round, timeZone, intervalMinutes, sinceFetchMs }: Props) {
  if (!round) {
    return (
      <section aria-label="Latest round" className="flex flex-col gap-2">
        <h3 className="font-bold">Latest round</h3>
        <p role="alert" className="rounded-md border-2 border-watch px-3 py-2 font-bold">
          ▲ No round recorded on this unit yet. <Link className="underline" to={`/rounds?unit=${unitId}`}>Record one</Link>
        </p>
      </section>
    );
  }
  const age = round.ageMs + sinceFetchMs;
  const overdue = age > intervalMinutes * 60_000;
  return (
    <section aria-label="Latest round" className="flex flex-col gap-2">
      <h3 className="font-bold">Latest round</h3>
      {overdue ? (
        <p role="alert" data-testid="round-overdue" className="rounded-md border-2 border-alarm px-3 py-2 font-bold text-alarm">
          ◆ Round overdue: the last one is {formatAge(age)} old, and one is due every {intervalMinutes} min. Take the round as your procedures require.
        </p>
      ) : null}
      <p className="text-sm">
        <Link className="font-bold underline" to={`/rounds/${round.id}?unit=${unitId}`}>
          {stationTime(round.takenAt, timeZone)}
        </Link>{' '}
        by {round.recordedBy}
        {round.recordedAsTrainee ? ' (trainee)' : ''} ·{' '}
        <span className="reading font-semibold" data-testid="round-age">
          {formatAge(age)} ago
        </span>{' '}
        · due every {intervalMinutes} min
        {round.amended ? ' · corrected since (current version shown)' : ''}
        {round.needsCountersign ? ' · ▲ awaiting countersign' : ''}
      </p>
      <dl className="grid gap-x-6 @2xl:grid-cols-2">
        {round.checks.map((check) => {
          const shown = check.value === null ? null : displayQuantity(check.value, check.quantity, defaultDisplayPreferences);
          return (
            <div key={check.key} className="flex items-center justify-between gap-2 border-t border-line py-1.5" data-testid={`overview-check-${check.key}`}>
              <dt className="text-sm">
                {check.label}
                {check.value === null && check.reason ? <span className="block text-xs text-muted">{check.reason}</span> : null}
              </dt>
              <dd className="flex items-center gap-2 whitespace-nowrap">
                <span className="reading text-lg font-semibold">
                  {shown ? (
                    <>
                      {shown.text} <span className="text-sm font-normal text-muted">{shown.unit}</span>
                    </>
                  ) : (
                    '—'
                  )}
                </span>
                <StatusBadge status={check.status} />
              </dd>
            </div>
          );
        })}
      </dl>
    </section>
  );
}
