/**
 * The studentized range cdf is jstat's tukey.cdf (its port of R's ptukey) with the constant tables
 * built once: it must return jstat's values to the last bit, over the means, error df and q a
 * tasting produces (2–20 samples, df from 2 to past the large-df shortcut at 25,000).
 */
import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { studentizedRangeCdfExact } from '@/lib/stats/studentized-range';

const jstatCdf = (q: number, k: number, df: number): number | 'throws' => {
  try {
    return jStat.tukey.cdf(q, k, df);
  } catch {
    return 'throws';
  }
};
const ours = (q: number, k: number, df: number): number | 'throws' => {
  try {
    return studentizedRangeCdfExact(q, k, df);
  } catch {
    return 'throws';
  }
};

describe('the studentized range cdf', () => {
  it('equals jstat’s tukey.cdf bit for bit', () => {
    const qs = [0, 1e-9, 0.01, 0.3, 1, 1.7, 2.5, 3.1, 3.5, 4.2, 5, 6.3, 8, 11, 15.9, 16, 17, 30, Number.POSITIVE_INFINITY];
    const ks = [2, 3, 5, 8, 12, 20];
    const dfs = [2, 3, 7, 20, 99, 100, 101, 649, 800, 801, 1319, 5000, 5001, 24999, 25001, 1e6];
    let compared = 0;
    for (const k of ks) for (const df of dfs) for (const q of qs) {
      expect(Object.is(ours(q, k, df), jstatCdf(q, k, df)), `q ${q}, k ${k}, df ${df}`).toBe(true);
      compared++;
    }
    expect(compared).toBe(qs.length * ks.length * dfs.length);
  });

  it('gives the published value and refuses what jstat refuses', () => {
    // R: ptukey(3.5, 3, 20) = 0.9441081509 (as in distributions.test.ts).
    expect(studentizedRangeCdfExact(3.5, 3, 20)).toBeCloseTo(0.9441081509, 7);
    expect(studentizedRangeCdfExact(3, 1, 20)).toBeNaN();
    expect(studentizedRangeCdfExact(3, 3, 1)).toBeNaN();
    expect(studentizedRangeCdfExact(-1, 3, 20)).toBe(0);
  });
});
