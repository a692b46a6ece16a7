import { z } from 'zod';
import './messages';
import { checkKeys, type CheckKey } from '../calc/check-catalog';
import { readingSetInputSchema } from './reading-set';

/** A round as recorded: the readings plus when they were taken (defaults to now on the server). */
export const recordReadingSchema = readingSetInputSchema.omit({ unitId: true }).extend({
  takenAt: z.iso.datetime({ offset: true }).optional(),
});
export type RecordReadingInput = z.infer<typeof recordReadingSchema>;

export const amendReadingSchema = z.object({
  reason: z.string().trim().min(5, 'Say why the reading is corrected (at least 5 characters)').max(1000),
  reading: readingSetInputSchema.omit({ unitId: true }),
});
export type AmendReadingInput = z.infer<typeof amendReadingSchema>;

export const checkKeySchema = z.enum(checkKeys as [CheckKey, ...CheckKey[]], { message: 'Unknown parameter' });
