import { z } from 'zod';
import './messages';

export const handoverItemKinds = ['equipment', 'abnormal_reading', 'condition', 'log_entry', 'standing_order', 'work_in_progress', 'chemistry', 'follow_up'] as const;

/**
 * A key the browser makes once per thing the person means to create; sending it twice (a double
 * click, a retry after a lost answer) creates one record.
 */
export const clientKeySchema = z
  .string()
  .regex(/^[A-Za-z0-9-]{8,64}$/, 'The request key is not valid; reload the page')
  .optional();

export const saveNotesSchema = z.object({
  html: z.string().max(200_000, 'The notes are too long'),
  version: z.number().int().nonnegative(),
});

export const newHandoverItemSchema = z.object({
  kind: z.enum(['equipment', 'work_in_progress', 'chemistry', 'follow_up'], { message: 'Choose what kind of item this is' }),
  title: z.string().trim().min(3, 'Say what it is (at least 3 characters)').max(300),
  detail: z.string().trim().max(4000).nullable().optional(),
  reference: z.string().trim().max(80).nullable().optional(),
  priority: z.enum(['low', 'normal', 'high']).default('normal'),
  clientKey: clientKeySchema,
});

/** A draft item's edit: any of its words and its priority, under its version. */
export const editHandoverItemSchema = z.object({
  title: z.string().trim().min(3, 'Say what it is (at least 3 characters)').max(300).optional(),
  detail: z.string().trim().max(4000, 'At most 4000 characters').nullable().optional(),
  priority: z.enum(['low', 'normal', 'high'], { message: 'Choose a priority' }).optional(),
  version: z.number({ message: 'Reload the page and try again' }).int().positive(),
});

export const handoverAmendmentSchema = z.object({
  itemId: z.number().int().positive().nullable().optional(),
  reason: z.string().trim().min(5, 'Say why (at least 5 characters)').max(1000),
  text: z.string().trim().min(1, 'Write the amendment').max(4000).meta({ title: 'Amendment' }),
  clientKey: clientKeySchema,
});

/** A file added after submit is an amendment: it needs a reason like any other. */
export const attachmentReasonSchema = z.object({
  reason: z.string().trim().min(5, 'Say why the file is added now (at least 5 characters)').max(1000).optional(),
});

export const questionSchema = z.object({ question: z.string().trim().min(3, 'Ask the question').max(2000), clientKey: clientKeySchema });
export const answerSchema = z.object({ answer: z.string().trim().min(1, 'Write the answer').max(2000) });

export const crewRotationSchema = z.object({
  anchorShiftStart: z.iso.datetime({ offset: true }),
  crewIds: z.array(z.number().int().positive()).min(1).max(12),
});
export const crewSwapSchema = z.object({
  shiftStart: z.iso.datetime({ offset: true }),
  crewId: z.number().int().positive(),
  reason: z.string().trim().min(3, 'Say why').max(500),
});
