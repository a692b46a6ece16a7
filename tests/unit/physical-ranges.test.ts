import { describe, expect, it } from 'vitest';
import { CalcInputError } from '../../shared/calc/input-error';
import { readingSetToSi } from '../../shared/calc/reading-set-si';
import { readingSetInputSchema } from '../../shared/schemas/reading-set';

// A round that is fine in every respect; each test changes one reading.
const round = (patch: Record<string, unknown> = {}) => ({
  unitId: 1,
  pressure: { value: 8, unit: 'kPa_a' },
  hotwellTemperature: { value: 41, unit: 'degC' },
  cwInletTemperature: { value: 22, unit: 'degC' },
  cwOutletTemperature: { value: 31, unit: 'degC' },
  cwFlow: { value: 54_000, unit: 'm3_h' },
  ...patch,
});

/** The message the contract gives for one field path, or undefined when the round passes. */
function messageFor(patch: Record<string, unknown>, path: string): string | undefined {
  const parsed = readingSetInputSchema.safeParse(round(patch));
  if (parsed.success) return undefined;
  return parsed.error.issues.find((issue) => issue.path.join('.') === path)?.message;
}

describe('physical ranges in the reading contract', () => {
  it('refuses water that cannot be liquid, with the bounds in the unit typed', () => {
    // Water freezes at 0 °C = 32 °F = 273.15 K and boils at 100 °C = 212 °F = 373.15 K at one
    // atmosphere (the definitions of the scales).
    expect(messageFor({ hotwellTemperature: { value: 101, unit: 'degC' } }, 'hotwellTemperature.value')).toBe('Hotwell temperature must be between 0 °C and 100 °C');
    expect(messageFor({ hotwellTemperature: { value: 213, unit: 'degF' } }, 'hotwellTemperature.value')).toBe('Hotwell temperature must be between 32 °F and 212 °F');
    expect(messageFor({ cwInletTemperature: { value: 272, unit: 'K' } }, 'cwInletTemperature.value')).toBe('CW inlet temperature must be between 273.15 K and 373.15 K');
    expect(messageFor({ cwOutletTemperature: { value: -1, unit: 'degC' } }, 'cwOutletTemperature.value')).toMatch(/^CW outlet temperature must be between 0 °C/);
    for (const ok of [{ value: 100, unit: 'degC' }, { value: 212, unit: 'degF' }, { value: 32, unit: 'degF' }]) {
      expect(messageFor({ hotwellTemperature: ok }, 'hotwellTemperature.value')).toBeUndefined();
    }
  });

  it('refuses CW flow beyond any condenser (the 1e9 m³/h of the probe) in the unit typed', () => {
    expect(messageFor({ cwFlow: { value: 1e9, unit: 'm3_h' } }, 'cwFlow.value')).toBe('CW flow must be between 0 m³/h and 1,000,000 m³/h');
    // 1 000 000 m³/h = 277.8 m³/s; 1 US gal = 3.785411784 L exactly (NIST SP 811), so
    // 277.8 m³/s × 60 / 0.003785411784 = 4 402 868 US gpm, shown to three figures.
    expect(messageFor({ cwFlow: { value: 5e6, unit: 'gpm' } }, 'cwFlow.value')).toBe('CW flow must be between 0 US gpm and 4,400,000 US gpm');
    expect(messageFor({ cwFlow: { value: -5, unit: 'kg_s' } }, 'cwFlow.value')).toMatch(/^CW flow must be between 0 kg\/s and/);
    expect(messageFor({ cwFlow: { value: 250_000, unit: 'm3_h' } }, 'cwFlow.value')).toBeUndefined();
  });

  it('refuses an absolute pressure below the triple point of water, and says so in the unit typed', () => {
    // Triple point 611.657 Pa (IAPWS R7-97): below it there is no liquid to condense into.
    expect(messageFor({ pressure: { value: 0.5, unit: 'kPa_a' } }, 'pressure.value')).toBe('Condenser absolute pressure must be between 0.612 kPa a and 200 kPa a');
    expect(messageFor({ pressure: { value: 0.62, unit: 'kPa_a' } }, 'pressure.value')).toBeUndefined();
    // 611.657 Pa / 3386.389 Pa per inHg (NIST SP 811) = 0.1806 inHg
    expect(messageFor({ pressure: { value: 0.1, unit: 'inHgA' } }, 'pressure.value')).toMatch(/between 0\.181 inHgA and/);
  });

  it('holds a vacuum below the barometer less the triple point, in the conversion both sides run', () => {
    const vacuum = (value: number, barometer?: number) =>
      readingSetInputSchema.parse(round({ pressure: { value, unit: 'inHg_vac' }, ...(barometer ? { barometer: { value: barometer, unit: 'inHgA' } } : {}) }));
    // 29.92 inHg − 611.657 Pa / 3386.389 Pa per inHg = 29.92 − 0.1806 = 29.739 inHg, shown rounded down.
    const caught = (() => {
      try {
        readingSetToSi(vacuum(29.9, 29.92));
        return null;
      } catch (error) {
        return error;
      }
    })();
    expect(caught).toBeInstanceOf(CalcInputError);
    expect((caught as CalcInputError).field).toBe('pressure.value');
    expect((caught as CalcInputError).detail).toBe('Condenser vacuum must be between 0 inHg vac and 29.73 inHg vac with this barometer');
    expect(() => readingSetToSi(vacuum(29.7, 29.92))).not.toThrow();
    // Standard atmosphere 29.921 inHg (TRADE primer) when no barometer is given.
    expect(() => readingSetToSi(vacuum(29.8))).toThrow(/against the standard atmosphere/);
  });

  it('keeps the other readings inside their physical ranges, in words', () => {
    expect(messageFor({ barometer: { value: 20, unit: 'kPa_a' } }, 'barometer.value')).toBe('Barometer must be between 50 kPa a and 110 kPa a');
    expect(messageFor({ steamFlow: { value: 30_000, unit: 't_h' } }, 'steamFlow.value')).toBe('Exhaust steam flow must be between 0 t/h and 20,000 t/h');
    // Air-saturated water at 0 °C holds about 14.6 mg/L of oxygen (solubility tables, from memory).
    expect(messageFor({ dissolvedOxygenPpb: 20_000 }, 'dissolvedOxygenPpb')).toBe('Condensate dissolved oxygen must be between 0 ppb and 15,000 ppb');
    expect(messageFor({ tower: { dryBulbTemperature: { value: 70, unit: 'degC' } } }, 'tower.dryBulbTemperature.value')).toBe('Dry bulb must be between -40 °C and 60 °C');
    expect(messageFor({ tower: { makeupConductivity: { value: 0, unit: 'uS_cm' } } }, 'tower.makeupConductivity.value')).toMatch(/^Makeup conductivity must be between 0\.05 µS\/cm/);
  });

  it('never shows an internal SI figure for a reading typed in other units', () => {
    const message = messageFor({ hotwellTemperature: { value: 5000, unit: 'degF' } }, 'hotwellTemperature.value')!;
    expect(message).not.toMatch(/K\b|373|273/);
  });
});
