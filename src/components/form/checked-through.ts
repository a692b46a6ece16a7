// The zod half of throughContract (schema-form.tsx), loaded with the contract it wraps.
import { z } from 'zod';
import type { Fail } from './schema-form';

export function checkedThrough<TForm, TSchema extends z.ZodType>(toWire: (values: TForm, fail: Fail) => unknown, schema: TSchema, fieldFor: (path: string) => string | undefined) {
  return z.custom<TForm>(() => true).transform((values, ctx): z.output<TSchema> => {
    const failed = new Set<string>();
    const wire = toWire(values, (field, message) => {
      failed.add(field);
      ctx.addIssue({ code: 'custom', message, path: field.split('.') });
    });
    const parsed = schema.safeParse(wire);
    if (parsed.success && !failed.size) return parsed.data;
    for (const issue of parsed.error?.issues ?? []) {
      const path = issue.path.join('.');
      const field = fieldFor(path) ?? path;
      if (failed.has(field)) continue;
      failed.add(field);
      ctx.addIssue({ code: 'custom', message: issue.message, path: field ? field.split('.') : [] });
    }
    return z.NEVER;
  });
}
