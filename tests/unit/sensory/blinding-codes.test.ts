import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import {
  ALLOWED_BLINDING_CODES,
  BlindingCodeShortageError,
  LOADED_BLINDING_NUMBERS,
  assignBlindingCodes,
  blindingCodeRejectionReason,
  createSeededRandomInt,
  cryptoRandomInt,
  drawBlindingCodes,
  isAllowedBlindingCode,
  type RandomIntSource,
} from '@/lib/sensory';

// Loaded untyped on purpose: this test needs one jstat function and brings its own type.
const jStat = createRequire(import.meta.url)('jstat') as {
  chisquare: { inv(probability: number, degreesOfFreedom: number): number };
};

/** Independent restatement of the exclusion rules, so the test does not reuse the module's check. */
function looksPatterned(code: string): boolean {
  const d = [...code].map(Number);
  const repdigit = d[0] === d[1] && d[1] === d[2];
  const ascending = d[1] === d[0] + 1 && d[2] === d[1] + 1;
  const descending = d[1] === d[0] - 1 && d[2] === d[1] - 1;
  return code.startsWith('0') || repdigit || ascending || descending || LOADED_BLINDING_NUMBERS.includes(code);
}

function expectWellFormedDraw(codes: string[], expectedCount: number): void {
  // Source: ISO 13299 — "samples shall be coded with three-digit random numbers"
  expect(codes).toHaveLength(expectedCount);
  for (const code of codes) expect(code).toMatch(/^[1-9][0-9]{2}$/);
  // Common practice, no published source: codes unique within a session; no repdigits, runs or loaded numbers
  expect(new Set(codes).size).toBe(codes.length);
  for (const code of codes) expect(looksPatterned(code), code).toBe(false);
}

describe('blinding code rules', () => {
  it('rejects repdigits, ascending and descending runs, leading zeros and loaded numbers', () => {
    // Common practice, no published source: avoid repdigits, runs and loaded numbers
    expect(blindingCodeRejectionReason('111')).toBe('repdigit');
    expect(blindingCodeRejectionReason('777')).toBe('repdigit');
    expect(blindingCodeRejectionReason('123')).toBe('ascending-run');
    expect(blindingCodeRejectionReason('789')).toBe('ascending-run');
    expect(blindingCodeRejectionReason('321')).toBe('descending-run');
    expect(blindingCodeRejectionReason('210')).toBe('descending-run');
    expect(blindingCodeRejectionReason('042')).toBe('leading-zero');
    expect(blindingCodeRejectionReason('007')).toBe('leading-zero');
    for (const code of ['100', '200', '500', '911', '101']) expect(blindingCodeRejectionReason(code)).toBe('loaded-number');
    expect(blindingCodeRejectionReason('666')).toBe('repdigit');
    expect(blindingCodeRejectionReason('42')).toBe('not-three-digits');
    expect(blindingCodeRejectionReason('4a2')).toBe('not-three-digits');
    expect(isAllowedBlindingCode('583')).toBe(true);
    expect(isAllowedBlindingCode('135')).toBe(true); // steps of 2 are not a run
  });

  it('allows exactly the three-digit codes that pass the independent restatement', () => {
    // Common practice, no published source: same exclusion rules, checked over all 1000 numbers
    const expected: string[] = [];
    for (let value = 0; value < 1000; value++) {
      const code = String(value).padStart(3, '0');
      if (!looksPatterned(code)) expected.push(code);
    }
    expect(ALLOWED_BLINDING_CODES).toEqual(expected);
  });
});

describe('drawBlindingCodes', () => {
  it('never draws a patterned or repeated code over many seeded draws', () => {
    for (let seed = 1; seed <= 300; seed++) {
      expectWellFormedDraw(drawBlindingCodes(30, { random: createSeededRandomInt(seed) }), 30);
    }
  });

  it('never draws a patterned or repeated code over many draws from the crypto source', () => {
    for (let round = 0; round < 300; round++) expectWellFormedDraw(drawBlindingCodes(30), 30);
    expectWellFormedDraw(drawBlindingCodes(ALLOWED_BLINDING_CODES.length, { random: cryptoRandomInt }), ALLOWED_BLINDING_CODES.length);
  });

  it('reaches every allowed code, so the pool is not silently narrowed', () => {
    // Source: ISO 13299 — codes are random numbers, so every allowed code must be reachable
    const seen = new Set<string>();
    const random = createSeededRandomInt(2024);
    for (let round = 0; round < 200; round++) for (const code of drawBlindingCodes(40, { random })) seen.add(code);
    expect(seen.size).toBe(ALLOWED_BLINDING_CODES.length);
  });

  it('is deterministic for a given seed', () => {
    expect(drawBlindingCodes(12, { random: createSeededRandomInt(99) })).toEqual(
      drawBlindingCodes(12, { random: createSeededRandomInt(99) }),
    );
    expect(drawBlindingCodes(12, { random: createSeededRandomInt(99) })).not.toEqual(
      drawBlindingCodes(12, { random: createSeededRandomInt(100) }),
    );
  });

  it('never returns a code from the exclude set, given as text or numbers', () => {
    // Common practice, no published source: never reuse a code within the same session
    const firstRound = drawBlindingCodes(400, { random: createSeededRandomInt(5) });
    const secondRound = drawBlindingCodes(400, { exclude: firstRound, random: createSeededRandomInt(6) });
    expectWellFormedDraw([...firstRound, ...secondRound], 800);

    const excludedAsNumbers = ALLOWED_BLINDING_CODES.slice(0, ALLOWED_BLINDING_CODES.length - 2).map(Number);
    const remaining = drawBlindingCodes(2, { exclude: excludedAsNumbers, random: createSeededRandomInt(1) });
    expect(remaining.sort()).toEqual(ALLOWED_BLINDING_CODES.slice(-2));
  });

  it('throws a clear error when the request cannot be met', () => {
    // Common practice, no published source: codes unique within a session, so the pool is finite
    const allButThree = ALLOWED_BLINDING_CODES.slice(3);
    let caught: unknown;
    try {
      drawBlindingCodes(4, { exclude: allButThree });
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(BlindingCodeShortageError);
    expect((caught as BlindingCodeShortageError).availableCount).toBe(3);
    expect((caught as Error).message).toMatch(/Cannot draw 4 unique blinding codes: only 3/);
    expect(() => drawBlindingCodes(ALLOWED_BLINDING_CODES.length + 1)).toThrow(BlindingCodeShortageError);
    expect(() => drawBlindingCodes(-1)).toThrow(RangeError);
    expect(drawBlindingCodes(3, { exclude: allButThree }).sort()).toEqual(ALLOWED_BLINDING_CODES.slice(0, 3));
  });

  it('draws each allowed code about equally often', () => {
    // Source: ISO 13299 — "random numbers": the first code of each draw should be uniform over the pool.
    // Critical value: chi-square inverse cdf at 0.999, df = pool − 1, from jstat 1.9.6 (reference library).
    const random = createSeededRandomInt(31337);
    const counts = new Map<string, number>();
    const draws = ALLOWED_BLINDING_CODES.length * 50;
    for (let i = 0; i < draws; i++) {
      const [code] = drawBlindingCodes(1, { random });
      counts.set(code, (counts.get(code) ?? 0) + 1);
    }
    const expected = draws / ALLOWED_BLINDING_CODES.length;
    let chiSquare = 0;
    for (const code of ALLOWED_BLINDING_CODES) chiSquare += ((counts.get(code) ?? 0) - expected) ** 2 / expected;
    const criticalValue = jStat.chisquare.inv(0.999, ALLOWED_BLINDING_CODES.length - 1);
    expect(criticalValue).toBeGreaterThan(ALLOWED_BLINDING_CODES.length); // sanity: inverse cdf lies above df
    expect(chiSquare).toBeLessThan(criticalValue);
  });
});

describe('assignBlindingCodes', () => {
  it('gives each sample a distinct allowed code', () => {
    // Common practice, no published source: one unique code per sample within a session
    const codes = assignBlindingCodes(['s1', 's2', 's3'], { random: createSeededRandomInt(4), exclude: ['583'] });
    expect([...codes.keys()]).toEqual(['s1', 's2', 's3']);
    expectWellFormedDraw([...codes.values()], 3);
    expect([...codes.values()]).not.toContain('583');
    expect(() => assignBlindingCodes(['s1', 's1'])).toThrow(/unique/);
  });
});

describe('random sources', () => {
  it('stay within [0, max) and reject bad bounds', () => {
    const sources: RandomIntSource[] = [cryptoRandomInt, createSeededRandomInt(1)];
    for (const random of sources) {
      for (let i = 0; i < 2000; i++) {
        const value = random(7);
        expect(Number.isInteger(value) && value >= 0 && value < 7).toBe(true);
      }
      expect(random(1)).toBe(0);
      expect(() => random(0)).toThrow(RangeError);
      expect(() => random(2.5)).toThrow(RangeError);
    }
  });
});
