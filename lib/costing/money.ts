/**
 * Money rounding. Every costing figure is computed in unrounded minor units (a cost per jar of
 * 37.4682 pence stays that while it is summed, divided and compared) and rounded once, where it is
 * shown or stored, to whole minor units.
 *
 * The rule is round half to even (banker's rounding): a cost table sums and compares many rounded
 * figures (variants, versions, batches), and half-up would push every exact tie the same way.
 * Sums and quotients of binary floats land a hair off an exact .5, so a value within
 * TIE_TOLERANCE of a half is treated as the tie it was meant to be.
 */

/** Far below a thousandth of a minor unit, far above the float noise of a few dozen operations. */
const TIE_TOLERANCE = 1e-7;

/** Rounds unrounded minor units to whole minor units, half to even. */
export function roundMinor(minor: number): number {
  if (!Number.isFinite(minor)) throw new RangeError('money must be a finite number');
  const floor = Math.floor(minor);
  const fraction = minor - floor;
  let rounded: number;
  if (Math.abs(fraction - 0.5) <= TIE_TOLERANCE) rounded = floor % 2 === 0 ? floor : floor + 1;
  else rounded = fraction < 0.5 ? floor : floor + 1;
  // -0 shows as "-£0.00"; a zero is a zero.
  return rounded === 0 ? 0 : rounded;
}

const ISO_CURRENCY = /^[A-Z]{3}$/;

/** Digits after the decimal point in the currency's minor unit (2 for GBP/EUR, 0 for JPY). */
export function minorDigits(currency: string): number {
  if (!ISO_CURRENCY.test(currency)) return 2;
  try {
    return new Intl.NumberFormat('en-GB', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

/**
 * Unrounded minor units → a figure in the currency for the screen ("£1.23", "€0.45"), rounded once
 * with roundMinor. `signed` puts a plus on positive differences (sensitivity, movements).
 */
export function formatMoney(minor: number, currency: string, options: { signed?: boolean } = {}): string {
  const digits = minorDigits(currency);
  const whole = roundMinor(minor);
  const major = whole / 10 ** digits;
  let text: string;
  try {
    text = new Intl.NumberFormat('en-GB', {
      style: 'currency',
      currency: ISO_CURRENCY.test(currency) ? currency : 'XXX',
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    }).format(major);
  } catch {
    text = `${major.toFixed(digits)} ${currency}`;
  }
  return options.signed && whole > 0 ? `+${text}` : text;
}

/** Unrounded minor units → a plain decimal in major units for CSV and the API ("1.23"). */
export function minorToDecimal(minor: number, currency: string): string {
  const digits = minorDigits(currency);
  const whole = roundMinor(minor);
  const sign = whole < 0 ? '-' : '';
  const abs = Math.abs(whole);
  if (digits === 0) return `${sign}${abs}`;
  const text = String(abs).padStart(digits + 1, '0');
  return `${sign}${text.slice(0, -digits)}.${text.slice(-digits)}`;
}
