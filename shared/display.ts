// SI → what a person reads: the number in their chosen unit, always with the unit's label.
import type { Quantity } from './calc/check-catalog';
import {
  absolutePressureUnits,
  kDifferenceTo,
  kToTemperature,
  paToAbsolutePressure,
  temperatureUnits,
  type AbsolutePressureUnit,
  type TemperatureUnit,
} from './units';

export type DisplayPreferences = {
  temperature: TemperatureUnit;
  pressure: AbsolutePressureUnit;
  currency: string | null;
};

export const defaultDisplayPreferences: DisplayPreferences = { temperature: 'degC', pressure: 'kPa_a', currency: null };

export type Displayed = { text: string; unit: string };

const fixed = (value: number, digits: number) => value.toLocaleString('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });

/** The number and unit label a person reads, before formatting (for charts and exports). */
export function convertForDisplay(value: number, quantity: Quantity, prefs: DisplayPreferences): { value: number; unit: string } {
  switch (quantity) {
    case 'temperature':
      return { value: kToTemperature(value, prefs.temperature), unit: temperatureUnits[prefs.temperature].label };
    case 'temperature_difference':
      return { value: kDifferenceTo(value, prefs.temperature), unit: prefs.temperature === 'degF' ? '°F' : 'K' };
    case 'pressure':
      return { value: paToAbsolutePressure(value, prefs.pressure), unit: absolutePressureUnits[prefs.pressure].label };
    case 'pressure_difference':
      return { value: paToAbsolutePressure(value, prefs.pressure), unit: absolutePressureUnits[prefs.pressure].label.replace(/ ?a$|A$/, '') };
    case 'power':
      return { value: value / 1e6, unit: 'MW' };
    case 'money_rate':
      return { value, unit: `${prefs.currency ?? 'money'}/h` };
    case 'concentration_ppb':
      return { value, unit: 'ppb' };
    default:
      return { value, unit: displayQuantity(value, quantity, prefs).unit };
  }
}

export function displayQuantity(value: number, quantity: Quantity, prefs: DisplayPreferences): Displayed {
  switch (quantity) {
    case 'temperature':
      return { text: fixed(kToTemperature(value, prefs.temperature), 1), unit: temperatureUnits[prefs.temperature].label };
    case 'temperature_difference':
      return { text: fixed(kDifferenceTo(value, prefs.temperature), 2), unit: prefs.temperature === 'degF' ? '°F' : 'K' };
    case 'pressure': {
      const converted = paToAbsolutePressure(value, prefs.pressure);
      const digits = prefs.pressure === 'mbar_a' || prefs.pressure === 'mmHgA' ? 1 : prefs.pressure === 'bar_a' ? 4 : 2;
      return { text: fixed(converted, digits), unit: absolutePressureUnits[prefs.pressure].label };
    }
    case 'pressure_difference': {
      const converted = paToAbsolutePressure(value, prefs.pressure);
      const unit = { kPa_a: 'kPa', bar_a: 'bar', mbar_a: 'mbar', psia: 'psi', inHgA: 'inHg', mmHgA: 'mmHg' }[prefs.pressure];
      return { text: (converted > 0 ? '+' : '') + fixed(converted, prefs.pressure === 'mbar_a' ? 1 : 2), unit };
    }
    case 'power':
      return { text: fixed(value / 1e6, 2), unit: 'MW' };
    case 'heat_transfer_coefficient':
      return { text: fixed(value, 0), unit: 'W/(m²·K)' };
    case 'velocity':
      return { text: fixed(value, 2), unit: 'm/s' };
    case 'ratio':
      return { text: fixed(value, 3), unit: '(ratio)' };
    case 'mass_flow':
      return { text: fixed(value, 2), unit: 'kg/s' };
    case 'index':
      return { text: fixed(value, 2), unit: '(index)' };
    case 'money_rate':
      return { text: fixed(value, 0), unit: `${prefs.currency ?? 'money'}/h` };
    case 'concentration_ppb':
      return { text: fixed(value, 1), unit: 'ppb (µg/kg)' };
  }
}

/** Energy over a time: MWh with two decimals. */
export function displayEnergy(megawattHours: number): Displayed {
  return { text: fixed(megawattHours, 2), unit: 'MWh' };
}

/** An amount of money in the unit's currency (or the word "money" where none is set). */
export function displayMoney(amount: number, currency: string | null): Displayed {
  return { text: fixed(amount, 0), unit: currency ?? 'money' };
}
