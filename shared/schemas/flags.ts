import { z } from 'zod';
import './messages';
import { checkKeySchema } from './readings';

const text = (what: string) => z.string().trim().min(3, `Write the ${what} (at least 3 characters)`).max(2000);

export const raiseFlagSchema = z.object({
  parameter: checkKeySchema,
  severity: z.enum(['watch', 'alarm'], { message: 'Choose watch or alarm' }),
  comment: text('comment'),
  readingSetId: z.number().int().positive().nullable().optional(),
});
export type RaiseFlagInput = z.infer<typeof raiseFlagSchema>;

export const assignFlagSchema = z.object({
  assignedTo: z.number().int().positive({ message: 'Choose who follows it up' }),
  followUp: text('follow-up'),
  version: z.number().int().nonnegative(),
});
export type AssignFlagInput = z.infer<typeof assignFlagSchema>;

export const clearFlagSchema = z.object({ comment: text('closing comment'), version: z.number().int().nonnegative() });
export type ClearFlagInput = z.infer<typeof clearFlagSchema>;

export const flagQuerySchema = z.object({
  status: z.enum(['open', 'cleared', 'all']).default('open'),
  severity: z.enum(['watch', 'alarm']).optional(),
  parameter: checkKeySchema.optional(),
  from: z.iso.datetime({ offset: true }).optional(),
  to: z.iso.datetime({ offset: true }).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(200),
});
