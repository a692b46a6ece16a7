import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import psychrolib from 'psychrolib';
import { humidityRatio, humidityRatioForWetBulb, saturationVapourPressure, wetBulbTemperature } from '../../shared/calc/psychrometrics';

psychrolib.SetUnitSystem(psychrolib.SI);

describe('wet-bulb temperature', () => {
  it('agrees with psychrolib over a grid of dry bulb, RH and station pressure', () => {
    // Reference: the npm package psychrolib (ASHRAE Fundamentals ch. 1 implementation); its own
    // iteration stops at 0.001 K, so the two agree to about 0.002 K.
    for (const dryC of [-10, 0, 5, 15, 25, 35, 45]) {
      for (const rh of [0.05, 0.3, 0.6, 0.9, 1]) {
        for (const pressure of [85_000, 95_461, 101_325]) {
          const ours = wetBulbTemperature(dryC + 273.15, rh, pressure) - 273.15;
          const reference = psychrolib.GetTWetBulbFromRelHum(dryC, rh, pressure);
          expect(Math.abs(ours - reference), `${dryC} °C, RH ${rh}, ${pressure} Pa`).toBeLessThan(0.002);
        }
      }
    }
  });

  it('agrees with psychrolib at random points (property test)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -30, max: 55, noNaN: true }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        fc.double({ min: 60_000, max: 105_000, noNaN: true }),
        (dryC, rh, pressure) => {
          const ours = wetBulbTemperature(dryC + 273.15, rh, pressure) - 273.15;
          const reference = psychrolib.GetTWetBulbFromRelHum(dryC, rh, pressure);
          if (!Number.isFinite(ours)) return false;
          if (Math.abs(ours - reference) < 0.003) return true;
          // ASHRAE eq. 33 (wet bulb above freezing) and eq. 35 (below) do not meet at 0 °C: the
          // humidity ratio jumps there, so near a 0 °C wet bulb in dry air both have a root, and
          // each bisection may land on either (fast-check found 15.3 °C, RH 1 %, 60.6 kPa: 0.000 °C
          // here, −0.827 °C in psychrolib). Then both must be true roots, one on each side of 0 °C.
          const target = humidityRatio(rh * saturationVapourPressure(dryC + 273.15), pressure);
          const miss = (wetC: number) => humidityRatioForWetBulb(dryC, wetC, pressure) - target;
          const isRoot = (wetC: number) => Math.abs(miss(wetC)) < 1e-12 || Math.sign(miss(wetC - 0.003)) !== Math.sign(miss(wetC + 0.003));
          const straddle = Math.min(ours, reference) < 0.003 && Math.max(ours, reference) > -0.003 && Math.sign(ours) !== Math.sign(reference);
          return straddle && isRoot(ours) && isRoot(reference);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('lands on a true root at the counterexample where the two ASHRAE branches both have one', () => {
    const [dryC, rh, pressure] = [15.315315315315305, 0.01, 60552.48852805163];
    const target = humidityRatio(rh * saturationVapourPressure(dryC + 273.15), pressure);
    const ours = wetBulbTemperature(dryC + 273.15, rh, pressure) - 273.15;
    expect(Math.abs(humidityRatioForWetBulb(dryC, ours, pressure) - target)).toBeLessThan(1e-9);
    expect(Math.abs(psychrolib.GetTWetBulbFromRelHum(dryC, rh, pressure) - ours)).toBeLessThan(0.9); // the other root, −0.827 °C
  });

  // ASHRAE Handbook — Fundamentals (2017) ch. 1, example 1 (as cited by psychrolib's test suite):
  // 100 °F dry bulb, 65 °F thermodynamic wet bulb, 14.696 psia → W ≈ 0.00523, RH ≈ 13 %.
  it('reproduces the handbook example: 100 °F dry bulb / 65 °F wet bulb at one atmosphere', () => {
    const dryC = (100 - 32) / 1.8;
    const wetC = (65 - 32) / 1.8;
    expect(humidityRatioForWetBulb(dryC, wetC, 101_325)).toBeCloseTo(0.00523, 4);
    // From RH 13 % (rounded in the handbook) the wet bulb comes back to 65 °F within a few tenths.
    const wetBackF = (wetBulbTemperature(dryC + 273.15, 0.13, 101_325) - 273.15) * 1.8 + 32;
    expect(Math.abs(wetBackF - 65)).toBeLessThan(0.3);
  });

  // ASHRAE Handbook — Fundamentals (2017) ch. 1, table 3 (saturation pressure of water), as cited by
  // psychrolib's test suite in psi; the handbook states the formula is within 300 ppm.
  it.each([
    [-20, 0.014974],
    [5, 0.12656],
    [25, 0.45973],
    [50, 1.7914],
    [100, 14.7094],
  ])('saturation vapour pressure at %d °C matches the handbook table (%f psi)', (celsius, psi) => {
    const expectedPa = psi * 6894.757293168361;
    expect(Math.abs(saturationVapourPressure(celsius + 273.15) - expectedPa) / expectedPa).toBeLessThan(3e-4);
  });

  // psychrolib's test suite reference values (computed independently in a spreadsheet).
  it.each([
    [30, 25, 95_461, 0.0192281274241096],
    [-1, -5, 95_461, 0.00120399819933844],
  ])('humidity ratio for %d °C dry bulb, %d °C wet bulb, %d Pa is %f', (dry, wet, pressure, expected) => {
    expect(Math.abs(humidityRatioForWetBulb(dry, wet, pressure) - expected) / expected).toBeLessThan(3e-4);
  });

  it('is the dry bulb itself at 100 % RH', () => {
    expect(wetBulbTemperature(298.15, 1, 101_325)).toBeCloseTo(298.15, 6);
  });

  it.each([
    ['RH above 100 %', () => wetBulbTemperature(300, 1.2, 101_325), /relative humidity: 120 % is outside the valid range 0–100/],
    ['RH below 0 %', () => wetBulbTemperature(300, -0.1, 101_325), /relative humidity/],
    ['NaN RH', () => wetBulbTemperature(300, Number.NaN, 101_325), /relative humidity: must be a finite number/],
    ['a station pressure of zero', () => wetBulbTemperature(300, 0.5, 0), /station pressure/],
    ['an infinite dry bulb', () => wetBulbTemperature(Number.POSITIVE_INFINITY, 0.5, 101_325), /dry-bulb temperature: must be a finite number/],
  ])('rejects %s naming the field', (_label, call, message) => {
    expect(call).toThrow(message);
  });
});
