import type { UnitSummary } from '../../../shared/schemas/plant';
import { defaultStationSettings, timeZonesByStation } from '../stations/index';
import { PlantUnit, Station } from './model';

/** Every unit with its station's name and time zone (the default zone for a station without settings). */
export async function listUnits(): Promise<UnitSummary[]> {
  const [units, stations, zones] = await Promise.all([
    PlantUnit.findAll({ order: [['code', 'ASC']] }),
    Station.findAll({ attributes: ['id', 'name'] }),
    timeZonesByStation(),
  ]);
  const names = new Map(stations.map((s) => [s.id, s.name]));
  return units.map((u) => ({
    id: u.id,
    code: u.code,
    name: u.name,
    stationId: u.stationId,
    station: names.get(u.stationId) ?? '',
    timeZone: zones.get(u.stationId) ?? defaultStationSettings.timeZone,
  }));
}
