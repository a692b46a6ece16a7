import { z } from 'zod';
import './messages';
import { isValidTimeZone } from '../station-time';
import { offlineRecordFields } from './offline-record';

const key = z.string().regex(/^[a-z][a-z0-9_]{1,39}$/, 'Lower-case letters, digits and _');
const label = z.string().trim().min(1).max(80);
const time = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Shift change times: 24-hour HH:mm, e.g. 06:00');

/** A whole number of minutes in [min, max]; one message, in the admin's words, for every way it can be wrong. */
const minutes = (what: string, min: number, max: number) => {
  const message = `${what}: between ${min} and ${max} minutes`;
  return z.number({ error: message }).int(message).min(min, message).max(max, message);
};

const DAY_MINUTES = 24 * 60;
const toMinutes = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3, 5));

/** The shortest nominal shift (minutes) the change times make; a clock change adds or takes an hour on the day. */
export function shortestShiftMinutes(changeTimes: readonly string[]): number {
  const sorted = [...new Set(changeTimes.map(toMinutes))].sort((a, b) => a - b);
  if (sorted.length <= 1) return DAY_MINUTES;
  return Math.min(...sorted.map((m, i) => (i === 0 ? m + DAY_MINUTES - sorted.at(-1)! : m - sorted[i - 1]!)));
}

export const stationSettingsSchema = z
  .object({
    timeZone: z.string().refine(isValidTimeZone, 'Not a known IANA time zone (e.g. Europe/Berlin)'),
    lateEntryMinutes: minutes('Late entry', 1, DAY_MINUTES),
    shiftChangeTimes: z.array(time).min(1, 'Give at least one shift change time').max(6, 'At most 6 shift changes a day'),
    // How often a round is due. Plants differ (hourly to once a shift); 240 min is only where a station starts.
    roundIntervalMinutes: minutes('Round interval', 15, DAY_MINUTES),
    // The time around a shift change in which a handover may be submitted and accepted.
    handoverWindowBeforeMinutes: minutes('Handover window before the change', 15, 720),
    // 0 after: acceptance only before the change (a plant that turns over ahead of the hour).
    handoverWindowAfterMinutes: minutes('Handover window after the change', 0, 720),
    positions: z.array(z.object({ key, label })).min(1).max(20),
    categories: z.array(z.object({ key, label })).min(1).max(30),
    templates: z.array(z.object({ label, category: key, text: z.string().trim().min(1).max(500) })).max(50),
  })
  .superRefine((s, ctx) => {
    // Windows of neighbouring changes must not overlap, or one moment would belong to two handovers;
    // they may meet (before + after = the shift: hand over at any time in the shift).
    const shortest = shortestShiftMinutes(s.shiftChangeTimes);
    if (s.handoverWindowBeforeMinutes + s.handoverWindowAfterMinutes > shortest) {
      const message = `Handover window: before and after together must be at most the shortest shift (${shortest} minutes)`;
      for (const path of ['handoverWindowBeforeMinutes', 'handoverWindowAfterMinutes']) ctx.addIssue({ code: 'custom', path: [path], message });
    }
  });
export type StationSettings = z.infer<typeof stationSettingsSchema>;

const text = z.string().trim().min(1, 'Write the entry').max(4000, 'At most 4 000 characters');
const isoTime = z.iso.datetime({ offset: true });

export const newLogEntrySchema = z.object({
  position: key,
  category: key,
  text: text.meta({ title: 'Entry text' }),
  eventAt: isoTime.optional(),
  equipmentId: z.number().int().positive().nullable().optional(),
  readingSetId: z.number().int().positive().nullable().optional(),
  flagId: z.number().int().positive().nullable().optional(),
  carryToHandover: z.boolean().default(false),
  // Sent by a device that kept the entry offline.
  ...offlineRecordFields,
});
export type NewLogEntry = z.infer<typeof newLogEntrySchema>;

export const amendLogEntrySchema = z.object({
  reason: z.string().trim().min(5, 'Say why (at least 5 characters)').max(1000),
  text: text.meta({ title: 'Corrected text' }),
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
  text: z.string().trim().min(3, 'Write the closing entry').max(4000).meta({ title: 'Closing entry' }),
  position: key,
  version: z.number().int().nonnegative(),
});
