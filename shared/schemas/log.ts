import { z } from 'zod';
import { isValidTimeZone } from '../station-time';

const key = z.string().regex(/^[a-z][a-z0-9_]{1,39}$/, 'Lower-case letters, digits and _');
const label = z.string().trim().min(1).max(80);
const time = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'HH:mm');

export const stationSettingsSchema = z.object({
  timeZone: z.string().refine(isValidTimeZone, 'Not a known IANA time zone (e.g. Europe/Berlin)'),
  lateEntryMinutes: z.number().int().min(1).max(24 * 60),
  shiftChangeTimes: z.array(time).min(1).max(6),
  positions: z.array(z.object({ key, label })).min(1).max(20),
  categories: z.array(z.object({ key, label })).min(1).max(30),
  templates: z.array(z.object({ label, category: key, text: z.string().trim().min(1).max(500) })).max(50),
});
export type StationSettings = z.infer<typeof stationSettingsSchema>;

const text = z.string().trim().min(1, 'Write the entry').max(4000, 'At most 4 000 characters');
const isoTime = z.iso.datetime({ offset: true, message: 'Give the time as an ISO 8601 date-time' });

export const newLogEntrySchema = z.object({
  position: key,
  category: key,
  text,
  eventAt: isoTime.optional(),
  equipmentId: z.number().int().positive().nullable().optional(),
  readingSetId: z.number().int().positive().nullable().optional(),
  flagId: z.number().int().positive().nullable().optional(),
  carryToHandover: z.boolean().default(false),
});
export type NewLogEntry = z.infer<typeof newLogEntrySchema>;

export const amendLogEntrySchema = z.object({
  reason: z.string().trim().min(5, 'Say why (at least 5 characters)').max(1000),
  text,
});

export const logQuerySchema = z.object({
  position: key.optional(),
  category: key.optional(),
  authorId: z.coerce.number().int().positive().optional(),
  shiftStart: isoTime.optional(),
  limit: z.coerce.number().int().min(1).max(500).default(200),
  before: z.coerce.number().int().positive().optional(),
});

export const signReviewSchema = z.object({ position: key, shiftStart: isoTime });

export const standingOrderSchema = z
  .object({
    title: z.string().trim().min(3, 'Give the order a title').max(200),
    bodyHtml: z.string().min(1, 'Write the order').max(100_000, 'The order is too long'),
    effectiveFrom: isoTime,
    effectiveTo: isoTime.nullable().optional(),
    crewIds: z.array(z.number().int().positive()).max(20).default([]),
    positions: z.array(key).max(20).default([]),
  })
  .refine((o) => !o.effectiveTo || new Date(o.effectiveTo) > new Date(o.effectiveFrom), { path: ['effectiveTo'], message: 'Must be after the start' });

export const orderQuerySchema = z.object({
  state: z.enum(['in_force', 'archived', 'all']).default('in_force'),
  q: z.string().trim().max(200).optional(),
});

export const newConditionSchema = z
  .object({
    title: z.string().trim().min(3, 'Name the condition').max(200),
    requiredAction: z.string().trim().min(3, 'Say what must be done').max(2000),
    startedAt: isoTime,
    limitHours: z.number().positive('Give the time allowed').max(24 * 365).optional(),
    limitAt: isoTime.optional(),
    ownerId: z.number().int().positive({ message: 'Choose the owner' }),
  })
  .refine((c) => c.limitHours !== undefined || c.limitAt !== undefined, { path: ['limitHours'], message: 'Give the time allowed or the deadline' });

export const closeConditionSchema = z.object({
  text: z.string().trim().min(3, 'Write the closing entry').max(4000),
  position: key,
  version: z.number().int().nonnegative(),
});
