import { fieldLabel } from '../schemas/field-labels';

/** Thrown for physically impossible or non-numeric input; names the field so a form can show it. */
export class CalcInputError extends Error {
  constructor(
    readonly field: string,
    readonly detail: string,
  ) {
    super(`${field}: ${detail}`);
    this.name = 'CalcInputError';
  }

  /** What a person reads: the field by its label, then the detail ("Hotwell temperature is below absolute zero (…)"). */
  get sentence(): string {
    const label = fieldLabel(this.field);
    // Fields named in words already ("CW flow", "tube gauge") are their own label.
    const words = label === 'This field' ? this.field.charAt(0).toUpperCase() + this.field.slice(1) : label;
    return `${words} ${this.detail}`;
  }
}

/** A value outside the range a formula covers; its detail names SI figures, so it is not for the operator's eyes. */
export class CalcRangeError extends CalcInputError {}

export function requireFinite(field: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new CalcInputError(field, `must be a finite number (got ${String(value)})`);
  }
  return value;
}

export function requirePositive(field: string, value: number): number {
  requireFinite(field, value);
  if (value <= 0) throw new CalcInputError(field, `must be greater than zero (got ${value})`);
  return value;
}

export function requireInRange(field: string, value: number, min: number, max: number, unit: string): number {
  requireFinite(field, value);
  if (value < min || value > max) {
    throw new CalcRangeError(field, `${value} ${unit} is outside the valid range ${min}–${max} ${unit}`);
  }
  return value;
}
