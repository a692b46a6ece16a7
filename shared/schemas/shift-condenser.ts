import { z } from 'zod';
import './messages';

export const shiftCondenserQuerySchema = z.object({
  shiftStart: z.iso.datetime({ offset: true }).optional(),
});
export type ShiftCondenserQuery = z.infer<typeof shiftCondenserQuerySchema>;
