// Which crew works a shift: the station's rotation (crews in order, one shift each, counted from an
// anchor shift), unless a one-off swap says otherwise.
import { nextShiftStart, shiftStartFor } from '../../../shared/shift-time';
import { StationSettingsRow } from '../stations/model';
import { settingsForStation } from '../stations/settings';
import { CrewSwap } from './model';

export type CrewRotation = { anchorShiftStart: string; crewIds: number[] };

/** Index of the shift starting at `shiftStart`, counted from the anchor (negative before it). */
export function shiftIndex(anchor: Date, shiftStart: Date, changesPerDay: number): number {
  // Rounding absorbs the hour a clock change adds to or takes from one shift.
  return Math.round((shiftStart.getTime() - anchor.getTime()) / (86_400_000 / changesPerDay));
}

export async function crewOnShift(stationId: number, shiftStart: Date): Promise<number | null> {
  const swap = await CrewSwap.findOne({ where: { stationId, shiftStart } });
  if (swap) return swap.crewId;
  const row = await StationSettingsRow.findByPk(stationId);
  const rotation: CrewRotation | null | undefined = row?.crewRotation;
  if (!rotation || rotation.crewIds.length === 0) return null;
  const settings = await settingsForStation(stationId);
  const index = shiftIndex(new Date(rotation.anchorShiftStart), shiftStart, settings.shiftChangeTimes.length);
  const n = rotation.crewIds.length;
  return rotation.crewIds[((index % n) + n) % n]!;
}

/** The shift in progress at `at`, the one after it, and the crews of both. */
export async function shiftChangeAt(stationId: number, at = new Date()) {
  const settings = await settingsForStation(stationId);
  const current = shiftStartFor(at, settings.timeZone, settings.shiftChangeTimes);
  const next = nextShiftStart(current, settings.timeZone, settings.shiftChangeTimes);
  const [outgoingCrewId, incomingCrewId] = await Promise.all([crewOnShift(stationId, current), crewOnShift(stationId, next)]);
  return { settings, shiftStart: current, handoverAt: next, outgoingCrewId, incomingCrewId };
}
