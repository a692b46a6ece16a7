import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { saturationPressure, saturationTemperature } from '../../shared/calc/saturation';

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

describe('IAPWS-IF97 region 4 (saturation line)', () => {
  // Source: IAPWS R7-97(2012), table 35 — computer-program verification values for eq. 30.
  it.each([
    [300, 0.353658941e-2],
    [500, 0.263889776e1],
    [600, 0.123443146e2],
  ])('ps(%d K) = %f MPa to 1e-8 relative', (temperatureK, expectedMPa) => {
    expect(relative(saturationPressure(temperatureK) / 1e6, expectedMPa)).toBeLessThan(1e-8);
  });

  // Source: IAPWS R7-97(2012), table 36 — computer-program verification values for eq. 31.
  it.each([
    [0.1, 0.372755919e3],
    [1, 0.453035632e3],
    [10, 0.584149488e3],
  ])('Ts(%d MPa) = %f K to 1e-8 relative', (pressureMPa, expectedK) => {
    expect(relative(saturationTemperature(pressureMPa * 1e6), expectedK)).toBeLessThan(1e-8);
  });

  // Saturation temperatures at condenser pressures. Source: saturated-water pressure table of a
  // common engineering-thermodynamics textbook (IAPWS-95 based), values from memory, to 0.01 °C.
  it.each([
    [3, 24.08],
    [5, 32.87],
    [7.5, 40.29],
    [8, 41.51],
    [10, 45.81],
    [15, 53.97],
    [20, 60.06],
  ])('Ts(%d kPa) ≈ %f °C as in the steam tables', (kPa, expectedC) => {
    expect(saturationTemperature(kPa * 1000) - 273.15).toBeCloseTo(expectedC, 1);
    expect(Math.abs(saturationTemperature(kPa * 1000) - 273.15 - expectedC)).toBeLessThan(0.015);
  });

  it('inverts itself over the whole range (property test)', () => {
    fc.assert(
      fc.property(fc.double({ min: 273.15, max: 647.096, noNaN: true }), (temperatureK) => {
        const back = saturationTemperature(saturationPressure(temperatureK));
        // The two equations are each other's inverse to within the release's stated consistency.
        return Math.abs(back - temperatureK) < 1e-6;
      }),
    );
  });

  it.each([
    ['a temperature below the triple point', () => saturationPressure(273.0), /temperature.*273.*range 273.15–647.096 K/],
    ['a temperature above the critical point', () => saturationPressure(650), /650 K is outside/],
    ['a pressure below the triple point', () => saturationTemperature(500), /pressure.*500 Pa is outside the valid range 611.212677–22064000 Pa/],
    ['a negative absolute pressure', () => saturationTemperature(-1000), /pressure/],
    ['NaN', () => saturationTemperature(Number.NaN), /pressure: must be a finite number/],
    ['Infinity', () => saturationPressure(Number.POSITIVE_INFINITY), /temperature: must be a finite number/],
  ])('rejects %s with a message naming the field and range', (_label, call, message) => {
    expect(call).toThrow(message);
  });
});
