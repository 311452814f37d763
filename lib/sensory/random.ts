/**
 * Injected randomness for the sensory designs.
 *
 * Every function that draws codes or shuffles samples takes a `RandomIntSource`, so tests can
 * replay a draw with a seed while real sessions use the cryptographic default.
 */

/** Returns a uniformly distributed integer in [0, maxExclusive). */
export type RandomIntSource = (maxExclusive: number) => number;

const UINT32_RANGE = 0x1_0000_0000;

function assertValidBound(maxExclusive: number): void {
  if (!Number.isInteger(maxExclusive) || maxExclusive < 1 || maxExclusive > UINT32_RANGE) {
    throw new RangeError(
      `Random bound must be an integer from 1 to ${UINT32_RANGE}; received ${maxExclusive}.`,
    );
  }
}

/**
 * Cryptographic default built on the Web Crypto global (browser and Node 20 alike).
 * Rejection sampling removes the modulo bias a plain `value % max` would add.
 */
export const cryptoRandomInt: RandomIntSource = (maxExclusive) => {
  assertValidBound(maxExclusive);
  // Largest multiple of maxExclusive that fits in 32 bits; values at or above it are redrawn.
  const acceptBelow = UINT32_RANGE - (UINT32_RANGE % maxExclusive);
  const buffer = new Uint32Array(1);
  for (;;) {
    globalThis.crypto.getRandomValues(buffer);
    const value = buffer[0];
    if (value < acceptBelow) return value % maxExclusive;
  }
};

/**
 * Deterministic source (mulberry32) for tests, demos and replaying a recorded plan.
 * Not cryptographic: never use it to blind a real session.
 */
export function createSeededRandomInt(seed: number): RandomIntSource {
  let state = seed >>> 0;
  const nextUint32 = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (t ^ (t >>> 14)) >>> 0;
  };
  return (maxExclusive) => {
    assertValidBound(maxExclusive);
    const acceptBelow = UINT32_RANGE - (UINT32_RANGE % maxExclusive);
    for (;;) {
      const value = nextUint32();
      if (value < acceptBelow) return value % maxExclusive;
    }
  };
}

/** Fisher–Yates shuffle into a new array; the input is left untouched. */
export function shuffled<T>(items: readonly T[], random: RandomIntSource = cryptoRandomInt): T[] {
  const result = items.slice();
  for (let i = result.length - 1; i > 0; i--) {
    const j = random(i + 1);
    [result[i], result[j]] = [result[j], result[i]];
  }
  return result;
}
