/** The one reader of typed numbers (issue 18, part 5: it replaces five parsers that disagreed). */
import { describe, expect, it } from 'vitest';
import { isAmbiguousComma, readDecimal, readOptionalDecimal, unreadableNumberMessage } from '@/lib/format/numbers';
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

  // A walk found "1,200" g read as 1.2 g: a thousandfold error with no message. Such a comma is read
  // by some as a thousands separator and by others as a decimal comma, so it is refused, with both readings named.
  it.each(['1,200', '12,500', '-1,000', ' 250,000 '])('refuses the grouping-shaped %j and says what it could mean', (text) => {
    expect(Number.isNaN(readDecimal(text))).toBe(true);
    expect(isAmbiguousComma(text)).toBe(true);
    expect(unreadableNumberMessage(text)).toMatch(/could mean .+ or .+: write it without the comma, or with a point for a decimal\./);
  });

  it('names both readings of "1,200"', () => {
    expect(unreadableNumberMessage('1,200')).toBe('“1,200” could mean 1200 or 1.200: write it without the comma, or with a point for a decimal.');
    expect(unreadableNumberMessage('abc')).toBe('“abc” is not a number.');
  });

  it.each([['0,5', 0.5], ['1,25', 1.25], ['6,5', 6.5], ['1,2345', 1.2345], ['1200', 1200]])('still reads the decimal comma of %j', (text, value) => {
    expect(isAmbiguousComma(text)).toBe(false);
    expect(readDecimal(text)).toBe(value);
  });

  it('the query/CSV reader, the production forms and the formula editor give the same answers', () => {
    for (const text of ['6,5', '0x10', '', '1e3', 'Infinity', '1,200']) {
      const one = readDecimal(text);
      expect(editorParse(text)).toEqual(one);
      expect(parseNumber(text)).toEqual(one === null || Number.isNaN(one) ? null : one);
      expect(parseDecimal(text)).toEqual(one ?? Number.NaN);
    }
  });
});
