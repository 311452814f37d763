/**
 * CSV out and back in (lib/csv.ts). Export puts an apostrophe before a cell a spreadsheet would run as
 * a formula (OWASP, "CSV Injection": cells starting with = + - @, tab or carriage return); the
 * imports take exactly that apostrophe off again. Before, "+WalkA plus" came back as "'+WalkA plus"
 * (user walk), and a re-imported price with such a supplier was counted as a new point.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { csvNumber, defuse, readCsv, toCsv, undefuse } from '@/lib/csv';
import { ingredientsToCsv, parseIngredientCsv } from '@/lib/ingredients/csv';
import { parseCookCsv } from '@/lib/trials/csv';
import { parsePriceCsv } from '@/lib/pricing/csv';
import { typicalRow } from '../formulas-library/fixtures';

describe('the formula guard comes off exactly', () => {
  it.each(['+WalkA plus', '=SUM(A1)', '-- runny', '@home', "'+already quoted", "''=twice"])('%j survives export and import', (value) => {
    const csv = toCsv([{ v: value }], [{ header: 'v', value: (r) => r.v }]);
    expect(csv).toContain(`'${value}`);
    expect(readCsv(csv).data[0].v).toBe(value);
  });
  it('leaves every other apostrophe alone', () => {
    for (const value of ["'tis the season", "O'Neill's damsons", "'", "' +spaced"]) expect(undefuse(value)).toBe(value);
  });
  it('any text: undefuse(defuse(x)) is x', () => {
    fc.assert(fc.property(fc.string(), (s) => undefuse(defuse(s) as string) === s));
  });
});

describe('each import reads the guard back', () => {
  it('an ingredient named "+WalkA plus" keeps its name through export and import', () => {
    const library = [typicalRow('strawberry', { name: '+WalkA plus', notes: '-- picked wet' })];
    const { rows, errors } = parseIngredientCsv(ingredientsToCsv(library), library);
    expect(errors).toEqual([]);
    expect(rows[0]).toMatchObject({ ingredientId: library[0].id, input: { name: '+WalkA plus', notes: '-- picked wet' } });
  });
  it('a price row finds the ingredient "=Walk quince" and keeps the supplier "+Walk mill"', () => {
    const csv = "ingredient,valid_from,pack_price,pack_size,pack_unit,supplier\n'=Walk quince,2026-08-01,31.00,25,kg,'+Walk mill\n";
    const { rows, errors } = parsePriceCsv(csv, new Map([['=walk quince', ['6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10']]]), 'EUR');
    expect(errors).toEqual([]);
    expect(rows[0]).toMatchObject({ ingredient: '6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10', supplier: '+Walk mill' });
  });
  it('a cook note exported as "\'-- too runny" comes back without the apostrophe', () => {
    const { rows, errors } = parseCookCsv("variant,cook_date,ph,notes\nB,2026-11-18,3.2,'-- too runny\n", new Map([['B', '6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10']]));
    expect(errors).toEqual([]);
    expect(rows[0].notes).toBe('-- too runny');
  });
});

describe('price CSV rows are numbered as a spreadsheet shows them (the header is row 1)', () => {
  // User walk: a U+202E in the one data row was reported as "row 1", a bad date in the same place as "row 2".
  const names = new Map([['sucrose', ['6f1c0b9e-8a47-4d7e-9a59-3c1f2a7b9e10']]]);
  const header = 'ingredient,valid_from,pack_price,pack_size,pack_unit,supplier\n';
  it.each([
    ['a text-direction override', 'sucrose,2026-08-01,31.00,25,kg,Mill\u202E\n', 'supplier'],
    ['a NUL', 'sucrose\u0000,2026-08-01,31.00,25,kg,Mill\n', 'ingredient'],
    ['an impossible date', 'sucrose,2026-02-30,31.00,25,kg,Mill\n', 'valid_from'],
  ])('%s in the first data row is row 2, in its column', (_what, line, column) => {
    const { rows, errors } = parsePriceCsv(header + line, names, 'EUR');
    expect(rows).toEqual([]);
    expect(errors).toEqual([expect.objectContaining({ row: 2, column })]);
  });
  it('the third data row is row 4, and a poisoned header is row 1', () => {
    const good = 'sucrose,2026-08-01,31.00,25,kg,Mill\n';
    expect(parsePriceCsv(header + good + good + 'sucrose,2026-08-03,31.00,25,kg,\uD800\n', names, 'EUR').errors).toEqual([expect.objectContaining({ row: 4, column: 'supplier' })]);
    expect(parsePriceCsv('ingredient\u202E,valid_from,pack_price,pack_size,pack_unit\n' + good, names, 'EUR').errors).toEqual(expect.arrayContaining([expect.objectContaining({ row: 1 })]));
  });
});

describe('numbers in CSV', () => {
  // A walk found 6.199999999999999 and 1233.3333333333335 in the tasting CSVs: binary noise, not data.
  it('go out with 12 significant digits: noise gone, measured digits kept', () => {
    expect(csvNumber(6.199999999999999)).toBe(6.2);
    expect(csvNumber(1233.3333333333335)).toBe(1233.33333333);
    expect(csvNumber(101.19985457281106)).toBe(101.199854573);
    expect(csvNumber(-0)).toBe(0);
    expect(csvNumber(65.25)).toBe(65.25);
    expect(toCsv([{ x: 0.1 + 0.2 }], [{ header: 'x', value: (r) => r.x }])).toBe('x\r\n0.3');
  });
});
