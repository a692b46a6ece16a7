import { z } from 'zod';
import './messages';
import { checkKeys, type CheckKey } from '../calc/check-catalog';

export const trendQuerySchema = z
  .object({
    parameters: z
      .string()
      .transform((s) => s.split(',').filter(Boolean))
      .pipe(z.array(z.enum(checkKeys as [CheckKey, ...CheckKey[]], { message: 'Unknown parameter' })).min(1, 'Choose a parameter').max(4, 'At most 4 parameters')),
    from: z.iso.datetime({ offset: true }),
    to: z.iso.datetime({ offset: true }),
  })
  .refine((q) => new Date(q.from) < new Date(q.to), { path: ['to'], message: 'The end must be after the start' })
  .refine((q) => new Date(q.to).getTime() - new Date(q.from).getTime() <= 3 * 366 * 86_400_000, { path: ['from'], message: 'At most three years at a time' });
