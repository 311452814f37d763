/**
 * Three-digit blinding codes for sensory samples.
 *
 * ISO 13299 asks that "samples shall be coded with three-digit random numbers". The rules
 * below on which numbers to avoid are common practice, no published source: a code should
 * carry no meaning a taster could read into it.
 */
import { cryptoRandomInt, type RandomIntSource } from './random';

/** Why a three-digit number is never used as a blinding code. */
export type BlindingCodeRejection =
  | 'not-three-digits'
  | 'leading-zero'
  | 'repdigit'
  | 'ascending-run'
  | 'descending-run'
  | 'loaded-number';

/**
 * Numbers with everyday meaning that could suggest a rank, a warning or a joke.
 * Common practice, no published source; the list is our own and deliberately short.
 * Repdigits (666, 999) and codes with a leading zero (007) are also caught by other rules;
 * they stay here so the list reads as the intent.
 */
export const LOADED_BLINDING_NUMBERS: readonly string[] = Object.freeze([
  // Round hundreds read as scores or prices.
  '100', '200', '300', '400', '500', '600', '700', '800', '900',
  '101', // "introductory", "basics"
  '007', // a well-known fictional agent number
  '666', // ominous
  '911', // emergency number
  '999', // emergency number; also "top score"
]);

const loadedNumberSet: ReadonlySet<string> = new Set(LOADED_BLINDING_NUMBERS);

/**
 * Returns the reason a code is never drawn, or `null` when it may be drawn.
 *
 * Codes starting with 0 are excluded: spreadsheets, phone keypads and number fields drop
 * the leading zero ("042" becomes 42), so the code stops being the three-digit number the
 * standard asks for and can be mistyped or mismatched on the serving sheet.
 */
export function blindingCodeRejectionReason(code: string): BlindingCodeRejection | null {
  if (!/^[0-9]{3}$/.test(code)) return 'not-three-digits';
  if (code[0] === '0') return 'leading-zero';
  const [first, second, third] = [...code].map(Number);
  if (first === second && second === third) return 'repdigit';
  if (second - first === 1 && third - second === 1) return 'ascending-run';
  if (first - second === 1 && second - third === 1) return 'descending-run';
  if (loadedNumberSet.has(code)) return 'loaded-number';
  return null;
}

/** True when the code may be drawn (before session-level exclusions). */
export function isAllowedBlindingCode(code: string): boolean {
  return blindingCodeRejectionReason(code) === null;
}

/** Normalises numbers to their three-digit text form so 42 and "042" exclude the same code. */
export function normaliseBlindingCode(code: string | number): string {
  if (typeof code === 'number') {
    if (!Number.isInteger(code) || code < 0 || code > 999) {
      throw new RangeError(`Blinding code ${code} is not a whole number from 0 to 999.`);
    }
    return String(code).padStart(3, '0');
  }
  return code.trim();
}

/** Every code that passes the pattern rules, in ascending order. */
export const ALLOWED_BLINDING_CODES: readonly string[] = Object.freeze(
  Array.from({ length: 1000 }, (_, value) => String(value).padStart(3, '0')).filter(
    isAllowedBlindingCode,
  ),
);

export interface DrawBlindingCodesOptions {
  /** Codes already used in this session; they are never drawn again. */
  exclude?: Iterable<string | number>;
  /** Injected randomness; defaults to the Web Crypto source. */
  random?: RandomIntSource;
}

/** Thrown when a session asks for more codes than remain available. */
export class BlindingCodeShortageError extends Error {
  readonly requestedCount: number;
  readonly availableCount: number;

  constructor(requestedCount: number, availableCount: number) {
    super(
      `Cannot draw ${requestedCount} unique blinding codes: only ${availableCount} allowed ` +
        `three-digit codes remain after excluding repdigits, runs, loaded numbers and codes ` +
        `already used in this session.`,
    );
    this.name = 'BlindingCodeShortageError';
    this.requestedCount = requestedCount;
    this.availableCount = availableCount;
  }
}

/**
 * Draws `count` distinct three-digit codes uniformly from the allowed pool, skipping any
 * code in `exclude`. Returned in draw order, which is itself random.
 */
export function drawBlindingCodes(count: number, options: DrawBlindingCodesOptions = {}): string[] {
  if (!Number.isInteger(count) || count < 0) {
    throw new RangeError(`Code count must be a whole number of zero or more; received ${count}.`);
  }
  const random = options.random ?? cryptoRandomInt;
  const excluded = new Set<string>();
  for (const code of options.exclude ?? []) excluded.add(normaliseBlindingCode(code));

  const pool = ALLOWED_BLINDING_CODES.filter((code) => !excluded.has(code));
  if (count > pool.length) throw new BlindingCodeShortageError(count, pool.length);

  // Partial Fisher–Yates: the first `count` slots end up a uniform random sample.
  for (let i = 0; i < count; i++) {
    const j = i + random(pool.length - i);
    [pool[i], pool[j]] = [pool[j], pool[i]];
  }
  return pool.slice(0, count);
}

/**
 * Gives each sample its own code, e.g. one code per sample for a whole session.
 * Sample ids must be unique.
 */
export function assignBlindingCodes(
  sampleIds: readonly string[],
  options: DrawBlindingCodesOptions = {},
): Map<string, string> {
  if (new Set(sampleIds).size !== sampleIds.length) {
    throw new Error('Sample ids must be unique to receive blinding codes.');
  }
  const codes = drawBlindingCodes(sampleIds.length, options);
  return new Map(sampleIds.map((sampleId, index) => [sampleId, codes[index]]));
}
