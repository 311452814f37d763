import { linearRegression } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { describeGroup } from '@/lib/stats';
import { fitLeastSquares } from '@/lib/stats/least-squares';

describe('median and quartiles', () => {
  it('follow the linear interpolation between order statistics', () => {
    // Source: NumPy reference, numpy.percentile, example: a = [[10, 7, 4], [3, 2, 1]],
    // np.percentile(a, 50) → 3.5 (the "linear" method, Hyndman & Fan definition 7).
    const described = describeGroup('example', [10, 7, 4, 3, 2, 1]);
    expect(described.median).toBe(3.5);
    // By hand from Hyndman & Fan (1996) definition 7: h = (n − 1)p; Q1 at h = 1.25 → 2 + 0.25·(3 − 2),
    // Q3 at h = 3.75 → 4 + 0.75·(7 − 4).
    expect(described.quartiles).toEqual({ lower: 2.25, upper: 6.25 });
  });

  it('a single score is its own median; no scores give none', () => {
    expect(describeGroup('one', [7]).median).toBe(7);
    expect(describeGroup('one', [7]).quartiles).toEqual({ lower: 7, upper: 7 });
    expect(describeGroup('none', []).median).toBeNull();
    expect(describeGroup('none', [Number.NaN]).quartiles).toBeNull();
  });
});

describe('least squares against a regression baseline', () => {
  // Source: Anscombe (1973), "Graphs in statistical analysis", The American Statistician 27(1),
  // data set I: fitted line y = 3.00 + 0.500 x.
  const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
  const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];

  it('a straight line matches the published fit and simple-statistics', () => {
    const fit = fitLeastSquares(x.map((v) => [1, v]), y);
    const [intercept, slope] = fit.coefficients;
    expect(intercept).toBeCloseTo(3.0, 2);
    expect(slope).toBeCloseTo(0.5, 3);
    // Reference library: simple-statistics' linearRegression (centred sums) on the same points.
    const baseline = linearRegression(x.map((v, i) => [v, y[i]]));
    expect(intercept).toBeCloseTo(baseline.b, 10);
    expect(slope).toBeCloseTo(baseline.m, 10);
  });
});
