import { describe, expect, it } from 'vitest';
import { friedmanTest, midRanks, type RankingBlock } from '@/lib/stats';
import { collectNonFiniteNumbers, roundingMethods, roundingTimes, warpbreaks } from './fixtures';

const roundingBlocks: RankingBlock[] = roundingTimes.map((times, player) => ({
  block: `player ${player + 1}`,
  values: Object.fromEntries(roundingMethods.map((method, j) => [method, times[j]])),
}));

describe('Friedman test', () => {
  it('reproduces R friedman.test(RoundingTimes), which has ties', () => {
    const result = friedmanTest(roundingBlocks);
    // Source: R stats::friedman.test help page example (Hollander & Wolfe 1973, p. 140 ff.):
    // Friedman chi-squared = 11.143, df = 2, p-value = 0.003805
    expect(result.statistic).toBeCloseTo(11.143, 3);
    expect(result.df).toBe(2);
    expect(result.p).toBeCloseTo(0.003805, 6);
    expect(result.tieCorrection).toBeGreaterThan(0);
  });

  it('reproduces R friedman.test(x ~ w | t, data = wb) on warpbreaks cell means', () => {
    // wb = aggregate(warpbreaks$breaks, by = list(w = wool, t = tension), FUN = mean): wool ranked within tension.
    const blocks: RankingBlock[] = (['L', 'M', 'H'] as const).map((tension) => {
      const mean = (wool: 'A' | 'B') => {
        const values = warpbreaks.filter((w) => w.wool === wool && w.tension === tension).map((w) => w.breaks);
        return values.reduce((s, v) => s + v, 0) / values.length;
      };
      return { block: tension, values: { A: mean('A'), B: mean('B') } };
    });
    const result = friedmanTest(blocks);
    // Source: R stats::friedman.test help page example: Friedman chi-squared = 0.33333, df = 1, p-value = 0.5637
    expect(result.statistic).toBeCloseTo(0.33333, 5);
    expect(result.p).toBeCloseTo(0.5637, 4);
  });

  it('ISO 8587 LSD on rank sums, computed by hand', () => {
    const result = friedmanTest(roundingBlocks, { comparison: 'iso-8587-lsd', alpha: 0.05 });
    // Source: ISO 8587, Friedman test: LSD = z(α/2)·√(b·k·(k+1)/6) (memory).
    // By hand: b = 22, k = 3 → √(22·3·4/6) = √44 = 6.6332; × 1.959964 = 13.001
    expect(result.criticalDifference).toBeCloseTo(1.959964 * Math.sqrt(44), 5);
    // Mid-ranks by hand (fastest = 1): rank sums Round Out 53, Narrow Angle 47, Wide Angle 32 (total 22·6 = 132)
    expect(result.rankSums).toEqual({ 'Round Out': 53, 'Narrow Angle': 47, 'Wide Angle': 32 });
    const wideVsRound = result.comparisons.find((c) => c.first === 'Round Out' && c.second === 'Wide Angle');
    expect(wideVsRound?.significant).toBe(true); // 21 ≥ 13.0
    const narrowVsRound = result.comparisons.find((c) => c.first === 'Round Out' && c.second === 'Narrow Angle');
    expect(narrowVsRound?.significant).toBe(false); // 6 < 13.0
    expect(result.letters['Wide Angle']).toBe('a');
  });

  it('Nemenyi critical difference uses q(0.05; k, ∞)', () => {
    const result = friedmanTest(roundingBlocks, { comparison: 'nemenyi' });
    // Source: studentized range table, q(0.05; 3, ∞) = 3.314 (memory); critical |Rᵢ − Rⱼ| = q·√(b·k·(k+1)/12) = 3.314·√22
    expect(result.criticalDifference).toBeCloseTo(3.314 * Math.sqrt(22), 2);
  });

  it('mid-ranks for ties', () => {
    // Source: definition of mid-ranks (average of the tied positions)
    expect(midRanks([5.4, 5.4, 5.35])).toEqual({ ranks: [2.5, 2.5, 1], tieSizes: [1, 2] });
  });

  it('a tie in every block: a clear message, never NaN', () => {
    const blocks: RankingBlock[] = ['a1', 'a2', 'a3'].map((block) => ({ block, values: { x: 2, y: 2, z: 2 } }));
    const result = friedmanTest(blocks);
    expect(result.statistic).toBeNull();
    expect(result.message).toMatch(/tied all samples/);
    expect(collectNonFiniteNumbers(result)).toEqual([]);
  });

  it('single assessor and incomplete rankings', () => {
    const single = friedmanTest([{ block: 'a1', values: { x: 1, y: 2, z: 3 } }]);
    expect(single.message).toMatch(/at least two/);
    const withGap = friedmanTest([
      { block: 'a1', values: { x: 1, y: 2, z: 3 } },
      { block: 'a2', values: { x: 1, y: 3 } },
      { block: 'a3', values: { x: 1, y: 2, z: 3 } },
    ]);
    expect(withGap.blockCount).toBe(2);
    expect(withGap.warnings.join(' ')).toMatch(/a2 did not rank every sample/);
    expect(collectNonFiniteNumbers([single, withGap])).toEqual([]);
  });
});
