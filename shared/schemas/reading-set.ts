// The contract for one round's readings: raw values with the units the operator used.
import { z } from 'zod';
import './messages';
import { fieldLabel } from './field-labels';
import { absolutePressureUnits, flowUnits, temperatureUnits, vacuumUnits } from '../units';

const keys = <T extends object>(o: T) => Object.keys(o) as [Extract<keyof T, string>, ...Extract<keyof T, string>[]];

// One number schema for every reading, so its message names the reading from where it sits.
const number = z
  .number({ error: (issue) => `${fieldLabel(issue.path ?? [])} ${issue.input === undefined || issue.input === null ? 'is missing' : 'must be a number'}` })
  .finite();
const quantity = <const U extends [string, ...string[]]>(units: U) =>
  z.object({ value: number, unit: z.enum(units) });

export const pressureUnitKeys = [...keys(absolutePressureUnits), ...keys(vacuumUnits)] as [string, ...string[]];
export const absolutePressureUnitKeys = keys(absolutePressureUnits);
export const temperatureUnitKeys = keys(temperatureUnits);
export const flowUnitKeys = keys(flowUnits);
export const steamFlowUnitKeys = ['t_h', 'kg_s'] as const;
export const airFlowUnitKeys = ['kg_h', 'kg_s'] as const;

const pressure = quantity(pressureUnitKeys as [keyof typeof absolutePressureUnits | keyof typeof vacuumUnits, ...(keyof typeof absolutePressureUnits | keyof typeof vacuumUnits)[]]);
const absolutePressure = quantity(absolutePressureUnitKeys);
const temperature = quantity(temperatureUnitKeys);
const flow = quantity(flowUnitKeys);
const optional = <T extends z.ZodType>(schema: T) => schema.nullable().optional();

export const towerReadingsSchema = z.object({
  hotWaterTemperature: optional(temperature),
  coldWaterTemperature: optional(temperature),
  wetBulbTemperature: optional(temperature),
  dryBulbTemperature: optional(temperature),
  relativeHumidityPercent: optional(number.min(0, 'Relative humidity is 0–100 %').max(100, 'Relative humidity is 0–100 %')),
  stationPressure: optional(absolutePressure),
  circulatingFlow: optional(flow),
  makeupConductivity: optional(quantity(['uS_cm'])),
  basinConductivity: optional(quantity(['uS_cm'])),
  targetCycles: optional(number.gt(1, 'Target cycles must be above 1').max(50)),
});

export const chemistrySampleSchema = z.object({
  pH: number.min(0, 'pH is 0–14').max(14, 'pH is 0–14'),
  temperature,
  tdsMgL: number.positive('Must be above zero'),
  calciumHardnessMgL: number.positive('Must be above zero'),
  alkalinityMgL: number.positive('Must be above zero'),
});

export const readingSetInputSchema = z.object({
  unitId: z.number().int().positive(),
  pressure,
  barometer: optional(absolutePressure),
  hotwellTemperature: temperature,
  cwInletTemperature: temperature,
  cwOutletTemperature: temperature,
  cwFlow: optional(flow),
  steamFlow: optional(quantity([...steamFlowUnitKeys])),
  airRemovalFlow: optional(quantity([...airFlowUnitKeys])),
  dissolvedOxygenPpb: optional(number.min(0, 'Cannot be negative')),
  tower: optional(towerReadingsSchema),
  chemistry: optional(chemistrySampleSchema),
});
export type ReadingSetInput = z.infer<typeof readingSetInputSchema>;
