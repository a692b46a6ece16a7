// Plausible ranges as a person reads them: each reading or check outside its range, in the units
// the round was typed in, on the box it came from (the server's field message and the form's
// confirmation say the same), and the units the plant setup page edits the ranges in.
import { designSteamFlowKgS, plausibleCatalog, type OutsidePlausible, type PlausibleKey } from './calc/plausibility';
import { waterDensity } from './calc/water';
import type { ReadingSetInput } from './schemas/reading-set';
import {
  absolutePressureUnits,
  isVacuumUnit,
  kDifferenceTo,
  kToTemperature,
  kgSToFlow,
  paToAbsolutePressure,
  temperatureUnits,
  vacuumUnits,
  type AbsolutePressureUnit,
  type FlowUnit,
  type PressureUnit,
  type TemperatureUnit,
} from './units';

/** Enough digits to tell a slipped decimal from a real reading, no more. */
const shown = (value: number) => Number(value.toPrecision(4)).toLocaleString('en-GB', { maximumFractionDigits: 3 });

type Raw = Pick<ReadingSetInput, 'pressure' | 'hotwellTemperature' | 'cwInletTemperature' | 'cwFlow' | 'steamFlow'>;
type Design = { designCwFlowKgS: number; designDutyW: number };

/** The form box each range belongs to; a check's range lands on the reading most likely at fault. */
export function fieldOf(key: PlausibleKey, raw: Pick<Raw, 'cwFlow'>): string {
  const flowField = raw.cwFlow ? 'cwFlow.value' : 'steamFlow.value';
  const fields: Record<PlausibleKey, string> = {
    backpressure: 'pressure.value',
    hotwellTemperature: 'hotwellTemperature.value',
    cwInletTemperature: 'cwInletTemperature.value',
    cwFlow: 'cwFlow.value',
    steamFlow: 'steamFlow.value',
    subcooling: 'hotwellTemperature.value',
    ttd: 'cwOutletTemperature.value',
    cwRise: 'cwOutletTemperature.value',
    tubeVelocity: flowField,
    cleanlinessFactor: flowField,
    towerApproach: 'tower.coldWaterTemperature.value',
    pH: 'chemistry.pH',
    cycles: 'tower.basinConductivity.value',
  };
  return fields[key];
}

/** SI → the unit of the round, for one range's kind. */
function inRoundUnits(item: OutsidePlausible, raw: Raw, cwInletK: number): { convert: (si: number) => number; unit: string } {
  const temperatureUnit = raw.hotwellTemperature.unit as TemperatureUnit;
  switch (item.key) {
    case 'backpressure': {
      const typed = raw.pressure.unit as PressureUnit;
      const unit: AbsolutePressureUnit = isVacuumUnit(typed) ? vacuumUnits[typed].absolute : typed;
      return { convert: (pa) => paToAbsolutePressure(pa, unit), unit: absolutePressureUnits[unit].label };
    }
    case 'hotwellTemperature':
    case 'cwInletTemperature':
      return { convert: (k) => kToTemperature(k, temperatureUnit), unit: temperatureUnits[temperatureUnit].label };
    case 'cwFlow': {
      const unit = (raw.cwFlow?.unit ?? 'm3_h') as FlowUnit;
      const density = waterDensity(Math.min(Math.max(cwInletK, 273.15), 373.15));
      return { convert: (kgS) => kgSToFlow(kgS, unit, density), unit: unit === 'm3_h' ? 'm³/h' : unit === 'kg_s' ? 'kg/s' : 'US gpm' };
    }
    case 'steamFlow':
      return raw.steamFlow?.unit === 'kg_s' ? { convert: (kgS) => kgS, unit: 'kg/s' } : { convert: (kgS) => (kgS * 3600) / 1000, unit: 't/h' };
    case 'subcooling':
    case 'ttd':
    case 'cwRise':
    case 'towerApproach':
      return { convert: (k) => kDifferenceTo(k, temperatureUnit), unit: temperatureUnit === 'degF' ? '°F' : 'K' };
    case 'tubeVelocity':
      return { convert: (v) => v, unit: 'm/s' };
    default:
      return { convert: (v) => v, unit: '' };
  }
}

export type ImplausibleNotice = { key: PlausibleKey; field: string; message: string };

/**
 * "CW flow 90,000 m³/h is outside the plausible range for this unit (10,800–70,200 m³/h, 20–130 %
 * of design flow). Check the instrument and the reading."
 */
export function describeImplausible(items: OutsidePlausible[], raw: Raw, cwInletK: number, design: Design): ImplausibleNotice[] {
  return items.map((item) => {
    const { convert, unit } = inRoundUnits(item, raw, cwInletK);
    const u = unit ? ` ${unit}` : '';
    let ofDesign = '';
    if (item.key === 'cwFlow' || item.key === 'steamFlow') {
      const designSi = item.key === 'cwFlow' ? design.designCwFlowKgS : designSteamFlowKgS(design);
      ofDesign = `, ${shown((item.low / designSi) * 100)}–${shown((item.high / designSi) * 100)} % of design flow`;
    }
    const message =
      `${item.label} ${shown(convert(item.value))}${u} is outside the plausible range for this unit ` +
      `(${shown(convert(item.low))}–${shown(convert(item.high))}${u}${ofDesign}). Check the instrument and the reading.`;
    return { key: item.key, field: fieldOf(item.key, raw), message };
  });
}

/** Several notices on one box read as one message. */
export function noticesByField(notices: ImplausibleNotice[], suffix = ''): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const n of notices) fields[n.field] = fields[n.field] ? `${fields[n.field]} ${n.message}` : n.message;
  if (suffix) for (const field of Object.keys(fields)) fields[field] = `${fields[field]} ${suffix}`;
  return fields;
}

/** The units the plant setup page edits each range in; every one is linear, shown = k·SI + c. */
export function plausibleSettingUnits(key: PlausibleKey): { unit: string; toShown: (si: number) => number; toSi: (value: number) => number } {
  const exact = (v: number) => Number(v.toFixed(6));
  switch (plausibleCatalog[key].kind) {
    case 'pressure':
      return { unit: 'kPa a', toShown: (pa) => exact(pa / 1000), toSi: (kPa) => kPa * 1000 };
    case 'temperature':
      return { unit: '°C', toShown: (k) => exact(k - 273.15), toSi: (c) => exact(c + 273.15) };
    case 'temperature_difference':
      return { unit: 'K', toShown: exact, toSi: (k) => k };
    case 'design_fraction':
      return { unit: '% of design', toShown: (f) => exact(f * 100), toSi: (p) => exact(p / 100) };
    case 'velocity':
      return { unit: 'm/s', toShown: exact, toSi: (v) => v };
    case 'ph':
      return { unit: '(pH)', toShown: exact, toSi: (v) => v };
    default:
      return { unit: '(ratio)', toShown: exact, toSi: (v) => v };
  }
}
