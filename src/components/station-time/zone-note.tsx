import { zoneLabel } from '../../../shared/station-time';
import type { StationZone } from './use-station-zone';

/** The line that says in which zone a page's times are shown (and, off a unit page, why that station). */
export function ZoneNote({ zone, basis, what = 'Times' }: { zone: Pick<StationZone, 'timeZone' | 'station'> | null; basis?: 'crew' | 'first' | undefined; what?: string }) {
  if (!zone) return null;
  const why = basis === 'crew' ? ` (${zone.station}, your crew’s station)` : basis === 'first' ? ` (${zone.station})` : '';
  return (
    <p className="text-sm text-muted" data-testid="zone-note">
      {what} in station time — {zoneLabel(zone.timeZone)}
      {why}.
    </p>
  );
}
