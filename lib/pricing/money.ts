/**
 * Money as Setwell keeps it: whole minor units (cents, pence) of the workspace's one currency.
 * Pure. Which codes exist and how many decimals each has come from the runtime's ICU data (CLDR,
 * which follows ISO 4217's minor units), so no list of ours can go stale.
 */
import { GRAMS_PER_UNIT, type PackUnit } from './vocabulary';

const CODES: ReadonlySet<string> = new Set(Intl.supportedValuesOf('currency'));

export function isCurrencyCode(code: string): boolean {
  return /^[A-Z]{3}$/.test(code) && CODES.has(code);
}

/** Every currency the runtime knows, with its English name, for the settings' picker. */
export function currencyChoices(): { code: string; label: string }[] {
  const names = new Intl.DisplayNames(['en'], { type: 'currency' });
  return [...CODES].sort().map((code) => ({ code, label: `${code} — ${names.of(code) ?? code}` }));
}

/** Per currency code: making an Intl.NumberFormat costs far more than the figure it is asked for. */
const DIGITS = new Map<string, number>();

/** Decimals of the currency's minor unit (EUR 2, JPY 0, BHD 3). */
export function minorDigits(currency: string): number {
  let digits = DIGITS.get(currency);
  if (digits === undefined) {
    digits = new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
    // Bounded: a malformed code throws above, and there are 26³ well-formed ones at most.
    DIGITS.set(currency, digits);
  }
  return digits;
}

const AMOUNT = /^\d{1,12}(?:[.,]\d+)?$/;

/**
 * A typed amount ("12.50", "12,5") in minor units, or a message. More decimals than the currency
 * has are refused rather than rounded: a price is entered as it was paid.
 */
export function parseAmount(raw: string, currency: string): { minor: number } | { problem: string } {
  const s = raw.trim();
  if (s.startsWith('-')) return { problem: 'A price cannot be negative.' };
  if (!AMOUNT.test(s)) return { problem: `Give the price as a number, e.g. 12.50 (${currency}).` };
  const [whole, fraction = ''] = s.split(/[.,]/);
  const digits = minorDigits(currency);
  if (fraction.length > digits) {
    return { problem: digits === 0 ? `${currency} has no decimals.` : `${currency} has ${digits} decimals at most.` };
  }
  const minor = Number(whole) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
  if (!Number.isSafeInteger(minor)) return { problem: 'That price is too large.' };
  return { minor };
}

/** Minor units as the amount's plain decimal text ("1250" EUR → "12.50"), as CSV and forms use it. */
export function amountText(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  return (minor / 10 ** digits).toFixed(digits);
}

/** Minor units for a screen, with the currency stated: "EUR 12.50". */
export function formatMoney(minor: number, currency: string, extraDigits = 0): string {
  const minorUnit = minorDigits(currency);
  // No locale: the server and the browser print the same text, thousands grouped with commas.
  const [whole, fraction] = (minor / 10 ** minorUnit).toFixed(minorUnit + extraDigits).split('.');
  return `${currency} ${whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',')}${fraction ? `.${fraction}` : ''}`;
}

/** A mass typed in g, kg or lb, in grams. */
export function toGrams(value: number, unit: PackUnit): number {
  return value * GRAMS_PER_UNIT[unit];
}
