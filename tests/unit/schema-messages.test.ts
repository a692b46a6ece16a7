// Every message the shared schemas can give is in the words a person sees: walked over every exported
// schema with empty, missing, wrong-typed, too-long and out-of-range input, no message names an
// internal field (`crewIds`, `bodyHtml: …`) or reads like a parser ("Invalid input", "expected",
// "ISO", ">=").
import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import * as auth from '../../shared/schemas/auth';
import * as flags from '../../shared/schemas/flags';
import * as handovers from '../../shared/schemas/handovers';
import * as imports from '../../shared/schemas/imports';
import * as log from '../../shared/schemas/log';
import * as logbook from '../../shared/schemas/logbook';
import * as plant from '../../shared/schemas/plant';
import * as readingSet from '../../shared/schemas/reading-set';
import * as readings from '../../shared/schemas/readings';
import * as shiftCondenser from '../../shared/schemas/shift-condenser';
import * as training from '../../shared/schemas/training';
import * as trends from '../../shared/schemas/trends';
import { fieldLabel, fieldLabels } from '../../shared/schemas/field-labels';

type Def = { type: string; [k: string]: unknown };
const defOf = (schema: unknown) => (schema as { _zod: { def: Def } })._zod.def;
const isSchema = (v: unknown): v is z.ZodType => Boolean(v && typeof v === 'object' && '_zod' in v);

const modules = { auth, flags, handovers, imports, log, logbook, plant, readingSet, readings, shiftCondenser, training, trends };
const schemas = Object.entries(modules).flatMap(([m, exports]) =>
  Object.entries(exports as Record<string, unknown>)
    .filter(([, v]) => isSchema(v))
    .map(([name, v]) => [`${m}.${name}`, v as z.ZodType] as const),
);

const huge = 'x'.repeat(300_000);

/** Inputs for one schema: missing, wrong types, empty, too long, out of range, and (for objects) the same inside. */
function variants(schema: unknown, depth = 0): unknown[] {
  const def = defOf(schema);
  const wrong = [undefined, null, 12345, 'not it', true, [], {}, '', '   ', huge, -1, 0.5, 1e308, -1e308, [1, 2, 3]];
  if (depth > 6) return wrong;
  switch (def.type) {
    case 'optional':
    case 'nullable':
    case 'default':
    case 'prefault':
    case 'readonly':
    case 'nonoptional':
    case 'catch':
      return variants(def.innerType, depth);
    case 'pipe':
      return variants(def.in, depth);
    case 'object': {
      const shape = def.shape as Record<string, unknown>;
      const inner = Object.fromEntries(Object.entries(shape).map(([k, v]) => [k, variants(v, depth + 1)]));
      const longest = Math.max(1, ...Object.values(inner).map((list) => list.length));
      const objects = Array.from({ length: longest }, (_, i) => Object.fromEntries(Object.entries(inner).map(([k, list]) => [k, list[i % list.length]])));
      return [...wrong, ...objects];
    }
    case 'array':
      return [...wrong, ...variants(def.element, depth + 1).map((v) => [v]), Array.from({ length: 100 }, () => 'x')];
    case 'tuple':
      return [...wrong, (def.items as unknown[]).map((item) => variants(item, depth + 1)[2])];
    case 'record': {
      const keys = (defOf(def.keyType) as { entries?: Record<string, string> }).entries;
      const values = variants(def.valueType, depth + 1);
      return [...wrong, ...(keys ? values.map((v) => Object.fromEntries(Object.keys(keys).map((k) => [k, v]))) : []), { notAKey: 1 }];
    }
    default:
      return wrong;
  }
}

/** Every object key a schema knows, at any depth. */
function keysOf(schema: unknown, depth = 0, found = new Set<string>()): Set<string> {
  if (depth > 8) return found;
  const def = defOf(schema);
  for (const inner of [def.innerType, def.in, def.element, def.valueType]) if (isSchema(inner)) keysOf(inner, depth + 1, found);
  if (def.type === 'object') {
    for (const [k, v] of Object.entries(def.shape as Record<string, unknown>)) {
      found.add(k);
      keysOf(v, depth + 1, found);
    }
  }
  return found;
}

// zod's own wording ("expected string, received number", "expected array to have >=1 items"); a label
// such as "Backpressure deviation (actual − expected)" is the label a person sees, and fine.
const parserWords = [/invalid input/i, /\bexpected (a |an )?[\w<>=]+(,| to )/, /\bISO\b/, />=|<=/, /received/i, /too (small|big):/i, /unrecognized key/i, /NaN|Infinity/, /\b[A-Za-z]+_[A-Za-z_]+\b/ /* an internal value such as shift_lead or kPa_a */];

describe('shared schema messages', () => {
  it('finds the shared schemas', () => {
    expect(schemas.length).toBeGreaterThan(30);
  });

  for (const [name, schema] of schemas) {
    it(`${name}: every message is in a person's words`, () => {
      const keys = [...keysOf(schema)];
      // A name a person would never type: camelCase or snake_case (plain words like "question" are also the label).
      const internal = keys.filter((k) => (/[A-Z_]/.test(k.slice(1)) || /[a-z][A-Z]/.test(k)) && fieldLabels[k] !== k);
      const messages = new Set<string>();
      for (const input of variants(schema)) {
        const result = schema.safeParse(input);
        for (const issue of result.error?.issues ?? []) messages.add(issue.message);
      }
      expect(messages.size, 'the walk produced no errors at all').toBeGreaterThan(0);
      for (const message of messages) {
        for (const word of parserWords) expect(message, message).not.toMatch(word);
        for (const key of internal) expect(message, `${message} names ${key}`).not.toContain(key);
        for (const key of keys) expect(message.startsWith(`${key}:`), `${message} starts with ${key}:`).toBe(false);
      }
    });
  }

  it('has a label for every field any shared schema takes', () => {
    const keys = new Set(schemas.flatMap(([, s]) => [...keysOf(s)]));
    const missing = [...keys].filter((k) => !(k in fieldLabels) && fieldLabel(k) === 'This field');
    expect(missing).toEqual([]);
  });

  it('says which field is missing in an empty round, question and log entry', () => {
    const messages = (schema: z.ZodType, input: unknown) => Object.fromEntries((schema.safeParse(input).error?.issues ?? []).map((i) => [i.path.join('.'), i.message]));
    expect(messages(readings.recordReadingSchema, {})).toMatchObject({
      pressure: 'Condenser pressure is missing',
      hotwellTemperature: 'Hotwell temperature is missing',
      cwInletTemperature: 'CW inlet temperature is missing',
    });
    expect(messages(handovers.questionSchema, {})).toEqual({ question: 'Question is missing' });
    expect(messages(log.newLogEntrySchema, { position: 'control_room', category: 'operation' })).toEqual({ text: 'Entry text is missing' });
    expect(messages(handovers.crewSwapSchema, { shiftStart: '', crewId: 0, reason: 'Training day' })).toEqual({ shiftStart: 'Shift starting is missing', crewId: 'Crew: choose one' });
    expect(messages(handovers.crewRotationSchema, { anchorShiftStart: 'tomorrow', crewIds: [] })).toEqual({
      anchorShiftStart: 'First shift of the rotation must be a date and time',
      crewIds: 'Crews: choose at least one',
    });
  });
});

describe('field labels', () => {
  it('reads paths from their meaningful end and never returns an internal name', () => {
    expect(fieldLabel('pressure.value')).toBe('Condenser pressure');
    expect(fieldLabel('tower.stationPressure.unit')).toBe('Station pressure unit');
    expect(fieldLabel('limits.ttd.highWatch')).toBe('Terminal temperature difference (TTD), high watch');
    expect(fieldLabel('design.backpressureCorrection.2.0')).toBe('Backpressure correction curve');
    expect(fieldLabel('_')).toBe('');
    // Names that exist on every object are not labels (hostile input uses them as field names).
    for (const name of ['hasOwnProperty', 'constructor', '__proto__', 'toString', 'someUnknownKey']) expect(fieldLabel(name)).toBe('This field');
  });
});
