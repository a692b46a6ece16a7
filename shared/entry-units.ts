// Numbers a person types into a setup box, in their unit, and back: SI is stored, and the box shows
// again exactly what was typed. Converting there and back in binary floating point leaves a last-bit
// error (700 kPa → 699.9999999999999), so the value put back in the box is rounded to 12 significant
// digits of the largest magnitude in the sum — far below anything typed, far above the error.
import type { Quantity } from './calc/check-catalog';
import type { DisplayPreferences } from './display';
import { absolutePressureUnits } from './units';

/** display = si / scale − offset, and si = (display + offset) · scale. */
type Linear = { scale: number; offset: number };

function linearFor(quantity: Quantity, prefs: DisplayPreferences): Linear {
  switch (quantity) {
    case 'temperature':
      // K = °C + 273.15 exactly; K = (°F + 459.67) · 5/9 exactly (NIST SP 811, B.8).
      if (prefs.temperature === 'degC') return { scale: 1, offset: 273.15 };
      if (prefs.temperature === 'degF') return { scale: 5 / 9, offset: 459.67 };
      return { scale: 1, offset: 0 };
    case 'temperature_difference':
      return { scale: prefs.temperature === 'degF' ? 5 / 9 : 1, offset: 0 };
    case 'pressure':
    case 'pressure_difference':
      return { scale: absolutePressureUnits[prefs.pressure].pa, offset: 0 };
    case 'power':
      return { scale: 1e6, offset: 0 };
    default:
      return { scale: 1, offset: 0 };
  }
}

const SIGNIFICANT = 12;

/** Rounds `value` to 12 significant digits of max(|value|, |offset|): the float noise of a round trip goes, typed digits stay. */
export function roundForEntry(value: number, offset = 0): number {
  if (!Number.isFinite(value) || value === 0) return value;
  const magnitude = Math.max(Math.abs(value), Math.abs(offset));
  const decimals = SIGNIFICANT - 1 - Math.floor(Math.log10(magnitude));
  if (offset === 0 || decimals < 0 || decimals > 100) return Number(value.toPrecision(SIGNIFICANT));
  return Number(value.toFixed(decimals));
}

/** SI → the number to show in an entry box, in the person's unit. */
export function toEntryValue(si: number, quantity: Quantity, prefs: DisplayPreferences): number {
  const { scale, offset } = linearFor(quantity, prefs);
  return roundForEntry(si / scale - offset, offset);
}

/** A number typed in the person's unit → SI. */
export function fromEntryValue(typed: number, quantity: Quantity, prefs: DisplayPreferences): number {
  const { scale, offset } = linearFor(quantity, prefs);
  return (typed + offset) * scale;
}

// Plain decimal notation, optionally with an exponent: "45", "-0.5", ".5", "1.2e3". Not "1O", "0x10",
// "Infinity", "1,5" or "" — each of which Number() would take or turn into something else.
const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

export type TypedNumber = { empty: true } | { empty: false; value: number } | { empty: false; error: string };

/** What a box holds: nothing, a finite number, or an error to show beside it. */
export function parseTypedNumber(text: string): TypedNumber {
  const trimmed = text.trim();
  if (trimmed === '') return { empty: true };
  if (/^[+-]?\d+,\d+$/.test(trimmed)) return { empty: false, error: 'Use a point for decimals, e.g. 45.5' };
  if (!NUMBER.test(trimmed)) return { empty: false, error: `“${trimmed}” is not a number; type digits, e.g. 45.5` };
  const value = Number(trimmed);
  if (!Number.isFinite(value)) return { empty: false, error: 'This number is too large' };
  return { empty: false, value };
}
