// Plant setup contracts: a unit's design data and its limit set, both in SI.
import { z } from 'zod';
import './messages';
import { fieldLabel } from './field-labels';
import { checkKeys, type CheckKey } from '../calc/check-catalog';
import { tubeGauges, tubeMaterials } from '../calc/hei';
import { plausibleCatalog, plausibleKeys, type PlausibleKey, type PlausibleRanges } from '../calc/plausibility';
import { plausibleSettingUnits } from '../plausibility-display';

const positive = (what: string) => z.number({ message: `Enter the ${what}` }).finite().positive(`The ${what} must be above zero`);
const optionalPositive = (what: string) => positive(what).nullable().optional();

export const correctionCurveSchema = z
  .array(z.tuple([positive('backpressure'), z.number({ message: 'Enter the MW correction' }).finite()]))
  .min(2, 'Give at least two points')
  .max(50)
  .refine((points) => points.every((p, i) => i === 0 || p[0] > points[i - 1]![0]), 'Backpressures must rise from row to row');

export const unitDesignSchema = z.object({
  surfaceAreaM2: positive('surface area'),
  tubeOdMm: positive('tube OD').max(60),
  tubeGaugeBwg: z.number().int().refine((g) => (tubeGauges as readonly number[]).includes(g), `Gauge must be one of ${tubeGauges.join(', ')} BWG`),
  tubeMaterial: z.enum(tubeMaterials as [string, ...string[]]),
  tubeCount: z.number().int().positive('Enter the tube count'),
  passes: z.number().int().min(1).max(4),
  designCwFlowKgS: positive('design CW flow'),
  designCwInletK: z.number().finite().min(273.15, 'Above 0 °C').max(323.15, 'At most 50 °C'),
  designBackpressurePa: positive('design backpressure'),
  designDutyW: positive('design duty'),
  designCleanliness: z.number().finite().gt(0, 'Between 0 and 1').max(1, 'Between 0 and 1'),
  designCleanUWM2K: optionalPositive('data-sheet clean U').transform((v) => v ?? null),
  backpressureCorrection: correctionCurveSchema,
  energyPricePerMwh: z.number().finite().nonnegative().nullable().optional().transform((v) => v ?? null),
  currency: z.string().trim().max(8).nullable().optional().transform((v) => v || null),
  towerDesignRangeK: optionalPositive('tower design range'),
  towerDesignApproachK: optionalPositive('tower design approach'),
  towerDesignWetBulbK: z.number().finite().min(233.15).max(323.15).nullable().optional(),
});
export type UnitDesign = z.infer<typeof unitDesignSchema> & { tubeMaterial: import('../calc/hei').TubeMaterial };

// A limit is a number or absent. null is refused: it is what a box holding "1O" became in JSON, and
// taking it as "no limit" silently deleted that limit.
const limit = z
  .number({ error: (issue) => `${fieldLabel(issue.path ?? [])} must be a number; leave the box empty for no limit` })
  .finite()
  .optional();
export const limitBandSchema = z
  .object({ lowAlarm: limit, lowWatch: limit, highWatch: limit, highAlarm: limit })
  .refine((b) => b.lowAlarm == null || b.lowWatch == null || b.lowAlarm <= b.lowWatch, { message: 'Low alarm must be at or below low watch', path: ['lowAlarm'] })
  .refine((b) => b.highAlarm == null || b.highWatch == null || b.highAlarm >= b.highWatch, { message: 'High alarm must be at or above high watch', path: ['highAlarm'] })
  .refine((b) => b.lowWatch == null || b.highWatch == null || b.lowWatch < b.highWatch, { message: 'Low watch must be below high watch', path: ['lowWatch'] });

export const limitSetSchema = z.partialRecord(z.enum(checkKeys as [CheckKey, ...CheckKey[]]), limitBandSchema);

/** One plausible range in SI; messages in the units the setup page shows. */
const plausibleRangeSchema = (key: PlausibleKey) => {
  const { label, settable } = plausibleCatalog[key];
  const units = plausibleSettingUnits(key);
  const end = z.number({ message: 'Enter a number' }).finite('Enter a number');
  const allowed = `${units.toShown(settable.low)} to ${units.toShown(settable.high)} ${units.unit}`;
  return z
    .object({ low: end, high: end })
    .refine((r) => r.low >= settable.low && r.low <= settable.high, { path: ['low'], message: `The low end of ${label} must lie within ${allowed}` })
    .refine((r) => r.high >= settable.low && r.high <= settable.high, { path: ['high'], message: `The high end of ${label} must lie within ${allowed}` })
    .refine((r) => r.low < r.high, { path: ['high'], message: `The high end of ${label} must be above its low end` });
};
export const plausibleRangesSchema = z.object(
  Object.fromEntries(plausibleKeys.map((key) => [key, plausibleRangeSchema(key)])) as Record<PlausibleKey, ReturnType<typeof plausibleRangeSchema>>,
) as unknown as z.ZodType<PlausibleRanges>;

/** A piece of equipment on a unit: what the log's picker and the handover name by its tag. */
export const equipmentSchema = z.object({
  kind: z.enum(['condenser', 'cw_pump', 'cooling_tower', 'air_removal', 'other'], { message: 'Choose a kind of equipment' }),
  tag: z.string().trim().min(1, 'Enter the tag').max(32).regex(/^[A-Za-z0-9][A-Za-z0-9_.\-/]*$/, 'Letters, digits and - _ . / only'),
  name: z.string().trim().min(2, 'Enter a name').max(120),
});

export const newDesignVersionSchema = z.object({ design: unitDesignSchema, note: z.string().trim().min(3, 'Say what changed and why').max(500) });
export const newLimitVersionSchema = z.object({ limits: limitSetSchema, note: z.string().trim().min(3, 'Say what changed and why').max(500) });
export const newPlausibleVersionSchema = z.object({ ranges: plausibleRangesSchema, note: z.string().trim().min(3, 'Say what changed and why').max(500) });

/** A unit as pickers and pages list it, with its station's time zone (times are shown and typed in it). */
export type UnitSummary = { id: number; code: string; name: string; stationId: number; station: string; timeZone: string };
