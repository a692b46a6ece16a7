import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  STANDARD_ATMOSPHERE_PA,
  absolutePressureToPa,
  absolutePressureUnits,
  flowToKgS,
  kgSToFlow,
  kToTemperature,
  paToAbsolutePressure,
  paToVacuum,
  pressureReadingToPa,
  temperatureToK,
  vacuumUnits,
  type AbsolutePressureUnit,
  type TemperatureUnit,
  type VacuumUnit,
} from '../../shared/units';

const close = (a: number, b: number, rel = 1e-12) => Math.abs(a - b) <= rel * Math.max(Math.abs(a), Math.abs(b), 1e-300);

describe('pressure units', () => {
  // Source: NIST SP 811 (2008) appendix B.8 and the definition of the standard atmosphere.
  it('knows the reference conversions', () => {
    expect(absolutePressureToPa(1, 'inHgA')).toBeCloseTo(3386.389, 6);
    expect(absolutePressureToPa(29.921, 'inHgA') / 1000).toBeCloseTo(101.325, 2); // TRADE primer: 101.325 kPa = 29.921 inHg
    expect(absolutePressureToPa(14.6959, 'psia') / 1000).toBeCloseTo(101.325, 2);
    expect(absolutePressureToPa(760, 'mmHgA')).toBeCloseTo(STANDARD_ATMOSPHERE_PA, 0);
    expect(absolutePressureToPa(1.01325, 'bar_a')).toBeCloseTo(STANDARD_ATMOSPHERE_PA, 9);
  });

  it('turns vacuum into absolute pressure with the barometer: p_abs = barometer − vacuum', () => {
    // 28.5 inHg vacuum against a 29.92 inHg barometer = 1.42 inHgA (arithmetic of the definition)
    const reading = pressureReadingToPa(28.5, 'inHg_vac', { value: 29.92, unit: 'inHgA' });
    expect(paToAbsolutePressure(reading.pa, 'inHgA')).toBeCloseTo(1.42, 10);
    expect(reading.assumedStandardBarometer).toBe(false);
  });

  it('assumes the standard atmosphere when no barometer is given, and says so', () => {
    const reading = pressureReadingToPa(94, 'kPa_vac');
    expect(reading.pa).toBeCloseTo(7325, 9);
    expect(reading.assumedStandardBarometer).toBe(true);
  });

  it('rejects vacuum at or above the barometer, negative absolute pressure and non-numbers, naming the field', () => {
    expect(() => pressureReadingToPa(30, 'inHg_vac', { value: 29.9, unit: 'inHgA' })).toThrow(/pressure: cannot be a vacuum equal to or beyond the barometer/);
    expect(() => pressureReadingToPa(-5, 'kPa_a')).toThrow(/pressure: must be above zero absolute/);
    expect(() => pressureReadingToPa(Number.NaN, 'kPa_a')).toThrow(/pressure: must be a finite number/);
    expect(() => pressureReadingToPa(Number.POSITIVE_INFINITY, 'kPa_vac')).toThrow(/pressure: must be a finite number/);
    expect(() => pressureReadingToPa(-1, 'mmHg_vac')).toThrow(/pressure: cannot be a negative vacuum/);
  });

  it('round-trips every absolute unit to 1e-12 relative (property test)', () => {
    const units = Object.keys(absolutePressureUnits) as AbsolutePressureUnit[];
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e8, noNaN: true }), fc.constantFrom(...units), (value, unit) =>
        close(paToAbsolutePressure(absolutePressureToPa(value, unit), unit), value),
      ),
    );
  });

  it('round-trips vacuum readings against a barometer (property test)', () => {
    const units = Object.keys(vacuumUnits) as VacuumUnit[];
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 0.95, noNaN: true }), fc.constantFrom(...units), (fraction, unit) => {
        const barometerPa = 99_000;
        const vacuum = paToVacuum(barometerPa * (1 - fraction), unit, barometerPa);
        const back = pressureReadingToPa(vacuum, unit, { value: 99, unit: 'kPa_a' });
        return close(back.pa, barometerPa * (1 - fraction), 1e-12);
      }),
    );
  });
});

describe('temperature units', () => {
  // Source: the definitions of the Celsius and Fahrenheit scales (NIST SP 811 B.9).
  it('knows the fixed points', () => {
    expect(temperatureToK(32, 'degF')).toBeCloseTo(273.15, 12);
    expect(temperatureToK(212, 'degF')).toBeCloseTo(373.15, 12);
    expect(temperatureToK(-40, 'degF')).toBeCloseTo(temperatureToK(-40, 'degC'), 12);
  });

  it('round-trips to 1e-12 relative (property test)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 2000, noNaN: true }), fc.constantFrom<TemperatureUnit>('degC', 'degF', 'K'), (kelvin, unit) =>
        close(temperatureToK(kToTemperature(kelvin, unit), unit), kelvin),
      ),
    );
  });

  it('rejects temperatures below absolute zero', () => {
    expect(() => temperatureToK(-500, 'degF', 'cwInletTemperature')).toThrow(/cwInletTemperature: is below absolute zero/);
  });
});

describe('flow units', () => {
  // Source: the US gallon is 231 in³ = 3.785411784 L exactly (NIST SP 811 B.8).
  it('converts US gpm and m³/h at a given density', () => {
    expect(flowToKgS(1, 'gpm', 1000)).toBeCloseTo((3.785411784e-3 / 60) * 1000, 12);
    expect(flowToKgS(3600, 'm3_h', 997)).toBeCloseTo(997, 12);
  });

  it('round-trips to 1e-12 relative (property test)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e7, noNaN: true }), fc.constantFrom('m3_h' as const, 'gpm' as const, 'kg_s' as const), (value, unit) =>
        close(kgSToFlow(flowToKgS(value, unit, 996.5), unit, 996.5), value),
      ),
    );
  });
});
