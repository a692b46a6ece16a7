import type { z } from 'zod';
import { ValidationError, fieldErrorsFromZod } from './errors';

/** Parses untrusted input with a shared zod schema; a failure becomes a 400 with field messages. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  const result = schema.safeParse(input ?? {});
  if (!result.success) throw new ValidationError(fieldErrorsFromZod(result.error));
  return result.data;
}

export function parseId(raw: unknown, what = 'id'): number {
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) throw new ValidationError({ [what]: 'Must be a positive whole number' });
  return id;
}
