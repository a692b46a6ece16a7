// A number typed in a setup box comes back exactly as typed after the trip to SI and back, in every
// unit a person can choose; a box that does not hold a number is an error on that box, never a
// silently missing limit.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Quantity } from '../../shared/calc/check-catalog';
import { startingLimits } from '../../shared/calc/limits';
import type { DisplayPreferences } from '../../shared/display';
import { fromEntryValue, parseTypedNumber, toEntryValue } from '../../shared/entry-units';
import { absolutePressureUnits, temperatureUnits, type AbsolutePressureUnit, type TemperatureUnit } from '../../shared/units';
import { limitSetFromText, limitTextFrom } from '../../src/features/plant/lib/limit-entry';

const quantities: Quantity[] = ['temperature', 'temperature_difference', 'pressure', 'pressure_difference', 'power', 'heat_transfer_coefficient', 'velocity', 'ratio', 'mass_flow', 'index', 'money_rate', 'concentration_ppb'];
const prefsArb = fc.record({
  temperature: fc.constantFrom(...(Object.keys(temperatureUnits) as TemperatureUnit[])),
  pressure: fc.constantFrom(...(Object.keys(absolutePressureUnits) as AbsolutePressureUnit[])),
  currency: fc.constant('money'),
}) satisfies fc.Arbitrary<DisplayPreferences>;

/** A value as a person types it: up to 6 significant digits, e.g. "-27.3051", "0.00412", "712000". */
const typed = (minExponent: number) =>
  fc.tuple(fc.integer({ min: -999_999, max: 999_999 }), fc.integer({ min: minExponent, max: 6 })).map(([mantissa, exponent]) => Number(`${mantissa}e${exponent}`));

describe('typed value → SI → entry box', () => {
  it('gives back exactly what was typed, for every quantity and unit (6 significant digits)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...quantities.filter((q) => q !== 'temperature')), prefsArb, typed(-12), (quantity, prefs, value) => {
        expect(toEntryValue(fromEntryValue(value, quantity, prefs), quantity, prefs)).toBe(value);
      }),
      { numRuns: 20_000 },
    );
  });

  it('gives back exactly what was typed for temperatures to a millionth of a degree (the 273.15 / 459.67 offset bounds the precision)', () => {
    fc.assert(
      fc.property(prefsArb, typed(-6), (prefs, value) => {
        expect(toEntryValue(fromEntryValue(value, 'temperature', prefs), 'temperature', prefs)).toBe(value);
      }),
      { numRuns: 20_000 },
    );
  });

  it('keeps the cases seen in use', () => {
    const kPa = { temperature: 'degC', pressure: 'kPa_a', currency: null } as const;
    // 700 kPa, 1.1 kPa and 33.9 °C, each as typed.
    expect(toEntryValue(fromEntryValue(700, 'pressure', kPa), 'pressure', kPa)).toBe(700);
    expect(toEntryValue(fromEntryValue(1.1, 'pressure_difference', kPa), 'pressure_difference', kPa)).toBe(1.1);
    expect(toEntryValue(fromEntryValue(33.9, 'temperature', kPa), 'temperature', kPa)).toBe(33.9);
    // 0 °C = 273.15 K exactly; 32 °F = 273.15 K (NIST SP 811, B.8).
    expect(fromEntryValue(0, 'temperature', kPa)).toBe(273.15);
    expect(fromEntryValue(32, 'temperature', { ...kPa, temperature: 'degF' })).toBeCloseTo(273.15, 12);
    // 1 inHg (32 °F) = 3386.389 Pa (NIST SP 811).
    expect(fromEntryValue(1, 'pressure', { ...kPa, pressure: 'inHgA' })).toBe(3386.389);
  });
});

describe('what a box holds', () => {
  it('reads plain decimal numbers and refuses everything else with a message', () => {
    for (const [text, value] of [['45', 45], [' -0.5 ', -0.5], ['.5', 0.5], ['1.2e3', 1200], ['+7', 7]] as const) expect(parseTypedNumber(text)).toEqual({ empty: false, value });
    expect(parseTypedNumber('  ')).toEqual({ empty: true });
    for (const text of ['1O', '0x10', 'Infinity', 'NaN', '1,5', '12 3', '1e999', '--1', '.']) expect(parseTypedNumber(text), text).toHaveProperty('error');
  });

  it('a limit typed as "1O" is an error on that box, not a missing limit', () => {
    const prefs = { temperature: 'degC', pressure: 'kPa_a', currency: null } as const;
    const text = limitTextFrom(startingLimits, prefs);
    text.ttd.highWatch = '1O';
    const { limits, errors } = limitSetFromText(text, prefs);
    expect(errors).toEqual({ 'limits.ttd.highWatch': expect.stringMatching(/^Terminal temperature difference \(TTD\), high watch: “1O” is not a number/) });
    // Every other limit is kept exactly.
    text.ttd.highWatch = limitTextFrom(startingLimits, prefs).ttd.highWatch;
    expect(limitSetFromText(text, prefs)).toEqual({ limits: startingLimits, errors: {} });
    expect(limits.ttd?.highAlarm).toBe(startingLimits.ttd?.highAlarm);
  });
});
