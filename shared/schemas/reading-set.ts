// The contract for one round's readings: raw values with the units the operator used. Each reading
// is held to its physical range (shared/physical-ranges.ts) here, so the form and the server refuse
// the same values with the same words.
import { z } from 'zod';
import './messages';
import { fieldLabel } from './field-labels';
import {
  absolutePressureRangeIn,
  airFlowRangeIn,
  isWithin,
  plainRange,
  rangeMessage,
  steamFlowRangeIn,
  temperatureRangeIn,
  waterFlowRangeIn,
  type RangeInUnit,
} from '../physical-ranges';
import { absolutePressureUnits, flowUnits, temperatureUnits, vacuumUnits, type AbsolutePressureUnit, type FlowUnit, type TemperatureUnit } from '../units';

const keys = <T extends object>(o: T) => Object.keys(o) as [Extract<keyof T, string>, ...Extract<keyof T, string>[]];

// One number schema for every reading, so its message names the reading from where it sits.
const number = z
  .number({ error: (issue) => `${fieldLabel(issue.path ?? [])} ${issue.input === undefined || issue.input === null ? 'is missing' : 'must be a number'}` })
  .finite();
const quantity = <const U extends [string, ...string[]]>(units: U) =>
  z.object({ value: number, unit: z.enum(units) });

/** A quantity whose value must lie in its physical range, worked out for the unit it came in. */
const bounded = <const U extends [string, ...string[]]>(units: U, label: string, rangeIn: (unit: U[number]) => RangeInUnit | null) =>
  quantity(units).superRefine((q, ctx) => {
    const range = rangeIn(q.unit);
    if (range && !isWithin(q.value, range)) ctx.addIssue({ code: 'custom', path: ['value'], message: rangeMessage(label, range) });
  });
const plainBounded = (label: string, range: RangeInUnit) =>
  number.refine((v) => isWithin(v, range), { message: rangeMessage(label, range) });

export const pressureUnitKeys = [...keys(absolutePressureUnits), ...keys(vacuumUnits)] as [string, ...string[]];
export const absolutePressureUnitKeys = keys(absolutePressureUnits);
export const temperatureUnitKeys = keys(temperatureUnits);
export const flowUnitKeys = keys(flowUnits);
export const steamFlowUnitKeys = ['t_h', 'kg_s'] as const;
export const airFlowUnitKeys = ['kg_h', 'kg_s'] as const;

type PressureKey = keyof typeof absolutePressureUnits | keyof typeof vacuumUnits;
// A vacuum's bound depends on the barometer beside it, so the conversion checks that one.
const condenserPressure = bounded(pressureUnitKeys as [PressureKey, ...PressureKey[]], 'Condenser absolute pressure', (unit) =>
  unit in absolutePressureUnits ? absolutePressureRangeIn('condenserPressure', unit as AbsolutePressureUnit) : null,
);
const airPressure = (label: string) => bounded(absolutePressureUnitKeys, label, (unit) => absolutePressureRangeIn('airPressure', unit));
const waterTemperature = (label: string) => bounded(temperatureUnitKeys, label, (unit) => temperatureRangeIn('waterTemperature', unit as TemperatureUnit));
const airTemperature = (label: string) => bounded(temperatureUnitKeys, label, (unit) => temperatureRangeIn('airTemperature', unit as TemperatureUnit));
const waterFlow = (label: string) => bounded(flowUnitKeys, label, (unit) => waterFlowRangeIn(unit as FlowUnit));
const conductivity = (label: string) => bounded(['uS_cm'], label, () => plainRange('conductivityUsCm', 'µS/cm'));
const optional = <T extends z.ZodType>(schema: T) => schema.nullable().optional();

export const towerReadingsSchema = z.object({
  hotWaterTemperature: optional(waterTemperature('Tower hot-water temperature')),
  coldWaterTemperature: optional(waterTemperature('Basin (cold-water) temperature')),
  wetBulbTemperature: optional(airTemperature('Wet bulb')),
  dryBulbTemperature: optional(airTemperature('Dry bulb')),
  relativeHumidityPercent: optional(number.min(0, 'Relative humidity is 0–100 %').max(100, 'Relative humidity is 0–100 %')),
  stationPressure: optional(airPressure('Station pressure')),
  circulatingFlow: optional(waterFlow('Tower circulating flow')),
  makeupConductivity: optional(conductivity('Makeup conductivity')),
  basinConductivity: optional(conductivity('Basin conductivity')),
  targetCycles: optional(number.gt(1, 'Target cycles must be above 1').max(50, 'Target cycles must be at most 50')),
});

export const chemistrySampleSchema = z.object({
  pH: number.min(0, 'pH is 0–14').max(14, 'pH is 0–14'),
  temperature: waterTemperature('Sample temperature'),
  tdsMgL: number.positive('Must be above zero'),
  calciumHardnessMgL: number.positive('Must be above zero'),
  alkalinityMgL: number.positive('Must be above zero'),
});

export const readingSetInputSchema = z.object({
  unitId: z.number().int().positive(),
  pressure: condenserPressure,
  barometer: optional(airPressure('Barometer')),
  hotwellTemperature: waterTemperature('Hotwell temperature'),
  cwInletTemperature: waterTemperature('CW inlet temperature'),
  cwOutletTemperature: waterTemperature('CW outlet temperature'),
  cwFlow: optional(waterFlow('CW flow')),
  steamFlow: optional(bounded([...steamFlowUnitKeys], 'Exhaust steam flow', (unit) => steamFlowRangeIn(unit))),
  airRemovalFlow: optional(bounded([...airFlowUnitKeys], 'Air-removal flow', (unit) => airFlowRangeIn(unit))),
  dissolvedOxygenPpb: optional(plainBounded('Condensate dissolved oxygen', plainRange('dissolvedOxygenPpb', 'ppb'))),
  tower: optional(towerReadingsSchema),
  chemistry: optional(chemistrySampleSchema),
});
export type ReadingSetInput = z.infer<typeof readingSetInputSchema>;
