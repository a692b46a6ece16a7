// Unit conversions at the edges. Everything inside Hotwell is SI: Pa, K, kg/s, W, m², S/m.
// Factors are exact definitions or the conventional values in NIST SP 811 (2008), appendix B.
// (A general units package was weighed and not used: none had inches of mercury at 32 °F, vacuum
// against a barometer, and exact factors together, and these few lines are easy to check.)
import { CalcInputError, requireFinite } from './calc/input-error';

export const STANDARD_ATMOSPHERE_PA = 101_325;

/** Pascals per unit of absolute pressure. */
export const absolutePressureUnits = {
  kPa_a: { label: 'kPa a', pa: 1000 },
  bar_a: { label: 'bar a', pa: 1e5 },
  mbar_a: { label: 'mbar a', pa: 100 },
  psia: { label: 'psia', pa: 6894.757293168361 }, // lbf/in² = 4.4482216152605 N / 0.0254² m²
  inHgA: { label: 'inHgA', pa: 3386.389 }, // inch of mercury at 32 °F, NIST SP 811
  mmHgA: { label: 'mmHgA', pa: 133.322387415 }, // conventional millimetre of mercury
} as const;
export type AbsolutePressureUnit = keyof typeof absolutePressureUnits;

/** Vacuum gauge readings: below the barometer, in the matching absolute unit. */
export const vacuumUnits = {
  inHg_vac: { label: 'inHg vac', absolute: 'inHgA' },
  kPa_vac: { label: 'kPa vac', absolute: 'kPa_a' },
  mmHg_vac: { label: 'mmHg vac', absolute: 'mmHgA' },
} as const satisfies Record<string, { label: string; absolute: AbsolutePressureUnit }>;
export type VacuumUnit = keyof typeof vacuumUnits;
export type PressureUnit = AbsolutePressureUnit | VacuumUnit;

export const pressureUnitLabels: Record<PressureUnit, string> = {
  ...Object.fromEntries(Object.entries(absolutePressureUnits).map(([k, v]) => [k, v.label])),
  ...Object.fromEntries(Object.entries(vacuumUnits).map(([k, v]) => [k, v.label])),
} as Record<PressureUnit, string>;

export const isVacuumUnit = (unit: PressureUnit): unit is VacuumUnit => unit in vacuumUnits;

export function absolutePressureToPa(value: number, unit: AbsolutePressureUnit, field = 'pressure'): number {
  requireFinite(field, value);
  return value * absolutePressureUnits[unit].pa;
}

export function paToAbsolutePressure(pa: number, unit: AbsolutePressureUnit): number {
  return pa / absolutePressureUnits[unit].pa;
}

export type Barometer = { value: number; unit: AbsolutePressureUnit };

export type PressureReading = {
  pa: number;
  /** True when no barometer was given for a vacuum reading and 101.325 kPa was assumed. */
  assumedStandardBarometer: boolean;
};

/**
 * Absolute pressure from a gauge reading. Vacuum: p_abs = barometer − vacuum (same units).
 * Without a barometer the standard atmosphere is assumed, and the result says so.
 */
export function pressureReadingToPa(
  value: number,
  unit: PressureUnit,
  barometer?: Barometer | null,
  field = 'pressure',
): PressureReading {
  requireFinite(field, value);
  if (!isVacuumUnit(unit)) {
    const pa = absolutePressureToPa(value, unit, field);
    if (pa <= 0) throw new CalcInputError(field, `must be above zero absolute (got ${value} ${pressureUnitLabels[unit]})`);
    return { pa, assumedStandardBarometer: false };
  }
  if (value < 0) throw new CalcInputError(field, `cannot be a negative vacuum (got ${value} ${pressureUnitLabels[unit]})`);
  const barometerPa = barometer
    ? absolutePressureToPa(barometer.value, barometer.unit, 'barometer')
    : STANDARD_ATMOSPHERE_PA;
  if (barometer && barometerPa <= 0) throw new CalcInputError('barometer', 'must be above zero');
  const vacuumPa = value * absolutePressureUnits[vacuumUnits[unit].absolute].pa;
  if (vacuumPa >= barometerPa) {
    throw new CalcInputError(field, `cannot be a vacuum equal to or beyond the barometer (got ${value} ${pressureUnitLabels[unit]})`);
  }
  return { pa: barometerPa - vacuumPa, assumedStandardBarometer: !barometer };
}

/** The vacuum a gauge would show for an absolute pressure, against a barometer in Pa. */
export function paToVacuum(pa: number, unit: VacuumUnit, barometerPa = STANDARD_ATMOSPHERE_PA): number {
  return (barometerPa - pa) / absolutePressureUnits[vacuumUnits[unit].absolute].pa;
}

export const temperatureUnits = {
  degC: { label: '°C' },
  degF: { label: '°F' },
  K: { label: 'K' },
} as const;
export type TemperatureUnit = keyof typeof temperatureUnits;

export function temperatureToK(value: number, unit: TemperatureUnit, field = 'temperature'): number {
  requireFinite(field, value);
  const kelvin = unit === 'K' ? value : unit === 'degC' ? value + 273.15 : ((value - 32) * 5) / 9 + 273.15;
  if (kelvin <= 0) throw new CalcInputError(field, `is below absolute zero (${value} ${temperatureUnits[unit].label})`);
  return kelvin;
}

export function kToTemperature(kelvin: number, unit: TemperatureUnit): number {
  if (unit === 'K') return kelvin;
  if (unit === 'degC') return kelvin - 273.15;
  return ((kelvin - 273.15) * 9) / 5 + 32;
}

/** A temperature difference in K shown as K (= °C difference) or °F difference. */
export function kDifferenceTo(kelvin: number, unit: TemperatureUnit): number {
  return unit === 'degF' ? kelvin * 1.8 : kelvin;
}

export const flowUnits = {
  m3_h: { label: 'm³/h' },
  kg_s: { label: 'kg/s' },
  gpm: { label: 'US gpm' },
} as const;
export type FlowUnit = keyof typeof flowUnits;
const US_GALLON_M3 = 3.785411784e-3; // exact by definition (231 in³)

/** Volume flows become mass flows with the water's density (kg/m³) at its temperature. */
export function flowToKgS(value: number, unit: FlowUnit, densityKgM3: number, field = 'flow'): number {
  requireFinite(field, value);
  if (value < 0) throw new CalcInputError(field, `cannot be negative (got ${value} ${flowUnits[unit].label})`);
  if (unit === 'kg_s') return value;
  const m3PerS = unit === 'm3_h' ? value / 3600 : (value * US_GALLON_M3) / 60;
  return m3PerS * densityKgM3;
}

export function kgSToFlow(kgS: number, unit: FlowUnit, densityKgM3: number): number {
  if (unit === 'kg_s') return kgS;
  const m3PerS = kgS / densityKgM3;
  return unit === 'm3_h' ? m3PerS * 3600 : (m3PerS * 60) / US_GALLON_M3;
}

/** Conductivity: 1 µS/cm = 1e-4 S/m. */
export const microSiemensPerCmToSiPerM = (value: number) => value * 1e-4;
