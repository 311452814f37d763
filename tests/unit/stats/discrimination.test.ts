import { describe, expect, it } from 'vitest';
import {
  analyseDiscriminationTest,
  binomialUpperTail,
  estimateDiscriminators,
  maximumCorrectForSimilarity,
  minimumCorrectForDifference,
} from '@/lib/stats';
import { collectNonFiniteNumbers } from './fixtures';

describe('triangle test for difference (p0 = 1/3)', () => {
  it('reproduces the ISO 4120 table of minimum correct answers', () => {
    // Source: ISO 4120; FAO docrep V7180E, Appendix A
    expect(minimumCorrectForDifference(12, 1 / 3, 0.05)).toBe(8);
    expect(minimumCorrectForDifference(12, 1 / 3, 0.01)).toBe(9);
    expect(minimumCorrectForDifference(24, 1 / 3, 0.05)).toBe(13);
    expect(minimumCorrectForDifference(24, 1 / 3, 0.01)).toBe(15);
    expect(minimumCorrectForDifference(36, 1 / 3, 0.05)).toBe(18);
    expect(minimumCorrectForDifference(36, 1 / 3, 0.01)).toBe(20);
  });

  it('reproduces further rows of FAO docrep V7180E Appendix A (α 10 %, 5 %, 1 %, 0.1 %)', () => {
    // Source: FAO docrep V7180E, Appendix A, "Triangle Test for Difference: Critical Number (Minimum) of Correct Answers"
    const rows: [number, number[]][] = [
      [30, [14, 15, 17, 19]],
      [60, [26, 27, 30, 33]],
      [72, [30, 32, 34, 38]],
      [96, [39, 41, 44, 48]],
    ];
    for (const [n, expected] of rows) {
      const computed = [0.1, 0.05, 0.01, 0.001].map((alpha) => minimumCorrectForDifference(n, 1 / 3, alpha));
      expect(computed).toEqual(expected);
    }
    // Source: same table, n = 3 at α 1 %: "—" (no result can be significant)
    expect(minimumCorrectForDifference(3, 1 / 3, 0.01)).toBeNull();
  });

  it('exact p-value P(X ≥ 13 | n = 24, p = 1/3) = 0.0284411281', () => {
    // Source: ISO 4120 (triangle test)
    const result = analyseDiscriminationTest({ method: 'triangle', correct: 13, total: 24 });
    expect(result.pValue).toBeCloseTo(0.0284411281, 10);
    expect(result.differenceShown).toBe(true);
    expect(result.minimumCorrectForDifference).toBe(13);
  });
});

describe('duo-trio and paired 2-AFC (p0 = 1/2)', () => {
  it('reproduces ISO 5495 Table A.1 (paired comparison, one-sided)', () => {
    // Source: GOST R 53161-2008 (ISO 5495:2005), Table A.1, α 0.20 / 0.10 / 0.05 / 0.01 / 0.001
    const rows: [number, number[]][] = [
      [10, [7, 8, 9, 10, 10]],
      [20, [13, 14, 15, 16, 18]],
      [40, [24, 25, 26, 28, 31]],
      [60, [34, 36, 37, 40, 43]],
    ];
    for (const [n, expected] of rows) {
      const computed = [0.2, 0.1, 0.05, 0.01, 0.001].map((alpha) => minimumCorrectForDifference(n, 0.5, alpha));
      expect(computed).toEqual(expected);
    }
  });

  it('reproduces ISO 10399 Table A.1 (duo-trio)', () => {
    // Source: GOST ISO 10399-2015 (ISO 10399), Table A.1, α 0.20 / 0.10 / 0.05 / 0.01 / 0.001
    const rows: [number, number[]][] = [
      [26, [16, 17, 18, 20, 22]],
      [36, [22, 23, 24, 26, 28]],
    ];
    for (const [n, expected] of rows) {
      const computed = [0.2, 0.1, 0.05, 0.01, 0.001].map((alpha) => minimumCorrectForDifference(n, 0.5, alpha));
      expect(computed).toEqual(expected);
    }
    const result = analyseDiscriminationTest({ method: 'duo-trio', correct: 18, total: 26, alpha: 0.05 });
    expect(result.guessProbability).toBe(0.5);
    expect(result.differenceShown).toBe(true);
  });
});

describe('similarity', () => {
  it('reproduces ISO 5495 Table A.3 (paired, similarity) for n = 132', () => {
    // Source: GOST R 53161-2008 (ISO 5495:2005), Table A.3, row n = 132 (read from a text extraction of the table):
    // β 0.05 → pd 20 %: 69, 30 %: 76, 40 %: 83, 50 %: 90; β 0.10 → 71, 78, 85, 92; β 0.20 → pd 10 %…50 %: 67, 73, 80, 87, 94
    expect([0.2, 0.3, 0.4, 0.5].map((pd) => maximumCorrectForSimilarity(132, 0.5, pd, 0.05))).toEqual([69, 76, 83, 90]);
    expect([0.2, 0.3, 0.4, 0.5].map((pd) => maximumCorrectForSimilarity(132, 0.5, pd, 0.1))).toEqual([71, 78, 85, 92]);
    expect([0.1, 0.2, 0.3, 0.4, 0.5].map((pd) => maximumCorrectForSimilarity(132, 0.5, pd, 0.2))).toEqual([
      67, 73, 80, 87, 94,
    ]);
  });

  it('triangle similarity: the limit is the largest x with P(X ≤ x | pc) ≤ β', () => {
    // Definition in ISO 4120 (similarity): pc = 1/3 + pd·2/3. Checked against the exact binomial tail, not a table.
    const n = 60;
    const pd = 0.3;
    const beta = 0.05;
    const limit = maximumCorrectForSimilarity(n, 1 / 3, pd, beta);
    expect(limit).not.toBeNull();
    const pc = 1 / 3 + (pd * 2) / 3;
    const lowerTail = (x: number) => 1 - binomialUpperTail(x + 1, n, pc);
    expect(lowerTail(limit ?? 0)).toBeLessThanOrEqual(beta);
    expect(lowerTail((limit ?? 0) + 1)).toBeGreaterThan(beta);
    const result = analyseDiscriminationTest({
      method: 'triangle',
      correct: limit ?? 0,
      total: n,
      similarity: { maxDiscriminatorProportion: pd, beta },
    });
    expect(result.similarity?.similarityShown).toBe(true);
  });

  it('upper confidence limit of pd follows the ISO 5495 Table A.3 note formula', () => {
    // Source: GOST R 53161-2008 (ISO 5495:2005), Table A.3, note 1:
    // upper limit = [2(x/n) − 1] + 2·z_β·√((n·x − x²)/n³), z_β = 1.64 for β = 0.05
    const n = 132;
    const x = 76;
    const printed = 2 * (x / n) - 1 + 2 * 1.64 * Math.sqrt((n * x - x * x) / n ** 3);
    const estimate = estimateDiscriminators(x, n, 0.5, 0.05);
    expect(estimate.upperConfidenceLimit).toBeCloseTo(printed, 3); // exact z = 1.6449 vs printed 1.64
    expect(estimate.rawEstimate).toBeCloseTo(2 * (x / n) - 1, 12);
  });

  it('triangle pd = 1.5·(x/n) − 0.5', () => {
    // Source: Lawless & Heymann, Sensory Evaluation of Food (Abbott's formula for the triangle test) (memory)
    const estimate = estimateDiscriminators(13, 24, 1 / 3, 0.05);
    expect(estimate.estimate).toBeCloseTo(1.5 * (13 / 24) - 0.5, 12);
    expect(estimate.standardError).toBeCloseTo(1.5 * Math.sqrt(((13 / 24) * (11 / 24)) / 24), 12);
  });
});

describe('degenerate discrimination inputs', () => {
  it('rejects impossible counts with a message, no NaN', () => {
    const result = analyseDiscriminationTest({ method: 'triangle', correct: 5, total: 3 });
    expect(result.message).toMatch(/0 ≤ correct ≤ total/);
    expect(result.pValue).toBeNull();
    expect(collectNonFiniteNumbers(result)).toEqual([]);
  });
  it('fewer correct than chance: pd floored at 0', () => {
    const result = analyseDiscriminationTest({ method: 'triangle', correct: 2, total: 12 });
    expect(result.discriminators?.estimate).toBe(0);
    expect(result.pValue).toBeGreaterThan(0.9);
    expect(collectNonFiniteNumbers(result)).toEqual([]);
  });
});
