import { describe, expect, it } from 'vitest';
import { evaluateReadingSet, type ReadingSetSi } from '../../shared/calc/evaluate';
import { startingLimits } from '../../shared/calc/limits';
import { designSteamFlowKgS, plausibleRangeSi, startingPlausibleRanges, type PlausibleRanges } from '../../shared/calc/plausibility';
import { describeImplausible } from '../../shared/plausibility-display';
import type { ReadingSetInput } from '../../shared/schemas/reading-set';
import { handBuiltDesign as design } from '../fixtures/hand-built-design';

const C = (celsius: number) => celsius + 273.15;
// The hand-built design point (tests/fixtures/hand-built-design.ts): 8 kPa a, 22 °C in, 560 MW on 15 000 kg/s.
const rise = 560e6 / (15_000 * 4180);
const designReading: ReadingSetSi = { pressurePa: 8000, hotwellK: C(41.3), cwInletK: C(22), cwOutletK: C(22) + rise, cwFlowKgS: 15_000 };
const evaluate = (reading: Partial<ReadingSetSi>, ranges: PlausibleRanges = startingPlausibleRanges) =>
  evaluateReadingSet({ ...designReading, ...reading }, design, startingLimits, ranges);

/** Checks that rest on the CW flow, directly or through the duty. */
const builtOnFlow = ['duty', 'overallU', 'tubeVelocity', 'cleanU', 'cleanlinessFactor', 'expectedBackpressure', 'backpressureDeviation', 'deviationCostPower', 'deviationCostMoney'] as const;

describe('starting plausible ranges', () => {
  it('are the trade primer’s list (common practice, no source), flows as a share of design', () => {
    // TRADE.md, "Plausible ranges": 2–25 kPa a, hotwell 15–65 °C, CW inlet 0–40 °C, rise 3–20 K,
    // TTD 1–15 K, CW flow 20–130 % of design, tube velocity 0.9–3 m/s, cleanliness 0.3–1.1.
    expect(startingPlausibleRanges.backpressure).toEqual({ low: 2000, high: 25_000 });
    expect(startingPlausibleRanges.hotwellTemperature).toEqual({ low: C(15), high: C(65) });
    expect(startingPlausibleRanges.cwInletTemperature).toEqual({ low: C(0), high: C(40) });
    expect(startingPlausibleRanges.cwRise).toEqual({ low: 3, high: 20 });
    expect(startingPlausibleRanges.ttd).toEqual({ low: 1, high: 15 });
    expect(startingPlausibleRanges.tubeVelocity).toEqual({ low: 0.9, high: 3 });
    expect(startingPlausibleRanges.cleanlinessFactor).toEqual({ low: 0.3, high: 1.1 });
    const flow = plausibleRangeSi('cwFlow', startingPlausibleRanges, design);
    expect(flow.low).toBeCloseTo(0.2 * 15_000, 9);
    expect(flow.high).toBeCloseTo(1.3 * 15_000, 9);
    // HEI convention: 950 Btu/lb = 2209.7 kJ/kg of exhaust steam; 560 MW / 2209.7 kJ/kg = 253.4 kg/s.
    expect(designSteamFlowKgS(design)).toBeCloseTo(253.4, 1);
  });

  it('find nothing to question at the design point', () => {
    const { implausible, checks } = evaluate({});
    expect(implausible).toEqual([]);
    expect(checks.cleanlinessFactor.value!).toBeCloseTo(0.9, 2);
    expect(checks.cleanlinessFactor.outsidePlausible).toBeUndefined();
  });
});

describe('a reading outside its plausible range', () => {
  it('marks the CW flow and withholds every check built on it instead of judging it normal', () => {
    const { implausible, checks } = evaluate({ cwFlowKgS: 1.5 * 15_000 });
    expect(implausible.map((i) => i.key)).toEqual(['cwFlow']);
    expect(checks.cwFlow.value).toBe(22_500);
    expect(checks.cwFlow.outsidePlausible).toEqual({ low: 3000, high: 19_500 });
    for (const key of builtOnFlow) {
      expect(checks[key], key).toMatchObject({ value: null, status: 'unknown', reason: 'not computed: CW flow is outside the plausible range for this unit' });
    }
    // What does not rest on the flow is still computed and judged.
    expect(checks.ttd.value!).toBeCloseTo(10.58, 1);
    expect(checks.subcooling.status).toBe('normal');
    expect(checks.cwRise.value!).toBeCloseTo(rise, 9);
  });

  it('uses the unit’s own ranges: a wider CW flow range makes the same reading plausible', () => {
    // The same 560 MW on 1.5 × the flow: the rise falls to two thirds.
    const sameDuty = { cwFlowKgS: 1.5 * 15_000, cwOutletK: C(22) + rise / 1.5 };
    expect(evaluate(sameDuty).implausible.map((i) => i.key)).toEqual(['cwFlow']);
    const wider = { ...startingPlausibleRanges, cwFlow: { low: 0.2, high: 1.6 } };
    const { implausible, checks } = evaluate(sameDuty, wider);
    expect(implausible).toEqual([]);
    expect(checks.duty.value).not.toBeNull();
  });

  it('withholds the steam-side duty and what follows when the exhaust steam flow is implausible', () => {
    const { implausible, checks } = evaluate({ cwFlowKgS: null, steamFlowKgS: 3 * designSteamFlowKgS(design) });
    expect(implausible.map((i) => i.key)).toEqual(['steamFlow']);
    expect(checks.duty).toMatchObject({ value: null, reason: 'not computed: Exhaust steam flow is outside the plausible range for this unit' });
    expect(checks.tubeVelocity.reason).toMatch(/Exhaust steam flow is outside/);
  });

  it('keeps an implausible pressure judged against its limits, and withholds what is computed from it', () => {
    // 30 kPa a is above the 25 kPa a plausible range and the 16 kPa a starting alarm limit.
    const { checks } = evaluate({ pressurePa: 30_000 });
    expect(checks.backpressure).toMatchObject({ value: 30_000, status: 'alarm', outsidePlausible: { low: 2000, high: 25_000 } });
    for (const key of ['saturationTemperature', 'subcooling', 'ttd', 'itd', 'lmtd', 'overallU', 'cleanlinessFactor', 'backpressureDeviation'] as const) {
      expect(checks[key], key).toMatchObject({ value: null, status: 'unknown', reason: 'not computed: Condenser absolute pressure is outside the plausible range for this unit' });
    }
    expect(checks.cwRise.value).not.toBeNull();
  });

  it('questions a check computed from plausible readings that is itself implausible, and what rests on it', () => {
    // Outlet 0.5 K below Tsat(8 kPa) = 41.51 °C (IAPWS-IF97): TTD 0.5 K is below the 1 K range.
    const { implausible, checks } = evaluate({ cwOutletK: C(41.01) });
    expect(implausible.map((i) => i.key)).toContain('ttd');
    expect(checks.ttd.value!).toBeCloseTo(0.5, 1);
    expect(checks.ttd.outsidePlausible).toEqual({ low: 1, high: 15 });
    expect(checks.lmtd).toMatchObject({ value: null, reason: 'not computed: TTD is outside the plausible range for this unit' });
    expect(checks.cleanlinessFactor.value).toBeNull();
  });

  it('withholds the water-chemistry indices for an implausible pH', () => {
    const chemistry = { pH: 4.5, temperatureK: C(30), totalDissolvedSolids: 1200, calciumHardness: 400, totalAlkalinity: 150 };
    const { implausible, checks } = evaluate({ chemistry });
    expect(implausible.map((i) => i.key)).toEqual(['pH']);
    expect(checks.langelier).toMatchObject({ value: null, reason: 'not computed: pH is outside the plausible range for this unit' });
    expect(evaluate({ chemistry: { ...chemistry, pH: 8.2 } }).checks.langelier.value).not.toBeNull();
  });
});

describe('the probe’s CW flow of 1e9 m³/h', () => {
  // 1e9 m³/h at 22 °C (ρ = 997.77 kg/m³, Kell 1975) = 2.77e8 kg/s. The contract refuses it as
  // physically impossible; the engine on its own must still never call what follows from it normal.
  const probe = { cwFlowKgS: (1e9 / 3600) * 997.77 };

  it('is withheld, not judged normal, under the starting ranges', () => {
    const { checks } = evaluate(probe);
    for (const key of builtOnFlow) expect(checks[key].status, key).toBe('unknown');
  });

  it('leaves no SI figure in a reason even when a unit’s ranges let it through', () => {
    const { checks } = evaluate(probe, { ...startingPlausibleRanges, cwFlow: { low: 0, high: 1e6 }, tubeVelocity: { low: 0, high: 1e6 }, cleanlinessFactor: { low: 0, high: 1e6 } });
    // NTU → 0, so Tsat = T_in + rise / (1 − e^−NTU) runs far past the critical point (647.096 K, IAPWS).
    expect(checks.expectedBackpressure.value).toBeNull();
    expect(checks.expectedBackpressure.reason).toBe('not computed: the readings put the expected saturation temperature outside the range this calculation covers');
    for (const check of Object.values(checks)) expect(check.reason ?? '', check.key).not.toMatch(/\d K\b|valid range/);
  });
});

describe('what the operator reads about it', () => {
  const raw = (patch: Partial<ReadingSetInput> = {}) =>
    ({
      pressure: { value: 8, unit: 'kPa_a' },
      hotwellTemperature: { value: 41.3, unit: 'degC' },
      cwInletTemperature: { value: 22, unit: 'degC' },
      cwOutletTemperature: { value: 31, unit: 'degC' },
      cwFlow: { value: 90_000, unit: 'm3_h' },
      ...patch,
    }) as ReadingSetInput;

  it('names the CW flow in the unit typed and as a share of design', () => {
    // Design 15 000 kg/s at 22 °C: ρ = 997.77 kg/m³ (Kell 1975) → 54 120 m³/h; 20 % and 130 % of it
    // are 10 824 and 70 357 m³/h (shown to four figures).
    const flowKgS = (90_000 / 3600) * 997.77;
    const { implausible } = evaluate({ cwFlowKgS: flowKgS });
    const [notice] = describeImplausible(implausible, raw(), C(22), design);
    expect(notice).toEqual({
      key: 'cwFlow',
      field: 'cwFlow.value',
      message: 'CW flow 90,000 m³/h is outside the plausible range for this unit (10,820–70,360 m³/h, 20–130 % of design flow). Check the instrument and the reading.',
    });
  });

  it('uses the round’s temperature unit: 15–65 °C is 59–149 °F', () => {
    // °F = °C × 9/5 + 32: 15 °C = 59 °F, 65 °C = 149 °F; 150 °F = 65.56 °C.
    const { implausible } = evaluate({ hotwellK: C(((150 - 32) * 5) / 9), pressurePa: 30_000 }, { ...startingPlausibleRanges, backpressure: { low: 2000, high: 40_000 } });
    const notices = describeImplausible(implausible, raw({ hotwellTemperature: { value: 150, unit: 'degF' } }), C(22), design);
    expect(notices.find((n) => n.key === 'hotwellTemperature')!.message).toMatch(/^Hotwell temperature 150 °F is outside the plausible range for this unit \(59–149 °F\)/);
  });
});
