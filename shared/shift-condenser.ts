// The condenser's state over one shift, from the rounds taken in it: what the outgoing crew hands
// over beside its notes. Pure: the server reads the rounds and calls this; the handover freezes the
// result at submit. Values stay SI; the client converts them for display.
import { checkCatalog, siUnitOf, type CheckKey, type Quantity } from './calc/check-catalog';
import type { Status } from './calc/limits';
import { integrateRate, joulesToMwh } from './calc/shift-energy';

/** The checks carried over a shift, in the order shown. */
export const shiftCondenserChecks = [
  'backpressure',
  'expectedBackpressure',
  'backpressureDeviation',
  'saturationTemperature',
  'subcooling',
  'ttd',
  'itd',
  'cwRise',
  'cleanlinessFactor',
  'deviationCostPower',
  'deviationCostMoney',
  'towerApproach',
] as const satisfies readonly CheckKey[];
export type ShiftCheckKey = (typeof shiftCondenserChecks)[number];

/** At most this many points per trend line; min and max still come from every round. */
export const SERIES_POINTS = 24;

export const START_RULE =
  'Start of shift: each check’s last value from a round taken in the previous shift up to and including the shift change; without one, its first value in this shift.';
export const ENERGY_RULE =
  'Energy lost: trapezoid between consecutive rounds that both have the output lost, the last round’s value held until the end of the window, nothing before the first round of the shift; a round without the value breaks the line on both sides of it.';

/** One round's current values (amended where amended) as judged when it was taken. */
export type RoundValues = { readingSetId: number; takenAt: number; values: Partial<Record<CheckKey, { value: number; status: Status }>> };

export type ShiftPoint = { t: string; value: number; status: Status };

export type ShiftCheckState = {
  key: ShiftCheckKey;
  label: string;
  quantity: Quantity;
  /** SI unit of every value below */
  unit: string;
  latest: { value: number | null; status: Status; takenAt: string | null; reason?: string };
  start: (ShiftPoint & { basis: 'previous_shift' | 'first_in_shift' }) | null;
  min: ShiftPoint | null;
  max: ShiftPoint | null;
  /** In-shift values, oldest first, thinned to SERIES_POINTS */
  series: ShiftPoint[];
};

export type ShiftEnergyLost = {
  /** MWh, signed (negative = better than expected); null when no round in the shift has it */
  megawattHours: number | null;
  /** money in `currency`, signed; null without an energy price or without rounds */
  money: number | null;
  currency: string | null;
  hoursCovered: number;
  hoursElapsed: number;
  reason?: string;
};

export type ShiftCondenserState = {
  unitId: number;
  timeZone: string;
  shiftStart: string;
  /** End of the window: now for the shift in progress, the shift's end for a past one */
  until: string;
  shiftEnd: string;
  roundsInShift: number;
  latestRound: { id: number; takenAt: string } | null;
  checks: ShiftCheckState[];
  energyLost: ShiftEnergyLost;
  rules: { start: string; energy: string };
};

/** What a handover stores at submit: the state as the outgoing crew saw it then. */
export type CondenserSnapshot = { version: 1; frozenAt: string; state: ShiftCondenserState };

export type ShiftCondenserInput = {
  unitId: number;
  timeZone: string;
  shiftStart: Date;
  shiftEnd: Date;
  until: Date;
  /** Rounds from the previous shift's start up to `until`, any order */
  rounds: readonly RoundValues[];
  /** Why each check of the latest round in the shift is absent, from its evaluation */
  latestReasons: Partial<Record<CheckKey, string>>;
  currency: string | null;
};

const iso = (ms: number) => new Date(ms).toISOString();
const point = (r: RoundValues, key: CheckKey): ShiftPoint | null => {
  const v = r.values[key];
  return v && Number.isFinite(v.value) ? { t: iso(r.takenAt), value: v.value, status: v.status } : null;
};

/** Keeps the first and last point and spreads the rest evenly. */
export function thin<T>(points: readonly T[], max: number): T[] {
  if (points.length <= max) return [...points];
  const picked: T[] = [];
  for (let i = 0; i < max; i++) picked.push(points[Math.round((i * (points.length - 1)) / (max - 1))]!);
  return picked;
}

export function shiftCondenserState(input: ShiftCondenserInput): ShiftCondenserState {
  const from = input.shiftStart.getTime();
  const until = input.until.getTime();
  const ordered = [...input.rounds].sort((a, b) => a.takenAt - b.takenAt || a.readingSetId - b.readingSetId);
  const before = ordered.filter((r) => r.takenAt <= from);
  // A round taken exactly at the change opens this shift as well as closing the last one.
  const inShift = ordered.filter((r) => r.takenAt >= from && r.takenAt <= until);
  const latest = inShift.at(-1) ?? null;

  const checks = shiftCondenserChecks.map((key): ShiftCheckState => {
    const { label, quantity } = checkCatalog[key];
    const points = inShift.map((r) => point(r, key)).filter((p): p is ShiftPoint => p !== null);
    const latestPoint = latest ? point(latest, key) : null;
    const previous = before.map((r) => point(r, key)).filter((p): p is ShiftPoint => p !== null).at(-1);
    const start = previous ? { ...previous, basis: 'previous_shift' as const } : points[0] ? { ...points[0], basis: 'first_in_shift' as const } : null;
    let min: ShiftPoint | null = null;
    let max: ShiftPoint | null = null;
    for (const p of points) {
      if (!min || p.value < min.value) min = p;
      if (!max || p.value > max.value) max = p;
    }
    const reason = latest ? (latestPoint ? undefined : (input.latestReasons[key] ?? 'not computed for the latest round')) : 'no round in this shift yet';
    return {
      key,
      label,
      quantity,
      unit: siUnitOf[quantity],
      latest: latestPoint ? { value: latestPoint.value, status: latestPoint.status, takenAt: latestPoint.t } : { value: null, status: 'unknown', takenAt: latest ? iso(latest.takenAt) : null, ...(reason ? { reason } : {}) },
      start,
      min,
      max,
      series: thin(points, SERIES_POINTS),
    };
  });

  return {
    unitId: input.unitId,
    timeZone: input.timeZone,
    shiftStart: iso(from),
    until: iso(until),
    shiftEnd: input.shiftEnd.toISOString(),
    roundsInShift: inShift.length,
    latestRound: latest ? { id: latest.readingSetId, takenAt: iso(latest.takenAt) } : null,
    checks,
    energyLost: energyLost(inShift, from, until, input),
    rules: { start: START_RULE, energy: ENERGY_RULE },
  };
}

function energyLost(inShift: readonly RoundValues[], from: number, until: number, input: ShiftCondenserInput): ShiftEnergyLost {
  const hoursElapsed = (until - from) / 3_600_000;
  const power = integrateRate(inShift.map((r) => ({ t: r.takenAt, rate: r.values.deviationCostPower?.value ?? null })), from, until);
  // Money rates are per hour: divide the rate·seconds by 3600 to get money.
  const money = integrateRate(inShift.map((r) => ({ t: r.takenAt, rate: r.values.deviationCostMoney?.value ?? null })), from, until);
  const base = { currency: input.currency, hoursCovered: power.coveredSeconds / 3600, hoursElapsed };
  if (!inShift.length) return { ...base, megawattHours: null, money: null, reason: 'no round in this shift yet' };
  if (!power.samplesUsed) {
    return { ...base, megawattHours: null, money: null, reason: input.latestReasons.deviationCostPower ?? 'the output lost was not computed for any round in this shift' };
  }
  const result: ShiftEnergyLost = { ...base, megawattHours: joulesToMwh(power.total), money: money.samplesUsed ? money.total / 3600 : null };
  if (!money.samplesUsed) result.reason = input.latestReasons.deviationCostMoney ?? 'no money rate in this shift’s rounds';
  return result;
}
