import { z } from 'zod';
import './messages';
import { checkKeys, type CheckKey } from '../calc/check-catalog';
import { plausibleKeys } from '../calc/plausibility';
import { readingSetInputSchema } from './reading-set';
import { offlineRecordFields } from './offline-record';

/**
 * The readings and checks the person has seen outside the plausible range and confirmed; the server
 * refuses the round when anything else is outside, so a confirmation covers only what was shown.
 */
const confirmOutsidePlausible = z.array(z.enum(plausibleKeys, { message: 'Unknown reading' })).max(plausibleKeys.length).optional();

/** A round as recorded: the readings plus when they were taken (defaults to now on the server). */
export const recordReadingSchema = readingSetInputSchema.omit({ unitId: true }).extend({
  takenAt: z.iso.datetime({ offset: true }).optional(),
  confirmOutsidePlausible,
  // Sent by a device that kept the round offline; the reading's time is then the time entered.
  ...offlineRecordFields,
});
export type RecordReadingInput = z.infer<typeof recordReadingSchema>;

export const amendReadingSchema = z.object({
  reason: z.string().trim().min(5, 'Say why the reading is corrected (at least 5 characters)').max(1000),
  reading: readingSetInputSchema.omit({ unitId: true }),
  confirmOutsidePlausible,
});
export type AmendReadingInput = z.infer<typeof amendReadingSchema>;

export const checkKeySchema = z.enum(checkKeys as [CheckKey, ...CheckKey[]], { message: 'Unknown parameter' });
