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

import { amountText, formatMoney } from '@/lib/pricing/money';

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

/**
 * Unrounded minor units → the screen's figure ("GBP 1.07"), rounded once with roundMinor and
 * written the way prices are (lib/pricing/money.ts). `signed` marks rises ("+GBP 0.02").
 */
export function formatCost(minor: number, currency: string, options: { signed?: boolean } = {}): string {
  const whole = roundMinor(minor);
  if (!options.signed) return formatMoney(whole, currency);
  const text = formatMoney(Math.abs(whole), currency);
  return whole > 0 ? `+${text}` : whole < 0 ? `−${text}` : text;
}

/** Unrounded minor units → a plain decimal in major units for CSV and the API ("1.07"). */
export function costDecimal(minor: number, currency: string): string {
  return amountText(roundMinor(minor), currency);
}
