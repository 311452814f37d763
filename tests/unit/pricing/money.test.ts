/** Money entry and display: typed amounts to minor units in the currency's own decimals, never rounded silently. */
import { describe, it, expect } from 'vitest';
import { amountText, formatMoney, isCurrencyCode, minorDigits, parseAmount, toGrams } from '@/lib/pricing/money';
import { packSizeText, perMassText, perPieceText, unitPriceText } from '@/lib/pricing/display';

describe('currencies', () => {
  it('knows the minor units of ISO 4217', () => {
    // Source: ISO 4217 list one (SIX, current edition): EUR and GBP 2 decimals, JPY 0, BHD 3.
    expect(minorDigits('EUR')).toBe(2);
    expect(minorDigits('GBP')).toBe(2);
    expect(minorDigits('JPY')).toBe(0);
    expect(minorDigits('BHD')).toBe(3);
  });

  it('accepts codes ISO 4217 lists and refuses others', () => {
    expect(isCurrencyCode('EUR')).toBe(true);
    expect(isCurrencyCode('eur')).toBe(false);
    expect(isCurrencyCode('XYZ')).toBe(false);
    expect(isCurrencyCode('__proto__')).toBe(false);
  });
});

describe('typed amounts', () => {
  it('turns decimal text into whole minor units, with a comma as decimal mark too', () => {
    expect(parseAmount('12.50', 'EUR')).toEqual({ minor: 1250 });
    expect(parseAmount('12,5', 'EUR')).toEqual({ minor: 1250 });
    expect(parseAmount('0.07', 'GBP')).toEqual({ minor: 7 });
    expect(parseAmount('1500', 'JPY')).toEqual({ minor: 1500 });
    expect(parseAmount('1.234', 'BHD')).toEqual({ minor: 1234 });
    // 0.1 + 0.2 style float error cannot creep in: digits are joined, not multiplied.
    expect(parseAmount('1.15', 'EUR')).toEqual({ minor: 115 });
  });

  it('refuses negatives, more decimals than the currency has, exponents and junk', () => {
    expect(parseAmount('-1.00', 'EUR')).toEqual({ problem: 'A price cannot be negative.' });
    expect(parseAmount('1.005', 'EUR')).toEqual({ problem: 'EUR has 2 decimals at most.' });
    expect(parseAmount('10.5', 'JPY')).toEqual({ problem: 'JPY has no decimals.' });
    for (const junk of ['1e3', 'NaN', 'Infinity', '0x10', '', ' ', '1.2.3', '１２']) expect(parseAmount(junk, 'EUR')).toHaveProperty('problem');
  });

  it('writes minor units back as the amount text the import reads', () => {
    expect(amountText(1250, 'EUR')).toBe('12.50');
    expect(amountText(1500, 'JPY')).toBe('1500');
    expect(parseAmount(amountText(98765, 'GBP'), 'GBP')).toEqual({ minor: 98765 });
  });

  it('states the currency beside every figure', () => {
    expect(formatMoney(2625, 'GBP')).toBe('GBP 26.25');
    expect(formatMoney(123456789, 'EUR')).toBe('EUR 1,234,567.89');
    expect(formatMoney(1500, 'JPY')).toBe('JPY 1,500');
    expect(formatMoney(4.5, 'EUR', 2)).toBe('EUR 0.0450');
  });
});

describe('masses and unit prices', () => {
  it('stores pounds in grams', () => {
    // Source: International Yard and Pound Agreement (1959): 1 lb = 0.453 592 37 kg exactly.
    expect(toGrams(1, 'lb')).toBe(453.59237);
    expect(toGrams(25, 'kg')).toBe(25_000);
  });

  it('works out the price per kg, per lb and per piece (worked by hand)', () => {
    // GBP 26.25 for 25 kg = 105 pence per kg; per lb: 105 × 0.45359237 = 47.63 pence.
    expect(perMassText(2625, 25_000, 'GBP', 'metric')).toBe('GBP 1.05 per kg');
    expect(perMassText(2625, 25_000, 'GBP', 'imperial')).toBe('GBP 0.48 per lb');
    // GBP 37.50 for 1000 labels = 3.75 pence each.
    expect(perPieceText(3750, 1000, 'GBP')).toBe('GBP 0.0375 each');
    expect(packSizeText(25_000, 'metric')).toBe('25 kg');
    expect(packSizeText(500, 'metric')).toBe('500 g');
    expect(packSizeText(453.59237 * 2, 'imperial')).toBe('2 lb');
  });

  it('never shows a small price as 0.00, and says plainly when a price is 0', () => {
    // The demo's mains water: GBP 2.10 per 1000 kg = 0.21 pence per kg (worked by hand).
    expect(perMassText(210, 1_000_000, 'GBP', 'metric')).toBe('GBP 0.0021 per kg');
    // Per lb: 0.21 × 0.45359237 = 0.0953 pence.
    expect(perMassText(210, 1_000_000, 'GBP', 'imperial')).toBe('GBP 0.00095 per lb');
    expect(perMassText(0, 1_000_000, 'GBP', 'metric')).toBe('no cost');
    expect(unitPriceText(0, 'GBP')).toBe('no cost');
    expect(unitPriceText(0.5, 'GBP')).toBe('GBP 0.01');
    expect(unitPriceText(105, 'GBP')).toBe('GBP 1.05');
    // Yen has no minor digits: 0.3 yen per kg keeps two significant digits.
    expect(unitPriceText(0.3, 'JPY')).toBe('JPY 0.30');
  });
});
