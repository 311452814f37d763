import { describe, expect, it } from 'vitest';
import { pearsonCorrelation } from '@/lib/stats';
import { collectNonFiniteNumbers } from './fixtures';

describe('Pearson correlation', () => {
  it('reproduces a published R cor.test output', () => {
    // Source: "Parametric method for the study of the correlation: the Pearson r-test", Statistic on aiR via
    // R-bloggers (2009): cor.test(a, b) → t = 0.4772, df = 8, p-value = 0.646, cor 0.166349
    const a = [15, 21, 25, 26, 30, 30, 22, 29, 19, 16];
    const b = [55, 56, 89, 67, 84, 89, 99, 62, 83, 88];
    const result = pearsonCorrelation(a.map((x, i) => ({ x, y: b[i] })));
    expect(result.r).toBeCloseTo(0.166349, 6);
    expect(result.t).toBeCloseTo(0.4772, 4);
    expect(result.df).toBe(8);
    expect(result.p).toBeCloseTo(0.646, 3);
  });

  it('is unchanged by a large offset of the measurement (e.g. 1e12 + x)', () => {
    // Same source; correlation is invariant to shifting x.
    const a = [15, 21, 25, 26, 30, 30, 22, 29, 19, 16];
    const b = [55, 56, 89, 67, 84, 89, 99, 62, 83, 88];
    const result = pearsonCorrelation(a.map((x, i) => ({ x: x + 1e12, y: b[i] })));
    expect(result.r).toBeCloseTo(0.166349, 6);
  });

  it('zero variance, too few variants and missing values: message, no NaN', () => {
    const flat = pearsonCorrelation([
      { x: 3.2, y: 6 },
      { x: 3.2, y: 7 },
      { x: 3.2, y: 5 },
    ]);
    expect(flat.r).toBeNull();
    expect(flat.message).toMatch(/does not vary/);
    const few = pearsonCorrelation([
      { x: 1, y: 2 },
      { x: 2, y: null },
      { x: 3, y: 5 },
    ]);
    expect(few.n).toBe(2);
    expect(few.message).toMatch(/At least three/);
    expect(few.warnings.join(' ')).toMatch(/1 variant/);
    const line = pearsonCorrelation([
      { x: 1, y: 2 },
      { x: 2, y: 4 },
      { x: 3, y: 6 },
    ]);
    expect(line.r).toBeCloseTo(1, 12);
    expect(collectNonFiniteNumbers([flat, few, line])).toEqual([]);
  });
});
