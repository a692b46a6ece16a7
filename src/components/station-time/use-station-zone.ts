import { useCrews } from '../plant/crews';
import { useUnitList, type UnitSummary } from '../readings/unit-picker';

/** A station's zone as pages show it. */
export type StationZone = { timeZone: string; station: string; stationId: number };

const zoneOf = (unit: UnitSummary | undefined): StationZone | null => (unit ? { timeZone: unit.timeZone, station: unit.station, stationId: unit.stationId } : null);

/** The lowest station id among the units: the station the server takes when none is named. */
const firstStationId = (units: UnitSummary[]) => (units.length ? Math.min(...units.map((u) => u.stationId)) : null);

/** The zone of the station a unit belongs to; null until the unit list has loaded. */
export function useUnitZone(unitId: number | null | undefined): StationZone | null {
  const units = useUnitList();
  return zoneOf(units.data?.find((u) => u.id === unitId));
}

/** The zone of a station, or of the first station when `stationId` is null (as the server does). */
export function useStationZone(stationId: number | null | undefined): StationZone | null {
  const units = useUnitList().data ?? [];
  const id = stationId ?? firstStationId(units);
  return zoneOf(units.find((u) => u.stationId === id));
}

/**
 * For pages not tied to a unit (audit trail, training, people): the station of the person's crew, or the
 * first station when they have no crew. `basis` says which, so the page can say so.
 */
export function useHomeZone(crewId: number | null | undefined): (StationZone & { basis: 'crew' | 'first' }) | null {
  const units = useUnitList().data ?? [];
  const crews = useCrews().data ?? [];
  const crewStation = crews.find((c) => c.id === crewId)?.stationId;
  const own = zoneOf(units.find((u) => u.stationId === crewStation));
  if (own) return { ...own, basis: 'crew' };
  const first = zoneOf(units.find((u) => u.stationId === firstStationId(units)));
  return first ? { ...first, basis: 'first' } : null;
}

/**
 * For lists that mix units (logbook hits, review comments): each record's unit's station zone, or the
 * home zone (see useHomeZone) for a record tied to no unit. Null until the lists have loaded.
 */
export function useZoneOfUnit(crewId: number | null | undefined): ((unitId: number | null | undefined) => string) | null {
  const units = useUnitList().data;
  const home = useHomeZone(crewId);
  if (!units || !home) return null;
  return (unitId) => units.find((u) => u.id === unitId)?.timeZone ?? home.timeZone;
}
