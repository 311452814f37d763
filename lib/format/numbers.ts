/**
 * PURE: numbers as people type them. One reader for every form field, query parameter and CSV
 * cell: plain decimal notation, a decimal comma accepted when there is no point ("6,5"), no hex,
 * no "Infinity", no thousands separators. "1,200" is refused, not guessed: a comma before exactly
 * three digits is a thousands separator to some and a decimal comma to others, and reading it the
 * wrong way is a thousandfold error in a batch.
 */

// Plain decimal notation: optional sign, digits with an optional fraction, optional exponent.
const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
// One comma, one to three digits before it and exactly three after: "1,200", "12,500".
const GROUPED = /^[+-]?\d{1,3},\d{3}$/;

/** True for "1,200": it could be 1200 or 1.2. */
export function isAmbiguousComma(text: string): boolean {
  return GROUPED.test(text.trim());
}

/** Why a cell or field could not be read, in the words a person needs to fix it. */
export function unreadableNumberMessage(text: string): string {
  const t = text.trim();
  if (!isAmbiguousComma(t)) return `“${t}” is not a number.`;
  return `“${t}” could mean ${t.replace(',', '')} or ${t.replace(',', '.')}: write it without the comma, or with a point for a decimal.`;
}

/** The typed number; null when the text is blank, NaN when it is not a number (or could be two). */
export function readDecimal(text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  if (GROUPED.test(trimmed)) return Number.NaN;
  const normalised = trimmed.includes('.') ? trimmed : trimmed.replace(',', '.');
  if (!DECIMAL.test(normalised)) return Number.NaN;
  const value = Number(normalised);
  return Number.isFinite(value) ? value : Number.NaN;
}

/** The typed number, or null when blank or unreadable (the schema then answers with its own message). */
export function readOptionalDecimal(text: string): number | null {
  const n = readDecimal(text);
  return n === null || Number.isNaN(n) ? null : n;
}

/** A form field's number: blank is "not given" (valid, null); anything unreadable is invalid. */
export function readFieldNumber(raw: unknown): { value: number | null; valid: boolean } {
  const value = readDecimal(typeof raw === 'string' ? raw : '');
  return value !== null && Number.isNaN(value) ? { value: null, valid: false } : { value, valid: true };
}
