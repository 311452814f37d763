/**
 * PURE: numbers as people type them. One reader for every form field, query parameter and CSV
 * cell: plain decimal notation, a decimal comma accepted when there is no point ("6,5"), no hex,
 * no "Infinity", no thousands separators.
 */

// Plain decimal notation: optional sign, digits with an optional fraction, optional exponent.
const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** The typed number; null when the text is blank, NaN when it is not a number. */
export function readDecimal(text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
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
