/**
 * Generators of bad and hostile API input for tests/integration/fuzz.test.ts. Every request
 * body is built as raw text, so it can carry what JSON.stringify cannot: 1e309, NaN, five
 * thousand levels of nesting, cut-off documents.
 */
import fc from 'fast-check';
import type { z } from 'zod';

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type Path = Array<string | number>;

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
const RAW_NUMBERS = ['1e309', '-1e309', '1e-400', '-0', '9007199254740993', 'NaN', 'Infinity', '-Infinity', '0x10', '01', '.5', '+1'];

const NUMBERISH_STRINGS = ['NaN', 'Infinity', '-Infinity', '1e309', '-1', '', '0x1F', '1,5'];

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
  fc.constantFrom(raw('{"__proto__":{"isAdmin":true}}'), raw('{"constructor":{"prototype":{"role":"admin"}}}')),
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

const UNKNOWN_KEYS = ['__proto__', 'constructor', 'prototype', 'isAdmin', 'workspaceId', 'role', 'id', 'createdAt', 'userId', '$where'];

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

function getAt(value: unknown, path: Path): unknown {
  return path.reduce<unknown>((v, k) => (v as Record<string | number, unknown>)?.[k], value);
}

function clone<T>(v: T): T {
  return JSON.parse(JSON.stringify(v)) as T;
}

function setAt(value: Json, path: Path, next: unknown): unknown {
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

/** Query strings for GET operations: known and unknown keys with hostile values. */
export const hostileQuery: fc.Arbitrary<string> = fc
  .array(
    fc.tuple(
      fc.oneof(fc.constantFrom('q', 'kind', 'sort', 'dir', 'archived', 'status', 'owner', 'product', 'from', 'to', 'variantId', 'measurementId', 'table', 'limit', 'offset'), fc.string({ maxLength: 10 })),
      fc.oneof(fc.constantFrom(...BAD_IDS, ...NUMBERISH_STRINGS, 'A'.repeat(10_000)), fc.string({ maxLength: 30 })),
    ),
    { minLength: 1, maxLength: 4 },
  )
  .map((pairs) => pairs.map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v)}`).join('&'));

/** A short description for failure messages (the samples can be a megabyte long). */
export function describeSample(s: BodySample): string {
  const head = s.text.length > 160 ? `${s.text.slice(0, 120)}… (${s.text.length} chars)` : s.text;
  return `${s.kind} [${s.contentType ?? 'no content-type'}] ${JSON.stringify(head)}`;
}
