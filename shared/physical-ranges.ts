// Physical ranges of the readings a round takes: a value outside one cannot be a real reading of
// this plant (water that is not liquid, more flow than any condenser has), so it is refused with a
// message in the words and unit the person typed. Checked in the shared contract, so the form
// shows the same message as the server. (Plausible ranges, which only ask for confirmation, are
// per unit: shared/calc/plausibility.ts.)
import {
  absolutePressureUnits,
  flowUnits,
  kToTemperature,
  temperatureUnits,
  vacuumUnits,
  type AbsolutePressureUnit,
  type FlowUnit,
  type TemperatureUnit,
  type VacuumUnit,
} from './units';

/** Triple point of water, 611.657 Pa (IAPWS R7-97): below it there is no liquid to condense into. */
export const TRIPLE_POINT_PA = 611.657;

/** SI bounds of each kind of reading, with why. */
export const physicalRangesSi = {
  // Liquid water at up to about one atmosphere: 0–100 °C.
  waterTemperature: { low: 273.15, high: 373.15 },
  // Outdoor air at any power station; also the range of the wet-bulb calculation (ASHRAE).
  airTemperature: { low: 233.15, high: 333.15 },
  // From the triple point up to 200 kPa a: a surface condenser shell is not built to hold more than
  // about twice atmospheric (common practice, no source).
  condenserPressure: { low: TRIPLE_POINT_PA, high: 200_000 },
  // Air pressure at a plant 5 500 m up (about 50 kPa) to above the highest sea-level pressure recorded
  // (108.4 kPa, from memory).
  airPressure: { low: 50_000, high: 110_000 },
  // Volume flow of water, m³/s: 1 000 000 m³/h is several times any single unit's CW system
  // (common practice, no source).
  waterFlowM3S: { low: 0, high: 1_000_000 / 3600 },
  // Exhaust steam, kg/s: 20 000 t/h is several times the largest turbine's exhaust (common practice, no source).
  steamFlowKgS: { low: 0, high: (20_000 * 1000) / 3600 },
  // Air removed, kg/s: 10 000 kg/h would be no vacuum at all (common practice, no source).
  airFlowKgS: { low: 0, high: 10_000 / 3600 },
  // Air-saturated water at 0 °C holds about 14.6 mg/L of oxygen (solubility tables, from memory).
  dissolvedOxygenPpb: { low: 0, high: 15_000 },
  // Pure water (0.055 µS/cm at 25 °C) to above seawater brines.
  conductivityUsCm: { low: 0.05, high: 200_000 },
} as const;

export type RangeInUnit = { low: number; high: number; unit: string };

/** Bounds are rounded as a person reads them, and the check uses the rounded figures, so the message and the check agree. */
const roundTemperature = (v: number) => Number(v.toFixed(2));
const roundOther = (v: number) => Number(v.toPrecision(3));

/** A number as the messages show it: grouped thousands, no trailing zeros. */
export function plainNumber(value: number): string {
  return Number(value.toPrecision(6)).toLocaleString('en-GB', { maximumFractionDigits: 4 });
}

export function temperatureRangeIn(kind: 'waterTemperature' | 'airTemperature', unit: TemperatureUnit): RangeInUnit {
  const r = physicalRangesSi[kind];
  return { low: roundTemperature(kToTemperature(r.low, unit)), high: roundTemperature(kToTemperature(r.high, unit)), unit: temperatureUnits[unit].label };
}

export function absolutePressureRangeIn(kind: 'condenserPressure' | 'airPressure', unit: AbsolutePressureUnit): RangeInUnit {
  const r = physicalRangesSi[kind];
  const pa = absolutePressureUnits[unit].pa;
  return { low: roundOther(r.low / pa), high: roundOther(r.high / pa), unit: absolutePressureUnits[unit].label };
}

/** Water flow bounds in the unit typed; mass and volume meet at a nominal 1000 kg/m³ (a bound, not a measurement). */
export function waterFlowRangeIn(unit: FlowUnit): RangeInUnit {
  const m3s = physicalRangesSi.waterFlowM3S.high;
  const high = unit === 'm3_h' ? m3s * 3600 : unit === 'kg_s' ? m3s * 1000 : (m3s * 60) / 3.785411784e-3;
  return { low: 0, high: roundOther(high), unit: flowUnits[unit].label };
}

export function steamFlowRangeIn(unit: 't_h' | 'kg_s'): RangeInUnit {
  const kgS = physicalRangesSi.steamFlowKgS.high;
  return { low: 0, high: roundOther(unit === 't_h' ? (kgS * 3600) / 1000 : kgS), unit: unit === 't_h' ? 't/h' : 'kg/s' };
}

export function airFlowRangeIn(unit: 'kg_h' | 'kg_s'): RangeInUnit {
  const kgS = physicalRangesSi.airFlowKgS.high;
  return { low: 0, high: roundOther(unit === 'kg_h' ? kgS * 3600 : kgS), unit: unit === 'kg_h' ? 'kg/h' : 'kg/s' };
}

export const plainRange = (kind: 'dissolvedOxygenPpb' | 'conductivityUsCm', unit: string): RangeInUnit => ({ ...physicalRangesSi[kind], unit });

/** "Hotwell temperature must be between 0 °C and 100 °C" — the bounds in the unit the person used. */
export function rangeMessage(label: string, range: RangeInUnit): string {
  const u = range.unit ? ` ${range.unit}` : '';
  return `${label} must be between ${plainNumber(range.low)}${u} and ${plainNumber(range.high)}${u}`;
}

export const isWithin = (value: number, range: RangeInUnit) => value >= range.low && value <= range.high;

/**
 * A vacuum gauge's bounds: from 0 up to what leaves the triple point's pressure against the barometer
 * (rounded down, so the figure shown is always inside).
 */
export function vacuumRangeIn(unit: VacuumUnit, barometerPa: number): RangeInUnit {
  const perUnit = absolutePressureUnits[vacuumUnits[unit].absolute].pa;
  return { low: 0, high: Math.floor(((barometerPa - TRIPLE_POINT_PA) / perUnit) * 100) / 100, unit: vacuumUnits[unit].label };
}
