import { Link } from 'react-router';
import { mayCountersignRound } from '../../../../shared/policies/readings';
import { Button } from '../../../components/ui/button';
import { formatStationTime } from '../../../../shared/station-time';
import { pressureUnitLabels, type PressureUnit } from '../../../../shared/units';
import { StatusBadge } from '../../../components/ui/status-badge';
import { Notice } from '../../../components/ui/notice';
import { OutsidePlausibleTag } from '../../../components/readings/plausibility';
import { useMe } from '../../session';
import { useCountersign, type ReadingSummary } from '../api/readings';

export function RecentReadings({ readings, timeZone }: { readings: ReadingSummary[]; timeZone: string }) {
  const { data: me } = useMe();
  const countersign = useCountersign();
  if (!readings.length) return <Notice kind="info">No rounds recorded for this unit yet.</Notice>;
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-panel p-3">
      <h2 className="mb-2 font-bold">Recent rounds</h2>
      <p className="text-sm text-muted sm:hidden">Times in station time ({timeZone}).</p>
      {countersign.error ? <Notice kind="error">{countersign.error.message}</Notice> : null}
      <table className="stack-table w-full text-left text-sm">
        <thead>
          <tr className="text-muted">
            <th className="pb-1">Taken (station time, {timeZone})</th>
            <th className="pb-1">Pressure</th>
            <th className="pb-1">By</th>
            <th className="pb-1">Status</th>
            <th className="pb-1" />
          </tr>
        </thead>
        <tbody>
          {readings.map((r) => (
            <tr key={r.id} className="border-t border-line" data-testid={`reading-${r.id}`}>
              <td data-label="Taken" className="reading py-1 pr-2 whitespace-nowrap">
                <Link to={`/rounds/${r.id}`} className="text-accent underline">
                  {formatStationTime(r.takenAt, timeZone)}
                </Link>
              </td>
              <td data-label="Pressure" className="reading py-1 pr-2 whitespace-nowrap">
                {r.raw.pressure.value} {pressureUnitLabels[r.raw.pressure.unit as PressureUnit]}
              </td>
              <td data-label="By" className="py-1 pr-2">
                {r.recordedBy}
                {r.source === 'import' ? ' (import)' : ''}
                {r.recordedAsTrainee ? ' · trainee' : ''}
              </td>
              <td data-label="Status" className="py-1 pr-2">
                <StatusBadge status={r.worstStatus} />
                {r.amendments ? <span className="ml-1 text-xs text-muted">amended ×{r.amendments}</span> : null}
                {r.arrivedLate ? (
                  <span className="ml-1 text-xs font-bold" data-testid="arrived-late">
                    <span aria-hidden="true">⧗ </span>arrived late (entered {formatStationTime(r.enteredAt, timeZone)}, arrived {formatStationTime(r.recordedAt, timeZone)})
                  </span>
                ) : null}
                {r.outsidePlausible.length ? (
                  <span className="ml-1">
                    <OutsidePlausibleTag keys={r.outsidePlausible} />
                  </span>
                ) : null}
              </td>
              <td className="py-1 text-right max-sm:text-left">
                {r.needsCountersign ? (
                  me && mayCountersignRound(me, r) ? (
                    <Button tone="plain" size="xs" onClick={() => countersign.mutate(r.id)}>
                      Countersign
                    </Button>
                  ) : (
                    <span className="text-xs font-bold text-watch">▲ awaiting countersign</span>
                  )
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
