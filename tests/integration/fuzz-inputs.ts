/**
 * Generators of bad and hostile API input for tests/integration/fuzz.test.ts. Every request
 * body is built as raw text, so it can carry what JSON.stringify cannot: 1e309, NaN, five
 * thousand levels of nesting, cut-off documents.
 */
import fc from 'fast-check';
import type { z } from 'zod';

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
export type Path = Array<string | number>;

/** A request body exactly as sent: its text, its content-type (null: none), what it is. */
export interface BodySample {
  kind: string;
  text: string;
  contentType: string | null;
  /** Invalid by the house rules whatever the schema says (an unknown field: API bodies are .strict()). */
  refusedByRule?: boolean;
}

export const JSON_TYPE = 'application/json';

export const SQL_FRAGMENTS = [
  "'; DROP TABLE users;--",
  "' OR '1'='1",
  '1; DELETE FROM workspaces',
  "Robert'); DROP TABLE trials;--",
  "' UNION SELECT password_hash FROM users--",
  '$$; TRUNCATE formulas; $$',
  '\\x00\\x27',
];

export const SCRIPT_FRAGMENTS = [
  '<script>alert(1)</script>',
  '"><img src=x onerror=alert(1)>',
  'javascript:alert(document.cookie)',
  '<svg onload=alert(1)>',
  '{{constructor.constructor("alert(1)")()}}',
];

export const BAD_IDS = [
  '',
  ' ',
  'not-a-uuid',
  '00000000-0000-0000-0000-00000000000g',
  '00000000-0000-0000-0000-0000000000000',
  '12345',
  '-1',
  'NaN',
  '../../etc/passwd',
  '%00',
  'null',
  'undefined',
  '[object Object]',
  ...SQL_FRAGMENTS,
  ...SCRIPT_FRAGMENTS,
];

/** Raw number tokens; some are valid JSON that parses to something no field should take (1e309 is Infinity). */
const RAW_NUMBERS = [
  '1e309', '-1e309', '1e-400', '-0', '9007199254740993', 'NaN', 'Infinity', '-Infinity', '0x10', '01', '.5', '+1',
  // Past 2^31 (an int column) and 2^53 (no longer exact), tiny and huge floats.
  '2147483648', '-2147483649', '4294967296', '9007199254740992', '1e-300', '5e-324', '1e308', '-1e308', '0.4',
];

const NUMBERISH_STRINGS = ['NaN', 'Infinity', '-Infinity', '1e309', '-1', '', '0x1F', '1,5', '-0', '1e-300', '1e308', '2147483648', '9007199254740993', '0.4'];

/**
 * Characters no text field may hold (lib/input.ts): NUL and other controls, lone surrogates,
 * bidi overrides and isolates, a noncharacter. Each makes any string it is put into invalid.
 */
export const POISON_CHARACTERS = ['\u0000', '\uD800', '\uDFFF', '\u202E', '\u202D', '\u2066', '\u2069', '\u001B', '\u0007', '\u007F', '\u0085', '\uFFFF'];
/** Dates with the right shape that are not on the calendar, or outside the stated years. */
export const IMPOSSIBLE_DATES = ['2026-02-30', '2026-04-31', '2025-02-29', '2100-02-29', '0000-01-01', '1899-12-31', '2201-01-01', '2026-13-01', '2026-00-10', '2026-06-00'];
/** Numbers past every stated range: an int column's 2^31, 2^53 (no longer exact), 1e308. No field takes them. */
export const HUGE_NUMBERS = ['2147483648', '-2147483649', '4294967296', '9007199254740993', '1e308', '-1e308'];
/** Numbers no field takes, which a server action can still receive (React encodes NaN and ±Infinity). */
export const POISON_NUMBERS = [Number.NaN, Infinity, -Infinity, ...HUGE_NUMBERS.map(Number)];
/** Keys that reach an object's prototype, and built-ins of every object. */
export const PROTOTYPE_KEYS = ['__proto__', 'constructor', 'prototype', 'valueOf', 'hasOwnProperty', 'toString', '__defineGetter__', 'isPrototypeOf'];

/**
 * One value per class of bad input, named, for the deterministic sweeps (every key of a page or
 * export given each class in turn): controls, lone surrogates, bidi, huge numbers, prototype names,
 * an impossible date and a huge length. `seed` is a plausible value the class is put into.
 */
export function badInputClasses(seed: string): Array<[string, string]> {
  return [
    ['NUL', `${seed}\u0000`],
    ['a control character', `\u0007${seed}`],
    ['escape', `${seed}\u001B[31m`],
    ['DEL', `${seed}\u007F`],
    ['a lone high surrogate', `${seed}\uD800`],
    ['a lone low surrogate', `\uDFFF${seed}`],
    ['a bidi override', `\u202E${seed}`],
    ['a bidi isolate', `\u2066${seed}\u2069`],
    ...HUGE_NUMBERS.map((n): [string, string] => [`the number ${n}`, n]),
    ...PROTOTYPE_KEYS.slice(0, 4).map((k): [string, string] => [`the name ${k}`, k]),
    ['an impossible date', IMPOSSIBLE_DATES[0]],
    ['a huge length', seed.repeat(Math.ceil(200_000 / Math.max(1, seed.length)))],
  ];
}

const DATE_IN_TEXT = /\d{4}-\d{2}-\d{2}/;

/** A copy of a string made invalid: a forbidden character at its start, middle or end, or an impossible date in place of its date. */
export function poisonedString(original: string): fc.Arbitrary<string> {
  const withCharacter = fc.tuple(fc.constantFrom(...POISON_CHARACTERS), fc.nat({ max: original.length })).map(([ch, at]) => original.slice(0, at) + ch + original.slice(at));
  if (!DATE_IN_TEXT.test(original)) return withCharacter;
  return fc.oneof(withCharacter, fc.constantFrom(...IMPOSSIBLE_DATES).map((d) => original.replace(DATE_IN_TEXT, d)));
}

/** True when the string survives UTF-8 (no lone surrogate): what a FormData field or URL can carry at all. */
export const isWellFormedText = (v: string) => new TextDecoder().decode(new TextEncoder().encode(v)) === v;

/** Every path to a string (or number) in a JSON-like value. */
export function leafPaths(value: unknown, kind: 'string' | 'number'): Path[] {
  return pathsOf(value).filter((p) => typeof getAt(value, p) === kind);
}

/** Placeholders for raw JSON tokens inside a value; replaced after JSON.stringify. */
const RAW = '\u0000raw:';
const raw = (token: string) => `${RAW}${token}\u0000`;
function render(value: unknown): string {
  return JSON.stringify(value).replace(/"\\u0000raw:([\s\S]*?)\\u0000"/g, (_, token: string) => JSON.parse(`"${token}"`));
}

const DEPTH = 5000;
const deepArrays = '['.repeat(DEPTH) + ']'.repeat(DEPTH);
const deepObjects = '{"a":'.repeat(DEPTH) + '1' + '}'.repeat(DEPTH);

/** Values of every JSON type plus the hostile ones; JSON.stringify keeps each as given (or as a raw token). */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(...SQL_FRAGMENTS, ...SCRIPT_FRAGMENTS, ...BAD_IDS),
  fc.constantFrom(...NUMBERISH_STRINGS),
  fc.constantFrom(...RAW_NUMBERS).map(raw),
  fc.constantFrom(raw(deepArrays), raw(deepObjects)),
  fc.constantFrom(raw('{"__proto__":{"isAdmin":true}}'), raw('{"constructor":{"prototype":{"role":"admin"}}}'), raw('{"valueOf":1,"hasOwnProperty":"x","toString":null}')),
  fc.tuple(fc.constantFrom(...POISON_CHARACTERS), fc.constantFrom('', 'Quince jam', ' ')).map(([ch, t]) => `${t}${ch}${t}`),
  fc.constantFrom(...IMPOSSIBLE_DATES, '2026-02-30T10:00:00Z', '0000-01-01T00:00:00Z'),
  // One megabyte and a bit: above the 1 MB body limit on its own.
  fc.constant('x'.repeat(1_048_577)),
  // Large but under the limit: only a length rule can refuse it.
  fc.constantFrom('A'.repeat(120_000), '\u{1F353}'.repeat(30_000), 'é'.repeat(300_000)),
  fc.string({ maxLength: 40 }),
  fc.integer({ min: -2_147_483_648, max: -1 }),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 4 }),
  fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 }),
);

const UNKNOWN_KEYS = [...PROTOTYPE_KEYS, 'isAdmin', 'workspaceId', 'role', 'id', 'createdAt', 'userId', '$where'];

function pathsOf(value: unknown, prefix: Path = [], out: Path[] = []): Path[] {
  const entries: Array<[string | number, unknown]> = Array.isArray(value) ? value.map((v, i) => [i, v]) : value && typeof value === 'object' ? Object.entries(value) : [];
  for (const [k, v] of entries) {
    out.push([...prefix, k]);
    pathsOf(v, [...prefix, k], out);
  }
  return out;
}

function objectPaths(value: unknown): Path[] {
  const all = [[] as Path, ...pathsOf(value)];
  return all.filter((p) => {
    const v = getAt(value, p);
    return v !== null && typeof v === 'object' && !Array.isArray(v);
  });
}

export function getAt(value: unknown, path: Path): unknown {
  return path.reduce<unknown>((v, k) => (v as Record<string | number, unknown>)?.[k], value);
}

function clone<T>(v: T): T {
  return JSON.parse(JSON.stringify(v)) as T;
}

export function setAt(value: Json, path: Path, next: unknown): unknown {
  if (!path.length) return next;
  const copy = clone(value) as Record<string | number, unknown>;
  const parent = getAt(copy, path.slice(0, -1)) as Record<string | number, unknown>;
  parent[path[path.length - 1]] = next;
  return copy;
}

function deleteAt(value: Json, path: Path): unknown {
  const copy = clone(value) as Record<string | number, unknown>;
  const parent = getAt(copy, path.slice(0, -1)) as Record<string | number, unknown> | unknown[];
  const key = path[path.length - 1];
  if (Array.isArray(parent)) parent.splice(key as number, 1);
  else delete parent[key as string];
  return copy;
}

/**
 * An object of the valid body that holds an array, nested into itself ~5000 times through that
 * array (a node inside a node inside a node…), kept under the body limit so parsing, not the
 * size check, has to cope.
 */
function selfNested(base: Json, at: Path, key: string): string {
  const node = getAt(base, at) as Record<string, Json>;
  const marked = render({ ...node, [key]: raw('\u0001') });
  const [a, b] = marked.split('\u0001');
  const levels = Math.max(1, Math.min(DEPTH, Math.floor(900_000 / (a.length + b.length + 2))));
  const nested = (a + '[').repeat(levels) + a + '[]' + b + (']' + b).repeat(levels);
  return at.length ? render(setAt(base, at, raw(nested))) : nested;
}

/** Structured mutations of a valid body: wrong or hostile values, missing and unknown fields, deep nesting. */
export function structuredBodies(base: Json): fc.Arbitrary<BodySample> {
  const paths = pathsOf(base);
  const objects = objectPaths(base);
  const nestable = objects.flatMap((p) => Object.entries(getAt(base, p) as object).filter(([, v]) => Array.isArray(v)).map(([k]) => ({ p, k })));
  const json = (kind: string) => (value: unknown): BodySample => ({ kind, text: render(value), contentType: JSON_TYPE });
  const arbs: Array<fc.Arbitrary<BodySample>> = [
    fc.tuple(fc.constantFrom(...objects), fc.oneof(fc.constantFrom(...UNKNOWN_KEYS), fc.string({ minLength: 1, maxLength: 12 })), hostileValue).map(([p, key, v]) => {
      const target = clone(base);
      const node = getAt(target, p) as Record<string, unknown>;
      const known = Object.prototype.hasOwnProperty.call(node, key);
      // defineProperty, so that "__proto__" becomes an own key that JSON.stringify writes out.
      Object.defineProperty(node, key, { value: v, enumerable: true, writable: true, configurable: true });
      // A key the example already has is not unknown; the schema decides about that one.
      return { ...json('unknown field')(target), refusedByRule: !known };
    }),
    hostileValue.map(json('hostile body')),
  ];
  const texts = leafPaths(base, 'string');
  if (texts.length) {
    // House rule, whatever the schema: no text field takes a control character, and no date field a day that does not exist.
    arbs.push(
      fc.constantFrom(...texts).chain((p) => poisonedString(getAt(base, p) as string).map((v) => ({ ...json('poisoned text')(setAt(base, p, v)), refusedByRule: true }))),
    );
  }
  const numbers = leafPaths(base, 'number');
  if (numbers.length) {
    // House rule, whatever the schema: every number has a stated range, and none reaches 2^31.
    arbs.push(
      fc.tuple(fc.constantFrom(...numbers), fc.constantFrom(...HUGE_NUMBERS)).map(([p, n]) => ({ ...json('huge number')(setAt(base, p, raw(n))), refusedByRule: true })),
    );
  }
  if (paths.length) {
    arbs.push(fc.tuple(fc.constantFrom(...paths), hostileValue).map(([p, v]) => json('hostile value')(setAt(base, p, v))));
    arbs.push(fc.constantFrom(...paths).map((p) => json('missing field')(deleteAt(base, p))));
  }
  if (nestable.length) {
    arbs.push(fc.constantFrom(...nestable).map(({ p, k }) => ({ kind: 'self-nesting', text: selfNested(base, p, k), contentType: JSON_TYPE })));
  }
  return fc.oneof(...arbs);
}

/** Text that is not JSON, or not one JSON document, derived from the valid body. */
export function malformedBodies(base: Json): fc.Arbitrary<BodySample> {
  const text = render(base);
  const sample = (t: string): BodySample => ({ kind: 'malformed JSON', text: t, contentType: JSON_TYPE });
  return fc.oneof(
    fc.integer({ min: 1, max: Math.max(1, text.length - 1) }).map((n) => sample(text.slice(0, n))),
    fc.constantFrom("{'a': 1}", '{"a":1,}', '[1,2', '{"a" 1}', 'undefined', 'NaN', '{"a":NaN}', '/* x */ {}', '{"a":"\\u12"}', '{"a":1}{"b":2}', 'nul', '\u0000').map(sample),
    fc.constantFrom(deepArrays, deepObjects, '['.repeat(DEPTH), '{"a":'.repeat(DEPTH)).map((t) => ({ kind: 'deep nesting', text: t, contentType: JSON_TYPE })),
    fc.string({ minLength: 1, maxLength: 60 }).map((s) => sample(`${text}${s}`)),
    fc.constant({ kind: 'oversized', text: `${text.slice(0, -1)},"pad":"${'z'.repeat(1_000_001)}"}`, contentType: JSON_TYPE }),
    fc.constant({ kind: 'oversized', text: `${' '.repeat(1_000_001)}${text}`, contentType: JSON_TYPE }),
  );
}

/** The valid body under a content-type that is not JSON (or none). */
export function wrongContentTypes(base: Json): fc.Arbitrary<BodySample> {
  const text = render(base);
  return fc
    .constantFrom<string | null>(null, 'text/plain', 'text/plain;charset=UTF-8', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=----fuzz', 'application/xml', 'text/html', 'application/jsonp', 'json')
    .map((contentType) => ({ kind: 'wrong content-type', text, contentType }));
}

/** True when a handler must refuse the sample: not JSON by type, too large, unparseable, or refused by the schema. */
export function mustBeRefused(sample: BodySample, schema: z.ZodType, maxBytes: number): boolean {
  if (sample.refusedByRule) return true;
  const type = sample.contentType?.split(';')[0].trim().toLowerCase();
  if (type !== JSON_TYPE) return true;
  if (new TextEncoder().encode(sample.text).byteLength > maxBytes) return true;
  let data: unknown;
  try {
    data = sample.text.trim() ? JSON.parse(sample.text) : {};
  } catch {
    return true;
  }
  try {
    return !schema.safeParse(data).success;
  } catch {
    // A schema that overflows the stack on this value: the handler must still refuse it cleanly.
    return true;
  }
}

/** Bad values for one path parameter. */
export function badParam(name: string): fc.Arbitrary<string> {
  const shared = fc.oneof(fc.constantFrom(...BAD_IDS), fc.string({ maxLength: 60 }), fc.uuid().map((u) => `${u}x`), fc.uuid().map((u) => u.slice(1)));
  if (name === 'number') return fc.oneof(shared, fc.constantFrom('0', '-1', '1.5', '1e309', '99999999999999999999', '2147483648', '1 OR 1=1'));
  // A well-formed UUID that names nothing must be a plain 404 too; a seat token is any string.
  return fc.oneof(shared, fc.uuid());
}

/** Values that mean something for one query key (valid ones too, so that hostile combinations such as a sheet for 0.4 jars are reached). */
const QUERY_VALUES: Record<string, string[]> = {
  target: ['jar_count', 'finished_mass', 'total_charge'],
  amount: ['0.4', '12', '1e-300', '5e-324', '1e308', '2147483648', '9007199254740993', '-0', 'NaN', '0x10', ' '],
  step: ['1e-300', '5e-324', '0.001', '1e308', '-0', '0', '10000', 'Infinity'],
  unit: ['g', 'kg', 'lb', 'oz', 'st'],
  stepUnit: ['g', 'kg', 'lb', 'oz', 'ton'],
  altitudeM: ['-0', '1e308', '4999.9', '2147483648'],
  paper: ['a4', 'letter', 'legal'],
  from: [...IMPOSSIBLE_DATES, '2026-06-14'],
  to: [...IMPOSSIBLE_DATES, '2026-06-14'],
  a: ['1', '2', '2147483648', '9007199254740993', '1e308', '-0', 'NaN', '0'],
  b: ['1', '2', '2147483648', '9007199254740993', '1e308', '-0', 'NaN', '0'],
  table: ['means', 'anova', 'penalty', 'triangle', 'ranking', 'constructor', '__proto__'],
  status: ['draft', 'cooking', 'archived', 'pending', 'approved', 'toString'],
  sort: ['name', 'kind', 'solidsPct', 'valueOf', '__proto__'],
  code: ['ABC123', 'abc-123', '000000'],
};

/** Every query key a page, export or list of the app reads. */
export const QUERY_KEYS = [
  'q', 'kind', 'sort', 'dir', 'archived', 'status', 'owner', 'product', 'from', 'to', 'variantId', 'cookId', 'table', 'limit', 'offset',
  'target', 'amount', 'unit', 'step', 'stepUnit', 'altitudeM', 'paper', 'a', 'b', 'formula', 'code', 'error', 'reset', 'joined',
];

const queryValue = (key: string): fc.Arbitrary<string> => {
  // An own-property look-up: the key may be "__proto__" or "constructor".
  const known = Object.prototype.hasOwnProperty.call(QUERY_VALUES, key) ? QUERY_VALUES[key] : ['jam', '1'];
  return fc.oneof(
    fc.constantFrom(...known),
    fc.constantFrom(...BAD_IDS, ...NUMBERISH_STRINGS, ...IMPOSSIBLE_DATES, 'A'.repeat(10_000)),
    // A URL cannot carry a lone surrogate (it is not UTF-8), so only the other poisons are sent.
    fc.constantFrom(...known).chain((v) => poisonedString(v).filter(isWellFormedText)),
    fc.string({ maxLength: 30 }),
  );
};

/** Key/value pairs for a query string: the given keys (repeated ones too) plus unknown and prototype-named keys. */
export function queryPairs(keys: readonly string[] = QUERY_KEYS): fc.Arbitrary<Array<[string, string]>> {
  const key = fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...keys) }, fc.constantFrom(...PROTOTYPE_KEYS), fc.string({ maxLength: 10 }));
  return fc.array(key.chain((k) => queryValue(k).map((v) => [k, v] as [string, string])), { minLength: 1, maxLength: 5 });
}

export const encodeQuery = (pairs: Array<[string, string]>) => pairs.map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v)}`).join('&');

/** Query strings for GET operations: known and unknown keys with hostile values. */
export const hostileQuery: fc.Arbitrary<string> = queryPairs().map(encodeQuery);

/** The searchParams object Next.js hands a page: a repeated key becomes an array; every key an own property. */
export function searchParamsOf(pairs: Array<[string, string]>): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const [k, v] of pairs) {
    const prev = Object.prototype.hasOwnProperty.call(out, k) ? out[k] : undefined;
    Object.defineProperty(out, k, { value: prev === undefined ? v : ([] as string[]).concat(prev, v), enumerable: true, writable: true, configurable: true });
  }
  return out;
}

/** A short description for failure messages (the samples can be a megabyte long). */
export function describeSample(s: BodySample): string {
  const head = s.text.length > 160 ? `${s.text.slice(0, 120)}… (${s.text.length} chars)` : s.text;
  return `${s.kind} [${s.contentType ?? 'no content-type'}] ${JSON.stringify(head)}`;
}
