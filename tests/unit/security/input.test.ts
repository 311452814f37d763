/**
 * The vocabulary of safe input (lib/input.ts) and the feature schemas built from it. Each
 * describe block is one class of hostile input; every case here was accepted before the
 * building blocks existed (and most then failed in PostgreSQL with a 500).
 * Sources: Unicode Standard §23.2 (bidirectional formatting characters U+202A–U+202E,
 * U+2066–U+2069) and §3.9 (a lone surrogate is ill-formed UTF-16); Gregorian calendar month
 * lengths and leap years (ISO 8601-1:2019 §4.2.1); PostgreSQL `integer` is −2³¹ … 2³¹−1
 * (PostgreSQL 16 manual §8.1.1); PostgreSQL text cannot hold NUL (manual §8.3).
 */
import { describe, it, expect } from 'vitest';
import { z } from 'zod';
import {
  boundedNumber,
  hasVisibleContent,
  invalidTypeMessage,
  INVISIBLE_TEXT_MESSAGE,
  calendarDateProblem,
  email,
  INT32_MAX,
  isoDate,
  isoDateTime,
  lookup,
  name,
  numberFromText,
  parseDecimal,
  safeRecord,
  text,
  unsafeTextReason,
  versionNumber,
  wholeNumber,
} from '@/lib/input';
import { createTrialSchema, cookSchema, trialListQuerySchema } from '@/lib/trials/schema';
import { batchRecordSchema, batchSheetQuerySchema } from '@/lib/production/schema';
import { reviseFormulaSchema, formulaListQuerySchema } from '@/lib/formulas/schema';
import { joinSchema, createTastingSchema } from '@/lib/tastings/schema';
import { requestResetSchema } from '@/lib/account/schema';
import { inviteMemberSchema } from '@/lib/members/schema';
import { ingredientInputSchema, ingredientListQuerySchema } from '@/lib/ingredients/schema';
import { costSettingsSchema, ingredientPriceSchema, packagingItemSchema, refuseBodySchema } from '@/lib/pricing/schema';
import { createFormulaSchema, formulaLineSchema, formulaSettingsSchema } from '@/lib/formulas/schema';
import { correctCookSchema } from '@/lib/trials/schema';
import { zodFieldErrors } from '@/lib/errors';
import { findDocProblems } from '@/lib/notebook/document';
import { parseCookCsv } from '@/lib/trials/csv';

const ok = (schema: z.ZodType, value: unknown) => schema.safeParse(value).success;

describe('NUL and other control characters', () => {
  const line = text({ max: 100 });
  const notes = text({ max: 100, multiline: true });
  it.each(['a\u0000b', '\u0000', 'a\u0007', 'a\u001b[31m', 'a\u007f', 'a\u0085b', 'a\u009bb'])('refuses %j in any text', (value) => {
    expect(ok(line, value)).toBe(false);
    expect(ok(notes, value)).toBe(false);
  });
  it('allows newline and tab only where several lines are allowed', () => {
    expect(ok(notes, 'one\r\ntwo\tthree')).toBe(true);
    expect(ok(line, 'one\ntwo')).toBe(false);
    expect(ok(line, 'one\ttwo')).toBe(false);
    expect(ok(line, 'one\u2028two')).toBe(false);
  });
  it('trims and bounds, and keeps ordinary text of every script whole', () => {
    expect(line.parse('  Quince & rosé — 柚子 🍓  ')).toBe('Quince & rosé — 柚子 🍓');
    expect(ok(text({ max: 3 }), 'abcd')).toBe(false);
    expect(ok(name('Give it a name.'), '   ')).toBe(false);
  });
  it('the e-mail block refuses NUL (sign-in and reset never reach the database with one)', () => {
    expect(ok(email, 'a\u0000@b.example')).toBe(false);
    expect(ok(requestResetSchema, { email: 'ann@example.com\u0000' })).toBe(false);
    expect(email.parse('  Ann.Smith@Example.COM ')).toBe('ann.smith@example.com');
    expect(ok(inviteMemberSchema, { email: `${'a'.repeat(250)}@b.co`, role: 'taster' })).toBe(false);
  });
  it('feature schemas refuse NUL in names, notes and searches (the unauthenticated join too)', () => {
    expect(ok(joinSchema, { joinCode: 'ABC123', displayName: 'Ann\u0000' })).toBe(false);
    expect(ok(trialListQuerySchema, { q: 'jam\u0000' })).toBe(false);
    expect(ok(formulaListQuerySchema, { q: '\u0000' })).toBe(false);
    expect(ok(ingredientListQuerySchema, { q: 'x\u0000' })).toBe(false);
    expect(ok(createTrialSchema, { title: 'T\u0000', question: 'Q', formulaId: '6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10' })).toBe(false);
  });
  it('a notebook entry refuses NUL in text, attributes and keys', () => {
    const doc = (t: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: t }] }] });
    expect(findDocProblems(doc('fine'))).toEqual([]);
    expect(findDocProblems(doc('bad\u0000'))).not.toEqual([]);
    expect(findDocProblems(doc('bad\u202e'))).not.toEqual([]);
  });
});

describe('lone surrogates', () => {
  it.each(['\uD800', 'a\uDC00', '\uDBFFx', 'x\uDFFF'])('refuses %j', (value) => {
    expect(unsafeTextReason(value)).not.toBeNull();
    expect(ok(text({ max: 10 }), value)).toBe(false);
  });
  it('accepts a well-formed pair (an emoji)', () => {
    expect(unsafeTextReason('\uD83C\uDF53')).toBeNull();
  });
});

describe('bidi overrides and isolates', () => {
  it.each(['\u202A', '\u202B', '\u202C', '\u202D', '\u202E', '\u2066', '\u2067', '\u2068', '\u2069'])('refuses U+%s', (ch) => {
    expect(ok(text({ max: 20, multiline: true }), `invoice${ch}fdp.exe`)).toBe(false);
  });
  it('keeps right-to-left text itself', () => {
    expect(ok(text({ max: 40 }), 'مربى المشمش')).toBe(true);
  });
});

// Unicode Standard §5.21 and DerivedCoreProperties.txt (Default_Ignorable_Code_Point); §23.2 (Cf format characters).
describe('text that shows nothing', () => {
  const invisible = [
    '\u200B', '\u200C', '\u200D', '\u200E', '\u200F', '\u2060', '\u2061', '\u2064', '\uFEFF', '\u180E', '\u00AD', '\u034F',
    '\uFE0F', '\u{E0100}', '\u{E0041}\u{E007F}', '\u3164', '\u115F', '\u2800', '\u0301', '\uE000', ' \u200B\u00A0\u3000\u200B ',
  ];
  it.each(invisible)('refuses a name made only of %j, with the field’s own message', (value) => {
    expect(hasVisibleContent(value)).toBe(false);
    const r = name('Give it a name.').safeParse(value);
    expect(r.error?.issues.map((i) => i.message)).toEqual(['Give it a name.']);
  });
  it('refuses it in optional text too, which may be left empty instead', () => {
    const optional = text({ max: 40 });
    expect(optional.safeParse('\u200B\u2060').error?.issues.map((i) => i.message)).toEqual([INVISIBLE_TEXT_MESSAGE]);
    expect(optional.parse('')).toBe('');
    expect(ok(text({ max: 40, multiline: true }), '\u200B\n\u200B')).toBe(false);
  });
  it('keeps invisible characters inside visible text (Persian ZWNJ, joined emoji, flags, Thai word breaks)', () => {
    for (const value of ['می\u200Cخواهم', '👩\u200D🍳', '❤\uFE0F', '🏴\u{E0067}\u{E0062}\u{E0065}\u{E006E}\u{E0067}\u{E007F}', 'แยม\u200Bส้ม', 'A', '7', '%', '€']) {
      expect(ok(name('Give it a name.'), value), value).toBe(true);
    }
  });
  it('the feature schemas the walk found refuse a zero-width name or supplier', () => {
    const named = (schema: z.ZodType, body: object, field: string) => schema.safeParse(body).error?.issues.find((i) => i.path[0] === field)?.message;
    expect(named(ingredientInputSchema, { name: '\u200B', kind: 'fruit', solidsPct: 10 }, 'name')).toBe('Give the ingredient a name.');
    expect(named(packagingItemSchema, { name: '\uFEFF\u200D', kind: 'jar' }, 'name')).toBe('Give the packaging item a name.');
    expect(named(createFormulaSchema, { name: '\u200B' }, 'name')).toBe('Give the formula a name.');
    const price = { ingredientId: '6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10', packPrice: '24.50', packSize: 25, packUnit: 'kg', validFrom: '2026-06-01' };
    expect(named(ingredientPriceSchema, { ...price, supplier: '\u200B' }, 'supplier')).toBe(INVISIBLE_TEXT_MESSAGE);
    expect(ok(ingredientPriceSchema, { ...price, supplier: 'Ferme du Clos' })).toBe(true);
  });
});

describe('impossible calendar dates', () => {
  it.each(['2026-02-30', '2026-04-31', '2025-02-29', '1900-02-29', '0000-01-01', '2026-13-01', '2026-00-10', '2026-06-00', '1899-12-31', '2201-01-01', '2026-6-14', '14/06/2026', '2026-06-14T00:00:00Z'])(
    'refuses %s',
    (value) => {
      expect(calendarDateProblem(value)).not.toBeNull();
      expect(ok(isoDate, value)).toBe(false);
    },
  );
  it.each(['2024-02-29', '2000-02-29', '1900-01-01', '2200-12-31', '2026-04-30'])('accepts %s', (value) => {
    expect(ok(isoDate, value)).toBe(true);
  });
  it('refuses them in cooks, batch records, the cook CSV and tasting times', () => {
    expect(ok(cookSchema, { variantId: '6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10', cookDate: '2026-02-30' })).toBe(false);
    expect(batchRecordSchema.safeParse({ batchDate: '2026-04-31' }).error?.issues.some((i) => i.path[0] === 'batchDate')).toBe(true);
    expect(ok(isoDateTime, '2026-02-30T10:00:00Z')).toBe(false);
    expect(ok(isoDateTime, '0000-01-01T10:00:00Z')).toBe(false);
    expect(ok(isoDateTime, '2026-06-14T10:00:00+02:00')).toBe(true);
    expect(createTastingSchema.safeParse({ startsAt: '2026-02-30T10:00:00Z' }).error?.issues.some((i) => i.path[0] === 'startsAt')).toBe(true);
    const { errors } = parseCookCsv('variant,cook_date,ph\nA,2026-02-30,3.2\n', new Map([['A', '6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10']]));
    expect(errors).toEqual([expect.objectContaining({ row: 2, column: 'cook_date' })]);
  });
});

describe('integers past 2^31 and 2^53', () => {
  it.each([2 ** 31, 2 ** 53, 2 ** 53 + 2, 1e300, -(2 ** 31) - 1])('refuses %d where a 32-bit integer column takes it', (n) => {
    expect(ok(versionNumber, n)).toBe(false);
    expect(ok(reviseFormulaSchema.shape.baseRevision, n)).toBe(false);
    expect(ok(createTrialSchema.shape.baseRevision, n)).toBe(false);
  });
  it('accepts the largest integer the column holds', () => {
    expect(ok(versionNumber, INT32_MAX)).toBe(true);
  });
  it('will not build a whole-number rule wider than the column', () => {
    expect(() => wholeNumber('Count', 0, INT32_MAX + 1)).toThrow();
  });
});

describe('tiny and huge floats', () => {
  const n = boundedNumber('The amount', 0, 1000);
  it.each([Infinity, -Infinity, Number.NaN, 1e308, -1e-300, 1001])('refuses %d', (v) => expect(ok(n, v)).toBe(false));
  it('reads only plain decimal text from a query or a CSV cell', () => {
    for (const raw of ['0x10', 'Infinity', 'NaN', '', ' ', '1e', '1,2,3', '--1']) expect(parseDecimal(raw)).toBeNaN();
    expect(parseDecimal('2,5')).toBe(2.5);
    expect(parseDecimal('-0.75e2')).toBe(-75);
    expect(ok(numberFromText('The amount', n), '1e309')).toBe(false);
  });
  it('refuses a batch sheet step of 1e-300 and a sheet for 0.4 jars', () => {
    expect(ok(batchSheetQuerySchema, { step: '1e-300' })).toBe(false);
    expect(ok(batchSheetQuerySchema, { step: '0.001' })).toBe(true);
    expect(ok(batchSheetQuerySchema, { target: 'jar_count', amount: '0.4' })).toBe(false);
    expect(ok(batchSheetQuerySchema, { target: 'jar_count', amount: '12.5' })).toBe(false);
    expect(ok(batchSheetQuerySchema, { target: 'jar_count', amount: '12' })).toBe(true);
    expect(ok(batchSheetQuerySchema, { amount: '0x10' })).toBe(false);
  });
});

// Each was accepted by the user walk and printed nonsense ("Jars filled — × 0.0 g", "Serving size
// 1 container (0g)", "2.628e-320 kcal"). 1e-320 is a subnormal double (IEEE 754-2019 §3.4).
describe('tiny non-zero amounts and −0', () => {
  const issue = (schema: z.ZodType, value: unknown, field: string) => schema.safeParse(value).error?.issues.find((i) => i.path.includes(field))?.message;
  const settings = { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-01-01', targetSolidsPct: 65, jarNetFillG: 340 };
  const line = { ingredientId: '6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10', quantity: 500, unit: 'g' };
  it('a jar fill is at least 1 g, as a pack format’s', () => {
    expect(issue(formulaSettingsSchema, { ...settings, jarNetFillG: 1e-320 }, 'jarNetFillG')).toBe('Jar fill must be at least 1 g.');
    expect(issue(formulaSettingsSchema, { ...settings, jarNetFillG: 0.5 }, 'jarNetFillG')).toBe('Jar fill must be at least 1 g.');
    expect(ok(formulaSettingsSchema, { ...settings, jarNetFillG: 1 })).toBe(true);
  });
  it('a line quantity is at least 0.001', () => {
    expect(issue(formulaLineSchema, { ...line, quantity: 1e-320 }, 'quantity')).toBe('Quantity must be at least 0.001.');
    expect(ok(formulaLineSchema, { ...line, quantity: 0.001 })).toBe(true);
  });
  it('a cook’s pH below 1 (−0, 1e-320) and a batch below 1 g are refused; a lemony pH 2.1 is kept', () => {
    const reason = 'Typed again.';
    for (const ph of [1e-320, -0, 0, 0.5]) expect(issue(correctCookSchema, { ph, reason }, 'ph')).toBe('A preserve’s pH below 1 is not plausible: check the reading.');
    expect(ok(correctCookSchema, { ph: 2.1, reason })).toBe(true);
    expect(issue(correctCookSchema, { batchSizeG: 1e-320, reason }, 'batchSizeG')).toBe('Batch size must be at least 1 g.');
    expect(issue(correctCookSchema, { yieldG: 1e-320, reason }, 'yieldG')).toBe('Yield must be 0 or at least 0.001 g.');
    expect(ok(correctCookSchema, { yieldG: 0, reason })).toBe(true);
  });
  it('where 0 is meaningful it stays (water’s solids, no refuse, no overfill) and −0 becomes 0; 1e-320 is refused', () => {
    const water = { name: 'Water', kind: 'water', solidsPct: 0 };
    expect(issue(ingredientInputSchema, { ...water, solidsPct: 1e-320 }, 'solidsPct')).toBe('Soluble solids must be 0 or at least 0.001 %.');
    expect(issue(ingredientInputSchema, { ...water, phMin: 1e-320 }, 'phMin')).toBe('pH must be 0 or at least 0.001.');
    expect(Object.is(ingredientInputSchema.parse({ ...water, solidsPct: -0, phMin: -0 }).solidsPct, 0)).toBe(true);
    expect(Object.is(ingredientInputSchema.parse({ ...water, phMin: -0 }).phMin, 0)).toBe(true);
    expect(issue(refuseBodySchema, { refusePct: 1e-320 }, 'refusePct')).toBe('The refuse/trim share must be 0 or at least 0.001 %.');
    expect(ok(refuseBodySchema, { refusePct: 0 })).toBe(true);
    expect(issue(costSettingsSchema, { currency: 'GBP', overfillPct: 1e-320, costWarningPct: 5 }, 'overfillPct')).toBe('The overfill must be 0 or at least 0.001 %.');
    expect(Object.is(costSettingsSchema.parse({ currency: 'GBP', overfillPct: -0, costWarningPct: 5 }).overfillPct, 0)).toBe(true);
  });
});

describe('prototype-named keys', () => {
  it.each(['__proto__', 'constructor', 'prototype'])('safeRecord drops %s and has no prototype to pollute', (key) => {
    const r = safeRecord<unknown>([[key, { polluted: true }], ['kept', 1]]);
    expect(Object.keys(r)).toEqual(['kept']);
    expect(Object.getPrototypeOf(r)).toBeNull();
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
  it.each(['__proto__', 'constructor', 'valueOf', 'hasOwnProperty', 'toString'])('lookup(%s) finds nothing inherited', (key) => {
    expect(lookup({ level: 1 }, key)).toBeUndefined();
  });
  it.each(['__proto__', 'valueOf', 'hasOwnProperty', 'constructor'])('a notebook attribute named %s is refused, not run or stored', (key) => {
    const attrs = JSON.parse(`{"${key}": {"x": 1}, "level": 2}`);
    const problems = findDocProblems({ type: 'doc', content: [{ type: 'heading', attrs, content: [{ type: 'text', text: 'Hi' }] }] });
    expect(problems.map((p) => p.message).join(' ')).toContain(`no attribute "${key}"`);
  });
});

describe('values of the wrong JSON type', () => {
  // A number where text belongs answered "Enter text here."; an object where a list belongs answered zod's
  // "Invalid input: expected array, received object". Each message now names the field and the type wanted
  // (JSON types: RFC 8259 §3), and a field's own message is kept.
  const errorsOf = (schema: z.ZodType, value: unknown) => zodFieldErrors(schema.safeParse(value).error!);

  it('names the field, the type it wants and the type sent', () => {
    expect(invalidTypeMessage(['lines', 2, 'quantity'], 'number', 'ten')).toBe('"lines.2.quantity" must be a number, not text.');
    expect(invalidTypeMessage(['title'], 'string', 7)).toBe('"title" must be text, not a number.');
    expect(invalidTypeMessage(['lines'], 'array', {})).toBe('"lines" must be a list, not an object.');
    expect(invalidTypeMessage(['settings'], 'object', [])).toBe('"settings" must be an object, not a list.');
    expect(invalidTypeMessage(['force'], 'boolean', 'yes')).toBe('"force" must be true or false, not text.');
    expect(invalidTypeMessage(['note'], 'string', null)).toBe('"note" must be text, not null.');
    expect(invalidTypeMessage(['settings'], 'object', undefined)).toBe('"settings" is missing; it must be an object.');
    expect(invalidTypeMessage([], 'object', 'x')).toBe('The input must be an object, not text.');
  });

  it('a number as a trial title', () => {
    expect(errorsOf(createTrialSchema, { title: 12, question: 'Why?', formulaId: '00000000-0000-4000-8000-000000000000' })).toEqual({ title: ['"title" must be text, not a number.'] });
  });

  it('an object as the formula lines, a list as its settings, text as the forced save', async () => {
    const { reviseFormulaSchema: revise } = await import('@/lib/formulas/schema');
    expect(errorsOf(revise, { baseRevision: 1, force: 'yes', settings: [], lines: {} })).toEqual({
      force: ['"force" must be true or false, not text.'],
      settings: ['"settings" must be an object, not a list.'],
      lines: ['"lines" must be a list, not an object.'],
    });
  });

  it('keeps a field\'s own message: a quantity sent as text', () => {
    const line = { ingredientId: '00000000-0000-4000-8000-000000000000', quantity: '10', unit: 'g' };
    expect(errorsOf(formulaLineSchema, line)).toEqual({ quantity: ['Quantity must be a number.'] });
  });

  it('a number as an ingredient name, text as its pH', () => {
    expect(errorsOf(ingredientInputSchema, { name: 5, kind: 'fruit', solidsPct: 10, phMin: 'low' })).toMatchObject({ name: ['"name" must be text, not a number.'] });
  });

  it('a list where the whole body should be an object', () => {
    expect(errorsOf(createTrialSchema, [])).toEqual({ _: ['The input must be an object, not a list.'] });
  });

  it('a missing text field keeps the form\'s words', () => {
    expect(errorsOf(z.object({ note: text({ max: 10 }) }), {})).toEqual({ note: ['Enter text here.'] });
  });
});
