import { describe, expect, it } from 'vitest';
import { integrateRate, joulesToMwh } from '../../shared/calc/shift-energy';
import { shiftCondenserState, thin, type RoundValues, type ShiftCondenserInput } from '../../shared/shift-condenser';

const at = (hhmm: string) => Date.parse(`2026-03-10T${hhmm}:00Z`);
const MW = 1e6;

// Four rounds in a 06:00–18:00 shift and one from the shift before, looked at 12:30.
// Output lost (MW): 07:00 → 2, 09:00 → 4, 10:00 → not computed, 11:00 → 3; 05:30 → 10 (previous shift).
// Price 80 EUR/MWh, so the money rates are 160, 320, —, 240 EUR/h.
const round = (id: number, hhmm: string, v: { bp: number; mw: number | null; approach?: number }): RoundValues => ({
  readingSetId: id,
  takenAt: at(hhmm),
  values: {
    backpressure: { value: v.bp, status: v.bp >= 9000 ? 'watch' : 'normal' },
    ...(v.mw === null ? {} : { deviationCostPower: { value: v.mw * MW, status: 'normal' as const }, deviationCostMoney: { value: v.mw * 80, status: 'normal' as const } }),
    ...(v.approach === undefined ? {} : { towerApproach: { value: v.approach, status: 'normal' as const } }),
  },
});
const rounds = [
  round(1, '05:30', { bp: 7000, mw: 10, approach: 5 }),
  round(2, '07:00', { bp: 7500, mw: 2, approach: 6 }),
  round(3, '09:00', { bp: 9000, mw: 4 }),
  round(4, '10:00', { bp: 8200, mw: null }),
  round(5, '11:00', { bp: 8800, mw: 3 }),
];
const input: ShiftCondenserInput = {
  unitId: 7,
  timeZone: 'Europe/Berlin',
  shiftStart: new Date(at('06:00')),
  shiftEnd: new Date(at('18:00')),
  until: new Date(at('12:30')),
  rounds: [...rounds].reverse(),
  latestReasons: { towerApproach: 'needs the basin (cold-water) temperature' },
  currency: 'EUR',
};

describe('integrateRate (trapezoid between rounds, last value held, nothing before the first)', () => {
  it('matches the hand calculation', () => {
    // Trapezoid rule (any numerical-methods text; from memory), 1 MWh = 3.6 × 10⁹ J (SI, exact):
    //   07:00–09:00  (2 + 4)/2 MW × 2 h   = 6.0 MWh
    //   09:00–11:00  broken by the 10:00 round without a value = 0
    //   11:00–12:30  3 MW held × 1.5 h    = 4.5 MWh
    //   06:00–07:00  before the first round = 0
    //   total 10.5 MWh over 3.5 h covered
    const samples = rounds.slice(1).map((r) => ({ t: r.takenAt, rate: r.values.deviationCostPower ? r.values.deviationCostPower.value : null }));
    const result = integrateRate(samples, at('06:00'), at('12:30'));
    expect(joulesToMwh(result.total)).toBeCloseTo(10.5, 9);
    expect(result.coveredSeconds / 3600).toBeCloseTo(3.5, 9);
    expect(result.samplesUsed).toBe(3);
  });

  it('ignores samples outside the window and refuses a window that ends before it starts', () => {
    // 05:30 is before the shift and 13:00 after `until`: only the 07:00 value, held 07:00–08:00 = 5 MW × 1 h.
    const result = integrateRate([{ t: at('05:30'), rate: 99 * MW }, { t: at('07:00'), rate: 5 * MW }, { t: at('13:00'), rate: 99 * MW }], at('06:00'), at('08:00'));
    expect(joulesToMwh(result.total)).toBeCloseTo(5, 9);
    expect(() => integrateRate([], at('08:00'), at('06:00'))).toThrow(/until/);
    expect(integrateRate([], at('06:00'), at('08:00'))).toEqual({ total: 0, coveredSeconds: 0, samplesUsed: 0 });
  });
});

describe('shiftCondenserState', () => {
  const state = shiftCondenserState(input);
  const check = (key: string) => state.checks.find((c) => c.key === key)!;

  it('takes the start value from the previous shift, min/max from the shift, latest from its last round', () => {
    const bp = check('backpressure');
    expect(bp.unit).toBe('Pa');
    expect(bp.start).toEqual({ t: '2026-03-10T05:30:00.000Z', value: 7000, status: 'normal', basis: 'previous_shift' });
    expect(bp.min).toEqual({ t: '2026-03-10T07:00:00.000Z', value: 7500, status: 'normal' });
    expect(bp.max).toEqual({ t: '2026-03-10T09:00:00.000Z', value: 9000, status: 'watch' });
    expect(bp.latest).toEqual({ value: 8800, status: 'normal', takenAt: '2026-03-10T11:00:00.000Z' });
    expect(bp.series.map((p) => p.value)).toEqual([7500, 9000, 8200, 8800]);
    expect(state.roundsInShift).toBe(4);
    expect(state.latestRound).toEqual({ id: 5, takenAt: '2026-03-10T11:00:00.000Z' });
  });

  it('falls back to the first value in the shift without one from the previous shift', () => {
    const withoutPrevious = shiftCondenserState({ ...input, rounds: rounds.slice(1) });
    expect(withoutPrevious.checks.find((c) => c.key === 'backpressure')!.start).toMatchObject({ value: 7500, basis: 'first_in_shift' });
  });

  it('integrates output and money lost over the shift as the hand calculation says', () => {
    // 10.5 MWh (above) × 80 EUR/MWh = 840 EUR; the 05:30 round (10 MW) is not in the shift.
    expect(state.energyLost.megawattHours).toBeCloseTo(10.5, 9);
    expect(state.energyLost.money).toBeCloseTo(840, 6);
    expect(state.energyLost).toMatchObject({ currency: 'EUR' });
    expect(state.energyLost.hoursCovered).toBeCloseTo(3.5, 9);
    expect(state.energyLost.hoursElapsed).toBeCloseTo(6.5, 9);
  });

  it('keeps an absent check absent with its reason, and nothing is NaN', () => {
    const approach = check('towerApproach');
    expect(approach.latest).toEqual({ value: null, status: 'unknown', takenAt: '2026-03-10T11:00:00.000Z', reason: 'needs the basin (cold-water) temperature' });
    expect(approach.series.map((p) => p.value)).toEqual([6]);
    expect(check('ttd').latest.reason).toBe('not computed for the latest round');
    expect(check('ttd').min).toBeNull();
    const numbers: number[] = [];
    JSON.stringify(state, (_k, v: unknown) => (typeof v === 'number' && numbers.push(v), v));
    expect(numbers.length).toBeGreaterThan(10);
    expect(numbers.every(Number.isFinite)).toBe(true);
  });

  it('says so when no round was taken in the shift yet', () => {
    const empty = shiftCondenserState({ ...input, rounds: rounds.slice(0, 1), latestReasons: {} });
    expect(empty.latestRound).toBeNull();
    expect(empty.checks.every((c) => c.latest.value === null && c.latest.reason === 'no round in this shift yet')).toBe(true);
    expect(empty.energyLost).toMatchObject({ megawattHours: null, money: null, reason: 'no round in this shift yet' });
    // The previous shift's value is still the start value.
    expect(empty.checks.find((c) => c.key === 'backpressure')!.start).toMatchObject({ value: 7000 });
  });

  it('gives the money as absent with the reason when the unit has no energy price', () => {
    const noPrice = rounds.map((r) => ({ ...r, values: { ...r.values, deviationCostMoney: undefined } }));
    const result = shiftCondenserState({ ...input, rounds: noPrice, latestReasons: { deviationCostMoney: 'no energy price in the unit’s design data' } });
    expect(result.energyLost.megawattHours).toBeCloseTo(10.5, 9);
    expect(result.energyLost.money).toBeNull();
    expect(result.energyLost.reason).toMatch(/no energy price/);
  });
});

describe('thin', () => {
  it('keeps the first and last point and at most the asked number', () => {
    const many = Array.from({ length: 100 }, (_, i) => i);
    const kept = thin(many, 48);
    expect(kept).toHaveLength(48);
    expect(kept[0]).toBe(0);
    expect(kept.at(-1)).toBe(99);
    expect(thin([1, 2, 3], 48)).toEqual([1, 2, 3]);
  });
});
