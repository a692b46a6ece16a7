import type { z } from 'zod';
import { ValidationError, fieldErrorsFromZod } from './errors';

// Half of a UTF-16 pair without its other half: JavaScript strings allow it, but it is no character,
// MariaDB's JSON check (the audit row) and any UTF-8 column refuse it.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
export const UNSTORABLE_TEXT = 'Contains a character that cannot be stored (a broken symbol, often left by copy and paste); retype this text';
const MAX_DEPTH = 32;

export const hasUnstorableText = (text: string) => LONE_SURROGATE.test(text);

/**
 * The first place in untrusted input (keys and strings, at any depth) that cannot be stored, as
 * `{ field, message }`; null when all is well. Walks without recursion, so deep input cannot
 * exhaust the stack.
 */
export function findUnstorableInput(input: unknown): { field: string; message: string } | null {
  const pending: { value: unknown; path: string[] }[] = [{ value: input, path: [] }];
  while (pending.length) {
    const { value, path } = pending.pop()!;
    if (typeof value === 'string') {
      if (hasUnstorableText(value)) return { field: path.join('.') || '_', message: UNSTORABLE_TEXT };
    } else if (value && typeof value === 'object') {
      if (path.length >= MAX_DEPTH) return { field: path.join('.'), message: 'This is nested far deeper than any form sends; reload the page and try again' };
      for (const [key, inner] of Object.entries(value)) {
        if (hasUnstorableText(key)) return { field: path.join('.') || '_', message: UNSTORABLE_TEXT };
        pending.push({ value: inner, path: [...path, key] });
      }
    }
  }
  return null;
}

function refuseUnstorable(input: unknown) {
  const found = findUnstorableInput(input);
  if (found) throw new ValidationError({ [found.field]: found.message });
}

/** Parses untrusted input with a shared zod schema; a failure becomes a 400 with field messages. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  // Every body and query passes here, after sign-in and role are checked: the one place to refuse
  // text the database would reject (it would otherwise fail as a 500 in the audit row).
  refuseUnstorable(input);
  const result = schema.safeParse(input ?? {});
  if (!result.success) throw new ValidationError(fieldErrorsFromZod(result.error));
  return result.data;
}

export function parseId(raw: unknown, what = 'id'): number {
  const id = Number(raw);
  if (!Number.isInteger(id) || id <= 0) throw new ValidationError({ [what]: 'The address points at no record (its number is not valid); go back and follow the link again' });
  return id;
}
