import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { evaluateReadingSet, type CondenserDesignSi, type ReadingSetSi } from '../../shared/calc/evaluate';
import { startingLimits } from '../../shared/calc/limits';
import { widestPlausibleRanges } from '../fixtures/widest-plausible-ranges';
import { handBuiltDesign } from '../fixtures/hand-built-design';

const C = (celsius: number) => celsius + 273.15;

const design: CondenserDesignSi = handBuiltDesign;
const rise = 560e6 / (15_000 * 4180);
const designReading: ReadingSetSi = { pressurePa: 8000, hotwellK: C(41.3), cwInletK: C(22), cwOutletK: C(22) + rise, cwFlowKgS: 15_000 };

describe('evaluateReadingSet', () => {
  it('at design conditions: expected = design backpressure within 1 %, cleanliness ≈ design, no cost', () => {
    const { checks } = evaluateReadingSet(designReading, design, startingLimits, widestPlausibleRanges);
    expect(Math.abs(checks.expectedBackpressure.value! - 8000) / 8000).toBeLessThan(0.01);
    expect(checks.cleanlinessFactor.value!).toBeCloseTo(0.9, 2);
    expect(Math.abs(checks.deviationCostPower.value!)).toBeLessThan(0.05e6);
    expect(checks.cleanU.reason).toMatch(/data-sheet/);
    expect(checks.duty.reason).toMatch(/CW side/);
  });

  it('gives every result its SI unit and a status', () => {
    const { checks } = evaluateReadingSet(designReading, design, startingLimits, widestPlausibleRanges);
    expect(checks.backpressure).toMatchObject({ unit: 'Pa', status: 'normal' });
    expect(checks.saturationTemperature.unit).toBe('K');
    expect(checks.duty.unit).toBe('W');
    expect(checks.overallU.unit).toBe('W/(m²·K)');
  });

  it('flags a fouled condenser and hints at fouling, as a possibility', () => {
    // Same duty and water, but 11 kPa a: TTD and deviation rise while the CW rise is unchanged.
    const { checks, hints } = evaluateReadingSet({ ...designReading, pressurePa: 11_000 }, design, startingLimits, widestPlausibleRanges);
    expect(checks.ttd.status).not.toBe('normal');
    expect(checks.backpressureDeviation.status).toBe('alarm');
    expect(checks.deviationCostPower.value!).toBeGreaterThan(0);
    expect(hints.map((h) => h.id)).toContain('fouling-or-air-binding');
    expect(hints.every((h) => /common practice/i.test(h.basis))).toBe(true);
  });

  it('hints at air in-leakage when subcooling and dissolved oxygen are both high', () => {
    const { hints } = evaluateReadingSet({ ...designReading, hotwellK: C(37), dissolvedOxygenPpb: 55 }, design, startingLimits, widestPlausibleRanges);
    expect(hints.map((h) => h.id)).toContain('air-in-leakage');
  });

  it('hints at low CW flow when the rise is high', () => {
    const { hints } = evaluateReadingSet({ ...designReading, cwOutletK: C(35), cwFlowKgS: 10_000 }, design, startingLimits, widestPlausibleRanges);
    expect(hints.map((h) => h.id)).toContain('low-cw-flow');
  });

  it('uses the steam side when CW flow is missing, and says so', () => {
    const { checks } = evaluateReadingSet({ ...designReading, cwFlowKgS: null, steamFlowKgS: 253 }, design, startingLimits, widestPlausibleRanges);
    expect(checks.duty.reason).toMatch(/steam side/);
    expect(checks.duty.value).toBeGreaterThan(0);
  });

  it('leaves dependent results absent, with the reason, when an optional input is missing', () => {
    const { checks } = evaluateReadingSet({ ...designReading, cwFlowKgS: null }, design, startingLimits, widestPlausibleRanges);
    expect(checks.duty.value).toBeNull();
    expect(checks.duty.reason).toMatch(/CW flow/);
    expect(checks.overallU).toMatchObject({ value: null, status: 'unknown', reason: 'needs the duty' });
    expect(checks.towerApproach.reason).toMatch(/basin/);
    expect(checks.langelier.reason).toMatch(/no water chemistry/);
    expect(checks.ttd.value).not.toBeNull();
  });

  it('computes the tower and chemistry checks when their readings are given', () => {
    const { checks } = evaluateReadingSet(
      {
        ...designReading,
        tower: { coldWaterK: C(22), dryBulbK: C(28), relativeHumidity: 0.5, stationPressurePa: 100_000, makeupConductivity: 0.04, towerConductivity: 0.2, targetCycles: 5 },
        chemistry: { pH: 8.2, temperatureK: C(30), totalDissolvedSolids: 1200, calciumHardness: 400, totalAlkalinity: 150 },
      },
      design,
      startingLimits,
      widestPlausibleRanges,
    );
    expect(checks.wetBulb.value! - 273.15).toBeGreaterThan(19);
    expect(checks.towerRange.value).toBeCloseTo(rise, 6);
    expect(checks.cycles.value).toBeCloseTo(5, 10);
    expect(checks.makeupNeeded.value!).toBeGreaterThan(checks.blowdownNeeded.value!);
    expect(checks.langelier.value).not.toBeNull();
  });

  it('reports an impossible reading as an absent check with the reason, not NaN', () => {
    const { checks } = evaluateReadingSet({ ...designReading, cwOutletK: C(45) }, design, startingLimits, widestPlausibleRanges);
    expect(checks.ttd.value!).toBeLessThan(0);
    expect(checks.lmtd).toMatchObject({ value: null, status: 'unknown' });
    expect(checks.lmtd.reason).toMatch(/TTD/);
  });

  it('never returns NaN or Infinity for any valid reading set (property test)', () => {
    fc.assert(
      fc.property(
        fc.record({
          pressurePa: fc.double({ min: 1000, max: 30_000, noNaN: true }),
          hotwellC: fc.double({ min: 5, max: 70, noNaN: true }),
          inletC: fc.double({ min: 1, max: 40, noNaN: true }),
          riseK: fc.double({ min: 0.5, max: 20, noNaN: true }),
          flow: fc.option(fc.double({ min: 100, max: 40_000, noNaN: true })),
          dryC: fc.double({ min: -20, max: 45, noNaN: true }),
          rh: fc.double({ min: 0, max: 1, noNaN: true }),
        }),
        (r) => {
          const { checks } = evaluateReadingSet(
            {
              pressurePa: r.pressurePa,
              hotwellK: C(r.hotwellC),
              cwInletK: C(r.inletC),
              cwOutletK: C(r.inletC + r.riseK),
              cwFlowKgS: r.flow,
              tower: { coldWaterK: C(r.inletC), dryBulbK: C(r.dryC), relativeHumidity: r.rh },
            },
            design,
            startingLimits,
            widestPlausibleRanges,
          );
          return Object.values(checks).every((c) => c.value === null || Number.isFinite(c.value));
        },
      ),
      { numRuns: 500 },
    );
  });
});
