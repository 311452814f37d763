import { describe, expect, it } from 'vitest';
import { costDecimal, formatCost, roundMinor } from '@/lib/costing';

// Rounding rule: our choice, round half to even, stated in lib/costing/money.ts (common practice in
// bookkeeping, no published source needed for the arithmetic itself).
describe('roundMinor: round half to even, once', () => {
  it('rounds a tie to the even neighbour on both sides of .5', () => {
    expect(roundMinor(12.5)).toBe(12);
    expect(roundMinor(13.5)).toBe(14);
    expect(roundMinor(0.5)).toBe(0);
    expect(roundMinor(1.5)).toBe(2);
    expect(roundMinor(-2.5)).toBe(-2);
    expect(roundMinor(-3.5)).toBe(-4);
  });

  it('rounds just below and just above a tie to the nearer whole unit', () => {
    expect(roundMinor(12.49)).toBe(12);
    expect(roundMinor(12.51)).toBe(13);
    expect(roundMinor(13.4999)).toBe(13);
    expect(roundMinor(13.5001)).toBe(14);
  });

  it('treats float noise around a tie as the tie it was meant to be', () => {
    // (12.5 / 97) × 97 = 12.499999999999998 and (12.5 / 11) × 11 = 12.500000000000002 in binary
    // floats; both meant 12.5, which rounds to 12.
    const below = (12.5 / 97) * 97;
    const above = (12.5 / 11) * 11;
    expect(below).toBeLessThan(12.5);
    expect(above).toBeGreaterThan(12.5);
    expect(roundMinor(below)).toBe(12);
    expect(roundMinor(above)).toBe(12);
    expect(roundMinor(13.5 + 1e-12)).toBe(14);
  });

  it('never returns minus zero and refuses what is not a number', () => {
    expect(Object.is(roundMinor(-0.2), 0)).toBe(true);
    expect(() => roundMinor(Number.NaN)).toThrow(RangeError);
    expect(() => roundMinor(Infinity)).toThrow(RangeError);
  });
});

describe('costs on screen and in data', () => {
  it('are rounded once, half to even, and written as prices are', () => {
    expect(formatCost(106.573, 'GBP')).toBe('GBP 1.07');
    expect(formatCost(112.5, 'GBP')).toBe('GBP 1.12');
    expect(formatCost(113.5, 'GBP')).toBe('GBP 1.14');
    expect(formatCost(1.9095, 'GBP', { signed: true })).toBe('+GBP 0.02');
    expect(formatCost(-1.9095, 'GBP', { signed: true })).toBe('−GBP 0.02');
    // Source: ISO 4217 minor units (JPY has none), as carried by the runtime's ICU data.
    expect(formatCost(1234.5, 'JPY')).toBe('JPY 1,234');
  });

  it('go to CSV and the API as plain decimals in major units', () => {
    expect(costDecimal(106.573, 'GBP')).toBe('1.07');
    expect(costDecimal(5, 'GBP')).toBe('0.05');
    expect(costDecimal(250.5, 'EUR')).toBe('2.50');
    expect(costDecimal(1234, 'JPY')).toBe('1234');
  });
});
