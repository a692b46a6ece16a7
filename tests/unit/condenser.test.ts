import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  cwTemperatureRise,
  heatDuty,
  initialTemperatureDifference,
  logMeanTemperatureDifference,
  overallU,
  subcooling,
  terminalTemperatureDifference,
} from '../../shared/calc/condenser';
import { backpressureDeviationCost, expectedBackpressure } from '../../shared/calc/backpressure';
import { cleanUFromDataSheet, cleanUHei, heiFt, tubeInsideDiameterM, tubeVelocity } from '../../shared/calc/hei';
import { waterDensity } from '../../shared/calc/water';

const C = (celsius: number) => celsius + 273.15;

describe('condenser temperature checks', () => {
  // Definitions (HEI; TRADE primer). Tsat at 8 kPa = 41.51 °C from the steam tables (from memory).
  const tsat = C(41.51);
  it('computes subcooling, TTD, ITD, rise and LMTD from their definitions', () => {
    expect(subcooling(tsat, C(41.0))).toBeCloseTo(0.51, 10);
    expect(terminalTemperatureDifference(tsat, C(30.93))).toBeCloseTo(10.58, 10);
    expect(initialTemperatureDifference(tsat, C(22))).toBeCloseTo(19.51, 10);
    expect(cwTemperatureRise(C(22), C(30.93))).toBeCloseTo(8.93, 10);
    // LMTD = (ITD − TTD) / ln(ITD/TTD) = 8.93 / ln(19.51/10.58) = 14.59 K (hand arithmetic)
    expect(logMeanTemperatureDifference(19.51, 10.58)).toBeCloseTo(14.59, 2);
  });

  it('rejects impossible temperature pictures naming the field', () => {
    expect(() => cwTemperatureRise(C(30), C(25))).toThrow(/CW outlet temperature: must be warmer/);
    expect(() => logMeanTemperatureDifference(5, 0)).toThrow(/TTD: must be above zero/);
    expect(() => logMeanTemperatureDifference(5, 6)).toThrow(/ITD: must exceed the TTD/);
    expect(() => subcooling(Number.NaN, C(40))).toThrow(/saturation temperature: must be a finite number/);
  });

  it('takes duty from the CW side, or from the steam side at 950 Btu/lb when CW flow is missing', () => {
    // Q = ṁ·cp·ΔT = 15 000 × 4180 × 8.93 = 559.9 MW (hand arithmetic)
    expect(heatDuty({ cwFlowKgS: 15_000, riseK: 8.93 })).toEqual({ watts: 15_000 * 4180 * 8.93, basis: 'cw_side' });
    // HEI: 950 Btu/lb = 950 × 2.326 kJ/kg = 2209.7 kJ/kg; 250 kg/s → 552.4 MW
    const steam = heatDuty({ riseK: 8.93, steamFlowKgS: 250 });
    expect(steam.basis).toBe('steam_side');
    expect(steam.watts / 1e6).toBeCloseTo(552.4, 1);
    expect(() => heatDuty({ riseK: 8.93 })).toThrow(/CW flow: needed for the duty/);
  });

  it('computes U = Q / (A·LMTD)', () => {
    expect(overallU(560e6, 17_500, 14.59)).toBeCloseTo(560e6 / (17_500 * 14.59), 8);
  });
});

describe('water properties and tube geometry', () => {
  // Kell (1975) reproduces the handbook density of water: 997.05 kg/m³ at 25 °C, 999.70 at 10 °C.
  it('gives the handbook density of water', () => {
    expect(waterDensity(C(25))).toBeCloseTo(997.05, 1);
    expect(waterDensity(C(10))).toBeCloseTo(999.7, 1);
  });

  // BWG table: 22 BWG wall = 0.028 in; 1 in OD → ID 0.944 in = 23.98 mm.
  it('takes the tube inside diameter from the BWG wall thickness', () => {
    expect(tubeInsideDiameterM(25.4, 22) * 1000).toBeCloseTo(23.978, 3);
    expect(() => tubeInsideDiameterM(25.4, 23)).toThrow(/tube gauge: BWG 23/);
  });

  it('computes the tube velocity as flow over density and flow area', () => {
    const area = 10_000 * (Math.PI * 0.023978 ** 2) / 4 / 2;
    expect(tubeVelocity({ tubeOdMm: 25.4, gaugeBwg: 22, tubeCount: 10_000, passes: 2 }, 5000, 997)).toBeCloseTo(5000 / (997 * area), 3);
  });
});

describe('HEI clean U', () => {
  // HEI: U = C·√v·Ft·Fm in Btu/(h·ft²·°F) with v in ft/s. Table values from memory: C = 259 for
  // 1 in OD, Ft = 1.00 at 70 °F, Fm = 1.00 for admiralty at 18 BWG. At 7 ft/s: 259 × √7 = 685.3 Btu
  // = 3891 W/(m²·K) (1 Btu/(h·ft²·°F) = 5.678263 W/(m²·K), NIST SP 811).
  it('applies C·√v·Ft·Fm with the unit conversions right', () => {
    const u = cleanUHei({ tubeOdMm: 25.4, gaugeBwg: 18, material: 'admiralty', velocityMS: 7 * 0.3048, inletK: C((70 - 32) / 1.8) });
    expect(u).toBeCloseTo(259 * Math.sqrt(7) * 5.678263337, 6);
  });

  it('corrects a data-sheet clean U by √(v/v_design) and Ft ratio, and leaves it unchanged at design', () => {
    const base = { designCleanU: 3000, designVelocityMS: 2, designInletK: C(20) };
    expect(cleanUFromDataSheet({ ...base, velocityMS: 2, inletK: C(20) })).toBeCloseTo(3000, 10);
    expect(cleanUFromDataSheet({ ...base, velocityMS: 1.5, inletK: C(20) })).toBeCloseTo(3000 * Math.sqrt(0.75), 10);
    expect(cleanUFromDataSheet({ ...base, velocityMS: 2, inletK: C(30) })).toBeCloseTo((3000 * heiFt(C(30))) / heiFt(C(20)), 10);
  });

  it('refuses an inlet temperature outside its table instead of extrapolating', () => {
    expect(() => heiFt(C(60))).toThrow(/outside the HEI inlet-temperature table/);
  });
});

describe('expected backpressure (NTU method)', () => {
  // Design point built by hand from the steam tables (from memory: Tsat(8 kPa) = 41.51 °C):
  // ṁ = 15 000 kg/s, T_in = 22 °C, Q = 560 MW → rise = 8.9314 K, ITD = 19.51 K, TTD = 10.5786 K,
  // NTU = ln(ITD/TTD) = 0.61206, U = NTU·ṁ·cp/A = 2192.9 W/(m²·K) for A = 17 500 m².
  it('returns the design backpressure within 1 % at design U, flow, inlet and duty', () => {
    const result = expectedBackpressure({ uWM2K: 2192.9, surfaceAreaM2: 17_500, cwFlowKgS: 15_000, cwInletK: C(22), dutyW: 560e6 });
    expect(Math.abs(result.pressurePa - 8000) / 8000).toBeLessThan(0.01);
    expect(result.ntu).toBeCloseTo(0.61206, 4);
  });

  it('rises when U falls (fouling) and when the inlet warms (property test)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1500, max: 4000, noNaN: true }), fc.double({ min: C(5), max: C(30), noNaN: true }), (u, inlet) => {
        const base = { surfaceAreaM2: 17_500, cwFlowKgS: 15_000, dutyW: 500e6 };
        const clean = expectedBackpressure({ ...base, uWM2K: u, cwInletK: inlet }).pressurePa;
        const fouled = expectedBackpressure({ ...base, uWM2K: u * 0.8, cwInletK: inlet }).pressurePa;
        const warmer = expectedBackpressure({ ...base, uWM2K: u, cwInletK: inlet + 2 }).pressurePa;
        return fouled > clean && warmer > clean && Number.isFinite(clean);
      }),
    );
  });
});

describe('cost of a backpressure deviation', () => {
  const curve = [
    [4000, -1],
    [8000, 0],
    [12000, 3],
  ] as const;

  it('interpolates the correction curve linearly and prices it', () => {
    // f(10 kPa) = 1.5 MW, f(8 kPa) = 0 → 1.5 MW; at 80 per MWh → 120 per hour (hand arithmetic)
    expect(backpressureDeviationCost(curve, 10_000, 8000, 80)).toEqual({ megawatts: 1.5, moneyPerHour: 120 });
    expect(backpressureDeviationCost(curve, 10_000, 8000, null).moneyPerHour).toBeNull();
  });

  it('does not extrapolate beyond the table, and says so', () => {
    expect(() => backpressureDeviationCost(curve, 13_000, 8000, 80)).toThrow(/outside the correction curve \(4.0–12.0 kPa a\); not extrapolated/);
  });

  it('rejects a curve whose pressures do not rise', () => {
    expect(() => backpressureDeviationCost([[8000, 0], [4000, 1]], 5000, 6000, null)).toThrow(/pressures must rise/);
  });
});
