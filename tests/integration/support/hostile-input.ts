// Generated hostile request bodies: what a careless user, a broken client or an attacker could send.
// Bodies are JSON text built here (not JSON.stringify of objects), so `__proto__` stays an own key
// on the wire and NaN/Infinity can appear as bare tokens.
import fc from 'fast-check';

/** A JSON value as text-to-be: objects keep their keys in order and may repeat or be `__proto__`. */
export type Json = null | boolean | number | string | { arr: Json[] } | { obj: [string, Json][] };

export function toJsonText(value: Json): string {
  if (value === null || typeof value === 'boolean' || typeof value === 'string') return JSON.stringify(value);
  // JSON has no NaN or Infinity: write them bare, as a broken client would.
  if (typeof value === 'number') return Number.isFinite(value) ? JSON.stringify(value) : String(value);
  if ('arr' in value) return `[${value.arr.map(toJsonText).join(',')}]`;
  return `{${value.obj.map(([k, v]) => `${JSON.stringify(k)}:${toJsonText(v)}`).join(',')}}`;
}

/** A plain object (from a sample body) as a Json value. */
export function fromPlain(value: unknown): Json {
  if (Array.isArray(value)) return { arr: value.map(fromPlain) };
  if (value && typeof value === 'object') return { obj: Object.entries(value).map(([k, v]) => [k, fromPlain(v)]) };
  return (value ?? null) as Json;
}

const loneSurrogate = fc.integer({ min: 0xd800, max: 0xdfff }).map((code) => String.fromCharCode(code));

export const hostileString = fc.oneof(
  fc.constantFrom('', ' ', '   ', 'NaN', 'Infinity', '-Infinity', '1e309', '1O', '0x10', '__proto__', 'constructor', '\u0000', '<script>alert(1)</script>', '2026-02-30T25:61:00Z', 'null', 'true'),
  fc.tuple(fc.string({ maxLength: 6 }), loneSurrogate, fc.string({ maxLength: 6 })).map(([a, s, b]) => a + s + b),
  fc.string({ maxLength: 12, unit: 'binary' }),
  fc.constantFrom(300_001, 100_001, 4001).map((n) => 'x'.repeat(n)),
);

export const hostileNumber = fc.oneof(
  fc.constantFrom(0, -0, -1, 0.5, 1e308, -1e308, 2 ** 53 + 1, Number.MAX_SAFE_INTEGER, Number.MIN_VALUE, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);

const specialKeys = ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty', '', '\uD800'];

/** Any JSON value, up to a small depth; `keys` are the field names the app knows (so some land on real fields). */
export function hostileValue(keys: readonly string[]): fc.Arbitrary<Json> {
  const key = fc.oneof(fc.constantFrom(...keys, ...specialKeys), fc.string({ maxLength: 8 }));
  const { value } = fc.letrec<{ value: Json }>((tie) => ({
    value: fc.oneof(
      { depthSize: 'small', withCrossShrink: true },
      hostileString,
      hostileNumber,
      fc.constantFrom(null, true, false),
      fc.array(tie('value'), { maxLength: 3 }).map((arr) => ({ arr })),
      fc.array(fc.tuple(key, tie('value')), { maxLength: 4 }).map((obj) => ({ obj })),
      fc.constantFrom(50, 1_000).map((depth) => nested(depth)),
      fc.constantFrom(10_000).map((n) => ({ arr: Array.from({ length: n }, (_, i) => i) })),
    ),
  }));
  return value;
}

function nested(depth: number): Json {
  let value: Json = 1;
  for (let i = 0; i < depth; i++) value = i % 2 ? { arr: [value] } : { obj: [['a', value]] };
  return value;
}

function spikeOneString(sample: Json, pick: number, spike: string): Json {
  const strings: string[] = [];
  const walk = (v: Json) => {
    if (typeof v === 'string') strings.push(v);
    else if (v && typeof v === 'object') ('obj' in v ? v.obj.map(([, x]) => x) : v.arr).forEach(walk);
  };
  walk(sample);
  if (!strings.length) return sample;
  const target = pick % strings.length;
  let seen = -1;
  const rebuild = (v: Json): Json => {
    if (typeof v === 'string') return ++seen === target ? `${v}${spike}` : v;
    if (v && typeof v === 'object') return 'obj' in v ? { obj: v.obj.map(([k, x]) => [k, rebuild(x)]) } : { arr: v.arr.map(rebuild) };
    return v;
  };
  return rebuild(sample);
}

/** Replaces one leaf (or one whole field) of a sample body, chosen by `pick`, with `replacement`. */
export function replaceSomewhere(sample: Json, pick: number, replacement: Json): Json {
  const slots: ((v: Json) => Json)[] = [];
  const collect = (value: Json, rebuild: (v: Json) => Json) => {
    slots.push(rebuild);
    if (value && typeof value === 'object' && 'obj' in value) {
      value.obj.forEach(([k, v], i) => collect(v, (nv) => rebuild({ obj: value.obj.map((e, j) => (j === i ? [k, nv] : e)) })));
    } else if (value && typeof value === 'object' && 'arr' in value) {
      value.arr.forEach((v, i) => collect(v, (nv) => rebuild({ arr: value.arr.map((e, j) => (j === i ? nv : e)) })));
    }
  };
  collect(sample, (v) => v);
  // Slot 0 is the whole body; prefer the fields inside it.
  return slots.length > 1 ? slots[1 + (pick % (slots.length - 1))]!(replacement) : replacement;
}

// Text no JSON parser should take well: a bare NaN, nesting far past any schema, a cut-off body.
const DEEP = 100_000;
const rawText = fc.constantFrom('{"value": NaN}', '[Infinity]', '{"a":1,}', '{"a":', '['.repeat(DEEP) + ']'.repeat(DEEP), '{"a":'.repeat(DEEP / 10) + '1' + '}'.repeat(DEEP / 10));

/** A body for a route: a hostile object, a sample with a hostile field, or not an object at all. */
export function hostileBody(keys: readonly string[], sample: unknown | undefined): fc.Arbitrary<string> {
  const value = hostileValue(keys);
  const kinds: fc.Arbitrary<Json>[] = [
    fc.array(fc.tuple(fc.constantFrom(...keys, ...specialKeys), value), { maxLength: 6 }).map((obj) => ({ obj })),
    value,
  ];
  if (sample !== undefined) {
    const base = fromPlain(sample);
    kinds.push(fc.tuple(fc.nat(), value).map(([pick, v]) => replaceSomewhere(base, pick, v)));
    kinds.push(fc.tuple(fc.nat(), value, fc.nat(), value).map(([p1, v1, p2, v2]) => replaceSomewhere(replaceSomewhere(base, p1, v1), p2, v2)));
    kinds.push(fc.constantFrom(base));
    // A text that cannot be stored (a lone half of a UTF-16 pair) in one of the sample's own strings.
    kinds.push(fc.tuple(fc.nat(), loneSurrogate).map(([pick, s]) => spikeOneString(base, pick, s)));
  }
  return fc.oneof(fc.oneof(...kinds).map(toJsonText), rawText);
}
