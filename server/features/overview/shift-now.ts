// Every unit with its station's settings and the shift in progress: which crew works it, when it
// changes and who comes in. A fixed number of reads whatever the number of units or stations.
import { nextShiftStart, shiftStartFor } from '../../../shared/shift-time';
import type { StationSettings } from '../../../shared/schemas/log';
import { allStations, allUnits, crewNamesOf, type PlantUnit } from '../plant/index';
import { crewsOnShifts, type CrewRotation } from '../shifts/index';
import { defaultStationSettings, shiftSetupsByStation } from '../stations/index';

export type StationNow = {
  stationId: number;
  name: string;
  settings: StationSettings;
  shiftStart: Date;
  changeAt: Date;
  crewOnShiftId: number | null;
  incomingCrewId: number | null;
};

export type ShiftNow = {
  units: PlantUnit[];
  stations: Map<number, StationNow>;
  crewNames: Map<number, string>;
};

export async function shiftNow(now: Date): Promise<ShiftNow> {
  const [units, stations, saved] = await Promise.all([allUnits(), allStations(), shiftSetupsByStation()]);
  const setups = stations.map((station) => {
    const setup = saved.get(station.id);
    const settings = setup?.settings ?? defaultStationSettings;
    const shiftStart = shiftStartFor(now, settings.timeZone, settings.shiftChangeTimes);
    const changeAt = nextShiftStart(shiftStart, settings.timeZone, settings.shiftChangeTimes);
    return { station, settings, rotation: (setup?.rotation ?? null) as CrewRotation | null, shiftStart, changeAt };
  });
  const crews = await crewsOnShifts(
    setups.flatMap((s) => [s.shiftStart, s.changeAt].map((shiftStart) => ({ stationId: s.station.id, shiftStart, rotation: s.rotation, changesPerDay: s.settings.shiftChangeTimes.length }))),
  );
  const crewIds = [...new Set(crews.filter((id): id is number => id !== null))];
  const crewNames = await crewNamesOf(crewIds);
  const byStation = new Map<number, StationNow>(
    setups.map((s, i) => [
      s.station.id,
      { stationId: s.station.id, name: s.station.name, settings: s.settings, shiftStart: s.shiftStart, changeAt: s.changeAt, crewOnShiftId: crews[2 * i] ?? null, incomingCrewId: crews[2 * i + 1] ?? null },
    ]),
  );
  return { units, stations: byStation, crewNames };
}
