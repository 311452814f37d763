import { describe, expect, it } from 'vitest';
import { blockedAnova, compactLetterDisplay, compareMeans, compareTreatmentMeans, oneWayAnova } from '@/lib/stats';
import { collectNonFiniteNumbers, etchRate, vascularGraftObservations, warpbreaks } from './fixtures';

describe('Tukey HSD and Fisher LSD after a blocked ANOVA', () => {
  const anova = blockedAnova(vascularGraftObservations());

  it('reproduces the HSD and LSD of Montgomery Example 4.1', () => {
    // Source: Montgomery, Design and Analysis of Experiments, Example 4.1
    expect(compareTreatmentMeans(anova, { method: 'tukey-hsd' }).criticalDifference).toBeCloseTo(4.5038, 4);
    expect(compareTreatmentMeans(anova, { method: 'fisher-lsd' }).criticalDifference).toBeCloseTo(3.3307, 4);
  });

  it('letters agree with the pairs (means sharing a letter are not significantly different)', () => {
    const result = compareTreatmentMeans(anova);
    for (const pair of result.pairs) {
      const shared = [...result.letters[pair.first]].some((letter) => result.letters[pair.second].includes(letter));
      expect(shared).toBe(!pair.significant);
    }
    expect(result.letters[result.orderedLabels[0]]).toContain('a');
  });

  it("without the pairs' p-values, gives the same letters, intervals and decisions (Montgomery Example 4.1)", () => {
    const full = compareTreatmentMeans(anova, { method: 'tukey-hsd' });
    const lean = compareTreatmentMeans(anova, { method: 'tukey-hsd', pairwiseP: false });
    expect(lean.letters).toEqual(full.letters);
    expect(lean.criticalDifference).toBe(full.criticalDifference);
    const withoutP = (pairs: typeof full.pairs) => pairs.map((pair) => ({ ...pair, p: undefined }));
    expect(withoutP(lean.pairs)).toEqual(withoutP(full.pairs));
    expect(lean.pairs.every((pair) => pair.p === null)).toBe(true);
    expect(full.pairs.every((pair) => typeof pair.p === 'number')).toBe(true);
  });
});

describe('Tukey HSD on warpbreaks', () => {
  it('reproduces R TukeyHSD(aov(breaks ~ wool + tension), "tension")', () => {
    const anova = blockedAnova(warpbreaks.map((w) => ({ treatment: w.tension, block: w.wool, value: w.breaks })));
    const result = compareTreatmentMeans(anova);
    const pair = (a: string, b: string) => {
      const found = result.pairs.find((p) => (p.first === a && p.second === b) || (p.first === b && p.second === a));
      if (!found) throw new Error('pair missing');
      const sign = found.first === a ? 1 : -1;
      return {
        diff: sign * found.difference,
        lwr: sign === 1 ? found.lower : -(found.upper ?? NaN),
        upr: sign === 1 ? found.upper : -(found.lower ?? NaN),
        p: found.p,
      };
    };
    // Source: R-help mailing list, "Adjusted P-Values with TukeyHSD" (C. Buser, May 2005), output of
    // TukeyHSD(fm1, "tension", ordered = TRUE): M-H 4.72 [-4.63, 14.08]; L-H 14.72 [5.37, 24.08]; L-M 10.00 [0.65, 19.35]
    expect(pair('M', 'H').diff).toBeCloseTo(4.72, 2);
    expect(pair('M', 'H').lwr).toBeCloseTo(-4.63, 2);
    expect(pair('M', 'H').upr).toBeCloseTo(14.08, 2);
    expect(pair('L', 'H').lwr).toBeCloseTo(5.37, 2);
    expect(pair('L', 'H').upr).toBeCloseTo(24.08, 2);
    expect(pair('L', 'M').lwr).toBeCloseTo(0.65, 2);
    expect(pair('L', 'M').upr).toBeCloseTo(19.35, 2);
    // Source: R stats::TukeyHSD help page example, p adj column: 0.4474210, 0.0011218, 0.0336262 (memory)
    expect(pair('M', 'H').p).toBeCloseTo(0.447421, 5);
    expect(pair('L', 'H').p).toBeCloseTo(0.0011218, 6);
    expect(pair('L', 'M').p).toBeCloseTo(0.0336262, 6);
    expect(result.letters).toEqual({ L: 'a', M: 'b', H: 'b' });
  });
});

describe('one-way: Montgomery Example 3.1', () => {
  const anova = oneWayAnova(etchRate);
  it('Fisher LSD = 24.49 and all four power levels differ', () => {
    const lsd = compareTreatmentMeans(anova, { method: 'fisher-lsd' });
    // Source: Montgomery, Design and Analysis of Experiments, Example 3.1 (LSD 24.49; every pair of means differs)
    expect(lsd.criticalDifference).toBeCloseTo(24.49, 2);
    expect(lsd.pairs.every((p) => p.significant)).toBe(true);
    expect(lsd.letters).toEqual({ '220 W': 'a', '200 W': 'b', '180 W': 'c', '160 W': 'd' });
  });
  it('Tukey: T(0.05) = q(0.05; 4, 16)·√(MSE/n) ≈ 33.09', () => {
    const hsd = compareTreatmentMeans(anova, { method: 'tukey-hsd' });
    // Source: Montgomery, Design and Analysis of Experiments, ch. 3, Tukey's test on the etch-rate data:
    // T = 4.05·√(333.70/5) = 33.09 with q rounded to 4.05 (memory)
    expect(Math.abs((hsd.criticalDifference ?? 0) - 33.09)).toBeLessThan(0.05);
    expect(hsd.pairs.every((p) => p.significant)).toBe(true);
  });
});

describe('compact letter display (insert-and-absorb)', () => {
  it('gives overlapping groups for a chain of differences', () => {
    // Algorithm: Piepho (2004), J. Comput. Graph. Stat. 13:456–466. Worked by hand for A > B > C > D with
    // A–C, A–D, B–D significant: {ABCD} → {ABD},{BCD} → {AB},{BCD} ({BD} absorbed) → {AB},{BC},{CD}
    // → A "a", B "ab", C "bc", D "c".
    const letters = compactLetterDisplay(['A', 'B', 'C', 'D'], [
      ['A', 'C'],
      ['A', 'D'],
      ['B', 'D'],
    ]);
    expect(letters).toEqual({ A: 'a', B: 'ab', C: 'bc', D: 'c' });
  });
  it('no significant pair: one letter for all', () => {
    expect(compactLetterDisplay(['x', 'y'], [])).toEqual({ x: 'a', y: 'a' });
  });
});

describe('degenerate comparisons never give NaN', () => {
  it('zero error variance and zero df', () => {
    const zero = compareMeans({ means: [{ label: 'a', mean: 1, n: 2 }, { label: 'b', mean: 2, n: 2 }], meanSquareError: 0, dfError: 2 });
    expect(zero.message).toMatch(/error variance is zero/);
    expect(zero.pairs).toEqual([]);
    const noDf = compareMeans({ means: [{ label: 'a', mean: 1, n: 1 }, { label: 'b', mean: 2, n: 1 }], meanSquareError: null, dfError: 0 });
    expect(noDf.message).toMatch(/No residual degrees of freedom/);
    expect(collectNonFiniteNumbers([zero, noDf])).toEqual([]);
  });
  it('unequal group sizes use Tukey–Kramer standard errors', () => {
    const result = compareMeans({
      means: [
        { label: 'a', mean: 10, n: 4 },
        { label: 'b', mean: 7, n: 8 },
        { label: 'c', mean: 6, n: 6 },
      ],
      meanSquareError: 2,
      dfError: 15,
    });
    // Tukey–Kramer (Montgomery ch. 3): SE(diff) = √(MSE·(1/nᵢ + 1/nⱼ)) = √(2·(1/4 + 1/8))
    expect(result.pairs[0].standardErrorOfDifference).toBeCloseTo(Math.sqrt(2 * (1 / 4 + 1 / 8)), 12);
    expect(result.criticalDifference).toBeNull();
  });
});
