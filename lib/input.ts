/**
 * The one vocabulary of safe input: zod building blocks that every schema, server action, query
 * parameter and CSV column is made of. Whatever a block accepts can be stored in PostgreSQL and
 * shown on a screen without surprises; whatever it refuses is a 4xx with a message a person
 * understands. Pure: zod only.
 *
 * - text: trimmed, bounded, no NUL or other control characters (newline, carriage return and tab
 *   only where several lines are allowed), no text-direction overrides or isolates, no lone
 *   surrogates or noncharacters; text that is not empty shows something (hasVisibleContent).
 * - dates: YYYY-MM-DD that exist on the calendar (no 30 February, no 31 April) in the years
 *   1900–2200 (PostgreSQL has no year 0, and nothing in a preserve kitchen is dated outside them).
 * - numbers: finite and within a stated range; whole numbers that go to an integer column stay
 *   within PostgreSQL's 32-bit integer.
 * - ids: UUIDs.
 */
import { z } from 'zod';
import { isAmbiguousComma, readDecimal, unreadableNumberMessage } from '@/lib/format/numbers';

/** What a JSON value is, in plain words ("text", "a number", "a list"). */
function kindOf(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list';
  switch (typeof value) {
    case 'string':
      return 'text';
    case 'number':
      return Number.isNaN(value) ? 'not a number' : 'a number';
    case 'boolean':
      return 'true or false';
    case 'object':
      return 'an object';
    default:
      return typeof value;
  }
}

// zod's names of the types a schema expects, in plain words.
const EXPECTED_WORDS: Readonly<Record<string, string>> = {
  string: 'text',
  number: 'a number',
  int: 'a whole number',
  bigint: 'a whole number',
  boolean: 'true or false',
  array: 'a list',
  tuple: 'a list',
  object: 'an object',
  record: 'an object',
  map: 'an object',
  null: 'null',
  date: 'a date',
  undefined: 'left out',
};

/** A field's path as the request spells it ("lines.2.quantity"); the whole input when the path is empty. */
export function fieldLabel(path: readonly PropertyKey[]): string {
  return path.length ? `"${path.map(String).join('.')}"` : 'The input';
}

/**
 * The message of a value of the wrong JSON type, naming the field, the type expected and the one
 * sent: `"name" must be text, not a number.` Used for every type mismatch whose schema gives no
 * words of its own (a block's own message, such as "The quantity must be a number.", is kept).
 */
export function invalidTypeMessage(path: readonly PropertyKey[], expected: string, input: unknown): string {
  const want = lookup(EXPECTED_WORDS, expected) ?? expected;
  const label = fieldLabel(path);
  if (input === undefined) return `${label} is missing; it must be ${want}.`;
  return `${label} must be ${want}, not ${kindOf(input)}.`;
}

// Installed with the blocks, so every process that parses input (server, browser, scripts, tests)
// uses it: zod asks it only when the failing schema has no message of its own.
z.config({
  customError: (iss) => (iss.code === 'invalid_type' ? invalidTypeMessage(iss.path ?? [], String(iss.expected), iss.input) : undefined),
});

/** Calendar dates and date-times are accepted from this year… */
export const YEAR_MIN = 1900;
/** …to this one, inclusive. */
export const YEAR_MAX = 2200;
/** PostgreSQL's `integer`: the largest whole number an int column takes. */
export const INT32_MAX = 2_147_483_647;
/** Keys that reach an object's prototype when used as property names; never used for objects built from input. */
export const PROTOTYPE_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

// C0 controls except tab/newline/carriage return, DEL, C1 controls, bidi embeddings/overrides
// (U+202A–U+202E) and isolates (U+2066–U+2069), and the noncharacters U+FFFE/U+FFFF.
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069\uFFFE\uFFFF]/;
/** A high surrogate not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
/** Line and paragraph breaks and tabs: allowed in multi-line text only. */
const LINE_BREAK = /[\t\n\r\u2028\u2029]/;

// What shows on a screen: a letter, digit, punctuation mark or symbol that is not default-ignorable
// (Unicode §5.21: zero-width spaces and joiners, U+2060–U+2064, U+FEFF, U+180E, the soft hyphen,
// the combining grapheme joiner, variation selectors, tag characters, the Hangul fillers) and not
// the blank braille cell U+2800. Whitespace, format characters (Cf), private-use characters and
// combining marks without a base character never count on their own.
const VISIBLE = /(?![\p{Default_Ignorable_Code_Point}\u2800])[\p{L}\p{N}\p{P}\p{S}]/u;

/**
 * True when the text shows at least one character. Invisible characters INSIDE otherwise visible
 * text are kept on purpose: the zero-width joiner and non-joiner shape Persian and Indic words and
 * join emoji, variation selectors and tag characters finish emoji and flags, U+200B marks word
 * breaks in Thai and Khmer. What must not pass is a name that shows as a blank row or option.
 */
export function hasVisibleContent(value: string): boolean {
  return VISIBLE.test(value);
}

export const UNSAFE_TEXT_MESSAGE = 'Remove the invisible control characters (such as NUL or text-direction overrides).';
export const BROKEN_TEXT_MESSAGE = 'The text contains a broken character; type or paste it again.';
export const LINE_BREAK_MESSAGE = 'Keep this on one line.';
export const INVISIBLE_TEXT_MESSAGE = 'This holds only invisible characters: type the text, or leave it empty.';

/** Why a text cannot be accepted, or null when it is safe. */
export function unsafeTextReason(value: string, multiline = false): string | null {
  if (LONE_SURROGATE.test(value)) return BROKEN_TEXT_MESSAGE;
  if (CONTROL.test(value)) return UNSAFE_TEXT_MESSAGE;
  if (!multiline && LINE_BREAK.test(value)) return LINE_BREAK_MESSAGE;
  return null;
}

/** True for a string every text block would accept character by character. */
export function isSafeText(value: unknown, multiline = false): value is string {
  return typeof value === 'string' && unsafeTextReason(value, multiline) === null;
}

export interface TextOptions {
  max: number;
  /** 0 (default): may be empty. */
  min?: number;
  /** Newlines and tabs allowed (notes, descriptions). */
  multiline?: boolean;
  /** Message when shorter than min (e.g. "Give the trial a title."). */
  required?: string;
  /** Message when longer than max. */
  tooLong?: string;
}

/**
 * Trimmed, bounded text without control or direction-override characters. Text that is not empty
 * must show something: a required one is refused with its own `required` message, an optional one
 * is told to leave it empty.
 */
export function text({ max, min = 0, multiline = false, required, tooLong }: TextOptions) {
  const requiredMessage = required ?? (min === 1 ? 'This field is required.' : `Use at least ${min} characters.`);
  // Missing: the form's own words; any other type: invalidTypeMessage() names the field and the type.
  let s = z.string({ error: (iss) => (iss.input === undefined ? 'Enter text here.' : undefined) }).trim();
  if (min > 0) s = s.min(min, requiredMessage);
  return s.max(max, tooLong ?? `Use at most ${max} characters.`).superRefine((value, ctx) => {
    const why = unsafeTextReason(value, multiline);
    if (why) ctx.addIssue({ code: 'custom', message: why });
    else if (value.length >= Math.max(min, 1) && !hasVisibleContent(value)) ctx.addIssue({ code: 'custom', message: min > 0 ? requiredMessage : INVISIBLE_TEXT_MESSAGE });
  });
}

/** Multi-line text (notes, descriptions, rationales). */
export function longText(max: number, options: Omit<TextOptions, 'max' | 'multiline'> = {}) {
  return text({ ...options, max, multiline: true });
}

/** A required single-line name (a person, a formula, a product, a token label). */
export function name(required: string, max = 120) {
  return text({ min: 1, max, required });
}

/** A search box: one line, at most 100 characters; empty means no search. */
export const searchText = text({ max: 100 });

// The WHATWG form of an e-mail address (what browsers accept in <input type=email>), ASCII only.
const EMAIL = /^[a-zA-Z0-9.!#$%&'*+/=?^_`{|}~-]+@[a-zA-Z0-9](?:[a-zA-Z0-9-]{0,61}[a-zA-Z0-9])?(?:\.[a-zA-Z0-9](?:[a-zA-Z0-9-]{0,61}[a-zA-Z0-9])?)+$/;

/** An e-mail address, trimmed and lower-cased, at most 254 characters (RFC 5321's path limit). */
export const email = z
  .string({ error: 'Enter a valid e-mail address.' })
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address has at most 254 characters.')
  .regex(EMAIL, 'Enter a valid e-mail address.');

const DATE_SHAPE = /^(\d{4})-(\d{2})-(\d{2})$/;

function daysInMonth(year: number, month: number): number {
  return month === 2 ? (year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0) ? 29 : 28) : [4, 6, 9, 11].includes(month) ? 30 : 31;
}

/** Why a YYYY-MM-DD string is not an acceptable calendar date, or null. */
export function calendarDateProblem(value: string): string | null {
  const m = DATE_SHAPE.exec(value);
  if (!m) return 'Use a date like 2026-06-14.';
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (year < YEAR_MIN || year > YEAR_MAX) return `Use a year from ${YEAR_MIN} to ${YEAR_MAX}.`;
  if (month < 1 || month > 12) return 'There is no such month.';
  if (day < 1 || day > daysInMonth(year, month)) return 'That day does not exist in that month.';
  return null;
}

/** A calendar date as YYYY-MM-DD that exists, in the years YEAR_MIN–YEAR_MAX. */
export const isoDate = z.string({ error: 'Use a date like 2026-06-14.' }).superRefine((value, ctx) => {
  const why = calendarDateProblem(value);
  if (why) ctx.addIssue({ code: 'custom', message: why });
});

/** A date and time with a UTC offset (ISO 8601), whose date exists, in the years YEAR_MIN–YEAR_MAX. */
export const isoDateTime = z.iso.datetime({ offset: true, error: 'Use a date and time.' }).superRefine((value, ctx) => {
  const why = calendarDateProblem(value.slice(0, 10));
  if (why) ctx.addIssue({ code: 'custom', message: why });
});

/** A finite number within [min, max]; −0 is read as 0. */
export function boundedNumber(what: string, min: number, max: number) {
  return z
    .number({ error: `${what} must be a number.` })
    .min(min, `${what} must be at least ${min}.`)
    .max(max, `${what} must be at most ${max}.`)
    .overwrite(positiveZero);
}

/** −0 (JSON allows "-0") as 0, so it is stored and shown as 0, never as "−0". */
function positiveZero(v: number): number {
  return v + 0;
}

/**
 * The finest step anything is weighed, read or costed in: a thousandth (1 mg, 0.001 %, 0.001 pH).
 * Common practice, no published source.
 */
export const SMALLEST_AMOUNT = 0.001;

/**
 * An amount that is 0 or at least SMALLEST_AMOUNT either side of it, with −0 read as 0: a value like
 * 1e-320 is a slip, and it printed as "× 0.0 g" and "2.628e-320 kcal". For fields where 0 means
 * something (no refuse, no overfill, water's soluble solids); a field that cannot be 0 takes a min.
 */
export function noTinyAmount(schema: z.ZodNumber, what: string, unit = ''): z.ZodNumber {
  return schema.overwrite(positiveZero).refine((v) => v === 0 || Math.abs(v) >= SMALLEST_AMOUNT, `${what} must be 0 or at least ${SMALLEST_AMOUNT}${unit}.`);
}

/** A whole number within [min, max], which must fit a PostgreSQL integer column. */
export function wholeNumber(what: string, min: number, max: number) {
  if (min < -INT32_MAX - 1 || max > INT32_MAX) throw new Error(`wholeNumber(${what}): the range must fit a 32-bit integer`);
  return z
    .number({ error: `${what} must be a number.` })
    .int(`${what} must be a whole number.`)
    .min(min, `${what} must be at least ${min}.`)
    .max(max, `${what} must be at most ${max}.`);
}

/** A revision or version number (1 … 2³¹−1). */
export const versionNumber = wholeNumber('The version', 1, INT32_MAX);

/** Parses the decimal text of a query parameter or CSV cell (lib/format/numbers.ts); NaN when blank or not a number. */
export function parseDecimal(raw: string): number {
  return readDecimal(raw) ?? Number.NaN;
}

/** A number sent as text (query parameter, form field): plain decimal notation, then the number rule. */
export function numberFromText<S extends z.ZodType<number, number>>(what: string, schema: S) {
  return z
    .string({ error: `Give ${what.toLowerCase()} as a number.` })
    .transform((s, ctx) => {
      const n = parseDecimal(s);
      if (Number.isNaN(n)) {
        ctx.addIssue({ code: 'custom', message: isAmbiguousComma(s) ? `${what}: ${unreadableNumberMessage(s)}` : `Give ${what.toLowerCase()} as a number.` });
        return z.NEVER;
      }
      return n;
    })
    .pipe(schema);
}

/** A record id (a UUID). */
export function id(message = 'Unknown record.') {
  return z.uuid(message);
}

/** A plain object whose keys came from input: no prototype, and never a prototype-named key. */
export function safeRecord<V>(entries: Iterable<[string, V]>): Record<string, V> {
  const out = Object.create(null) as Record<string, V>;
  for (const [k, v] of entries) if (!PROTOTYPE_KEYS.has(k)) out[k] = v;
  return out;
}

/** Own-property look-up in a table keyed by our own names, safe for keys that came from input. */
export function lookup<V>(table: Readonly<Record<string, V>> | undefined, key: string): V | undefined {
  return table && Object.prototype.hasOwnProperty.call(table, key) ? table[key] : undefined;
}
