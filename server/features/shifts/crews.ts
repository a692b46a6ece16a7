// Which crew works a shift: the station's rotation (crews in order, one shift each, counted from an
// anchor shift), unless a one-off swap says otherwise.
import { Op, type Transaction } from 'sequelize';
import { nextShiftStart, shiftStartFor } from '../../../shared/shift-time';
import { stationShiftSetup } from '../stations/index';
import { referenceRead } from '../../lib/reference-cache';
import { CrewSwap } from './model';

export type CrewRotation = { anchorShiftStart: string; crewIds: number[] };

/** Index of the shift starting at `shiftStart`, counted from the anchor (negative before it). */
export function shiftIndex(anchor: Date, shiftStart: Date, changesPerDay: number): number {
  // Rounding absorbs the hour a clock change adds to or takes from one shift.
  return Math.round((shiftStart.getTime() - anchor.getTime()) / (86_400_000 / changesPerDay));
}

/** The crew of the shift starting at `shiftStart`, from a swap or the rotation (null without one). */
export async function crewOnShift(stationId: number, shiftStart: Date, rotation: CrewRotation | null, changesPerDay: number): Promise<number | null> {
  const swapped = await referenceRead(`swap:${stationId}:${shiftStart.getTime()}`, async () => (await CrewSwap.findOne({ where: { stationId, shiftStart } }))?.crewId ?? null);
  if (swapped !== null) return swapped;
  return crewFromRotation(rotation, shiftStart, changesPerDay);
}

/** The crew the rotation alone puts on the shift starting at `shiftStart` (swaps not considered). */
export function crewFromRotation(rotation: CrewRotation | null, shiftStart: Date, changesPerDay: number): number | null {
  if (!rotation || rotation.crewIds.length === 0) return null;
  const index = shiftIndex(new Date(rotation.anchorShiftStart), shiftStart, changesPerDay);
  const n = rotation.crewIds.length;
  return rotation.crewIds[((index % n) + n) % n]!;
}

/** The shift in progress at `at`, the one after it, and the crews of both. Reads the settings once. */
export async function shiftChangeAt(stationId: number, at = new Date()) {
  const { settings, rotation } = await stationShiftSetup(stationId);
  const current = shiftStartFor(at, settings.timeZone, settings.shiftChangeTimes);
  const next = nextShiftStart(current, settings.timeZone, settings.shiftChangeTimes);
  const perDay = settings.shiftChangeTimes.length;
  const [outgoingCrewId, incomingCrewId] = await Promise.all([crewOnShift(stationId, current, rotation, perDay), crewOnShift(stationId, next, rotation, perDay)]);
  return { settings, shiftStart: current, handoverAt: next, outgoingCrewId, incomingCrewId };
}

/** Every one-off swap at a station (rebuilding the search index puts each shift on its crew). */
export function swapsOfStation(stationId: number, transaction?: Transaction) {
  return referenceRead(`swaps-of-station:${stationId}`, () => CrewSwap.findAll({ where: { stationId }, transaction }), transaction);
}

export type ShiftAsked = { stationId: number; shiftStart: Date; rotation: CrewRotation | null; changesPerDay: number };

/** The crew of each shift asked for (swaps first, then the rotation), with one read of the swaps for all of them. */
export async function crewsOnShifts(shifts: ShiftAsked[]): Promise<(number | null)[]> {
  const key = `swaps:${shifts.map((s) => `${s.stationId}@${s.shiftStart.getTime()}`).join(',')}`;
  const swaps = shifts.length
    ? await referenceRead(key, async () =>
        (await CrewSwap.findAll({ where: { [Op.or]: shifts.map((s) => ({ stationId: s.stationId, shiftStart: s.shiftStart })) } })).map((w) => ({ stationId: w.stationId, shiftStart: w.shiftStart, crewId: w.crewId })),
      )
    : [];
  return shifts.map(
    (s) => swaps.find((w) => w.stationId === s.stationId && w.shiftStart.getTime() === s.shiftStart.getTime())?.crewId ?? crewFromRotation(s.rotation, s.shiftStart, s.changesPerDay),
  );
}
