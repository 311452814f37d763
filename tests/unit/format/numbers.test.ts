/** The one reader of typed numbers (issue 18, part 5: it replaces five parsers that disagreed). */
import { describe, expect, it } from 'vitest';
import { readDecimal, readOptionalDecimal } from '@/lib/format/numbers';
import { parseDecimal } from '@/lib/input';
import { parseNumber } from '@/components/production/temperature';
import { parseDecimal as editorParse } from '@/components/formulas/editor-state';

describe('readDecimal', () => {
  it.each([
    ['6.5', 6.5], ['6,5', 6.5], [' 104 ', 104], ['-0.25', -0.25], ['.5', 0.5], ['1e3', 1000], ['+3', 3],
  ])('reads %j as %d', (text, value) => expect(readDecimal(text)).toBe(value));

  it('blank is "not given", not zero', () => {
    expect(readDecimal('')).toBeNull();
    expect(readDecimal('   ')).toBeNull();
  });

  it.each(['0x10', 'Infinity', '1e400', '1,000.5', '1.000.5', '6,5,1', 'abc', '12 g', '−3'])('refuses %j', (text) => {
    expect(Number.isNaN(readDecimal(text))).toBe(true);
    expect(readOptionalDecimal(text)).toBeNull();
  });

  it('the query/CSV reader, the production forms and the formula editor give the same answers', () => {
    for (const text of ['6,5', '0x10', '', '1e3', 'Infinity']) {
      const one = readDecimal(text);
      expect(editorParse(text)).toEqual(one);
      expect(parseNumber(text)).toEqual(one === null || Number.isNaN(one) ? null : one);
      expect(parseDecimal(text)).toEqual(one ?? Number.NaN);
    }
  });
});
