import { z } from 'zod';

export const shiftCondenserQuerySchema = z.object({
  shiftStart: z.iso.datetime({ offset: true, message: 'Give the shift start as an ISO 8601 date-time, e.g. 2026-03-10T05:00:00Z' }).optional(),
});
export type ShiftCondenserQuery = z.infer<typeof shiftCondenserQuerySchema>;
