import { describe, expect, it } from 'vitest';
import { buildTerms, centrePointCurvature, designRow, fitRegression, fitResponseSurface, predictRow } from '@/lib/models';
import { curvatureTest } from '@/lib/modelling/fit';
import reference from './lm-reference.json';
import { norris, longley } from './nist-strd';
import { fewestDigits } from './digits';
import { collectNonFiniteNumbers } from '../stats/fixtures';
import { yieldCcd } from './published';

// Reference values: R's lm/summary.lm/predict.lm/hatvalues/rstandard/rstudent, printed by
// scripts/reference/lm-reference.R into lm-reference.json with R 4.2.2 Patched (2022-11-10 r83330).
const R = reference;


// Our term order is 1, x1, x2, x1×x2, x1², x2²; R's is 1, x1, x2, x1², x2², x1:x2.
const FROM_R_ORDER = [0, 1, 2, 5, 3, 4];
const inOurOrder = (values: number[]) => FROM_R_ORDER.map((k) => values[k]);

function fitYield() {
  const terms = buildTerms(['x1', 'x2'], 'full_quadratic');
  return fitRegression({ termNames: terms.map((t) => t.name), rows: yieldCcd.coded.map((c) => designRow(terms, c)), response: yieldCcd.response });
}

function expectDigits(values: ReadonlyArray<number | null>, references: readonly number[], digits: number) {
  expect(fewestDigits(values, references)).toBeGreaterThanOrEqual(digits);
}

describe('least squares against R lm()', () => {
  it('Norris: every summary figure, leverages, residuals and both intervals at x = 500 and 1200', () => {
    const fit = fitRegression({ termNames: ['1', 'x'], rows: norris.x.map((x) => [1, x]), response: norris.y });
    const r = R.norris;
    expectDigits(fit.terms.map((t) => t.estimate), r.coefficients, 12);
    expectDigits(fit.terms.map((t) => t.standardError), r.standardErrors, 12);
    expectDigits(fit.terms.map((t) => t.t), r.tValues, 11);
    expectDigits([fit.residualStandardError, fit.rSquared, fit.adjustedRSquared, fit.anova?.f ?? null, fit.press], [r.sigma, r.rSquared, r.adjustedRSquared, r.fStatistic, r.press], 11);
    expectDigits(fit.leverages, r.leverages, 12);
    expectDigits(fit.standardizedResiduals, r.standardized, 10);
    expectDigits(fit.studentizedResiduals, r.studentized, 10);
    [500, 1200].forEach((x, i) => {
      const at = predictRow(fit.basis, [1, x]);
      expectDigits([at.estimate, at.standardErrorOfMean, at.confidence!.low, at.confidence!.high, at.prediction!.low, at.prediction!.high],
        [r.fitAtNew[i], r.seFitAtNew[i], r.confidenceLow[i], r.confidenceHigh[i], r.predictionLow[i], r.predictionHigh[i]], 11);
    });
  });

  it('Longley: coefficients, standard errors and the prediction interval at a point inside the data', () => {
    const fit = fitRegression({ termNames: ['1', 'x1', 'x2', 'x3', 'x4', 'x5', 'x6'], rows: longley.rows.map((r) => [1, ...r.slice(1)]), response: longley.rows.map((r) => r[0]) });
    const r = R.longley;
    expectDigits(fit.terms.map((t) => t.estimate), r.coefficients, 10);
    expectDigits(fit.terms.map((t) => t.standardError), r.standardErrors, 10);
    expectDigits(fit.leverages, r.leverages, 9);
    const at = predictRow(fit.basis, [1, 100, 400000, 3000, 2500, 118000, 1955]);
    expectDigits([at.estimate, at.prediction!.low, at.prediction!.high], [r.fitAtNew as number, r.predictionLow as number, r.predictionHigh as number], 9);
  });

  it('Montgomery yield CCD: the printed fit, ANOVA, lack of fit, diagnostics and intervals', () => {
    const fit = fitYield();
    const r = R.ccd;
    // Source: Montgomery, ch. 11 (as printed): ŷ = 79.94 + 0.995x1 + 0.515x2 + 0.25x1x2 − 1.376x1² − 1.001x2²
    expect(fit.terms.map((t) => Number(t.estimate!.toFixed(3)))).toEqual([79.94, 0.995, 0.515, 0.25, -1.376, -1.001]);
    expectDigits(fit.terms.map((t) => t.estimate), inOurOrder(r.coefficients), 11);
    expectDigits(fit.terms.map((t) => t.standardError), inOurOrder(r.standardErrors), 11);
    expectDigits(fit.terms.map((t) => t.p), inOurOrder(r.pValues), 8);
    expectDigits([fit.residualStandardError, fit.rSquared, fit.adjustedRSquared, fit.anova?.f ?? null, fit.anova?.p ?? null, fit.press],
      [r.sigma, r.rSquared, r.adjustedRSquared, r.fStatistic, r.fP, r.press], 9);
    expectDigits(fit.leverages, r.leverages, 11);
    expectDigits(fit.standardizedResiduals, r.standardized, 9);
    expectDigits(fit.studentizedResiduals, r.studentized, 9);
    // Source: Montgomery, ch. 11 ANOVA (as printed): model SS 28.25 on 5 df, residual 0.50 on 7,
    // lack of fit 0.28 on 3, pure error 0.21 on 4.
    expect(fit.anova!.regression.sumOfSquares).toBeCloseTo(28.25, 2);
    expect(fit.anova!.regression.df).toBe(5);
    expect(fit.anova!.residual.df).toBe(7);
    expect(fit.lackOfFit!.lackOfFit.df).toBe(3);
    expect(fit.lackOfFit!.pureError.df).toBe(4);
    expect(fit.lackOfFit!.pureError.sumOfSquares).toBeCloseTo(0.212, 10);
    expectDigits([fit.lackOfFit!.f, fit.lackOfFit!.p], [R.ccdLackOfFit.f, R.ccdLackOfFit.p], 9);
    // Predicted R² from PRESS, by definition 1 − PRESS / SS_total, against R's PRESS.
    expect(fit.predictedRSquared).toBeCloseTo(1 - r.press / fit.anova!.total.sumOfSquares, 10);
    const terms = buildTerms(['x1', 'x2'], 'full_quadratic');
    [[0.389, 0.306], [1, -0.5]].forEach((point, i) => {
      const at = predictRow(fit.basis, designRow(terms, point));
      expectDigits([at.estimate, at.standardErrorOfMean, at.confidence!.low, at.confidence!.high, at.prediction!.low, at.prediction!.high],
        [r.fitAtNew[i], r.seFitAtNew[i], r.confidenceLow[i], r.confidenceHigh[i], r.predictionLow[i], r.predictionHigh[i]], 10);
    });
    expect(fit.warnings).toEqual([]);
  });

  it('weighted least squares: panel means weighted n / s², as R lm(weights = n / s²)', () => {
    // Invented panel means (demo scenario); the weighting: a mean of n scores with SD s has variance s²/n.
    const panel = {
      pectin: [0.4, 0.4, 0.8, 0.8, 0.6, 0.6, 0.6, 0.3, 0.9, 0.6, 0.6],
      solids: [55, 65, 55, 65, 60, 60, 60, 60, 60, 52, 68],
      liking: [5.1, 6.0, 5.9, 6.3, 6.8, 6.6, 6.9, 5.2, 6.0, 5.5, 6.1],
      n: [12, 12, 10, 12, 14, 12, 12, 10, 11, 12, 12],
      s: [1.6, 1.4, 1.9, 1.5, 1.2, 1.3, 1.1, 1.8, 1.7, 1.6, 1.5],
    };
    const terms = buildTerms(['pectin', 'solids'], 'full_quadratic');
    const rows = panel.pectin.map((p, i) => designRow(terms, [p, panel.solids[i]]));
    const weights = panel.n.map((n, i) => n / panel.s[i] ** 2);
    const fit = fitRegression({ termNames: terms.map((t) => t.name), rows, response: panel.liking, weights });
    const r = R.panel;
    expect(fit.weighted).toBe(true);
    expectDigits(fit.terms.map((t) => t.estimate), inOurOrder(r.coefficients), 9);
    expectDigits(fit.terms.map((t) => t.standardError), inOurOrder(r.standardErrors), 9);
    expectDigits([fit.residualStandardError, fit.rSquared, fit.adjustedRSquared, fit.anova?.f ?? null, fit.press], [r.sigma, r.rSquared, r.adjustedRSquared, r.fStatistic, r.press], 9);
    expectDigits(fit.leverages, r.leverages, 9);
    expectDigits(fit.standardizedResiduals, r.standardized, 9);
    expectDigits([fit.lackOfFit!.pureError.sumOfSquares, fit.lackOfFit!.f], [R.panelLackOfFit.pureErrorSs, R.panelLackOfFit.f], 9);
    [[0.6, 60], [0.75, 58]].forEach((point, i) => {
      const at = predictRow(fit.basis, designRow(terms, point));
      expectDigits([at.estimate, at.confidence!.low, at.confidence!.high, at.prediction!.low, at.prediction!.high],
        [r.fitAtNew[i], r.confidenceLow[i], r.confidenceHigh[i], r.predictionLow[i], r.predictionHigh[i]], 9);
    });
    // The weights matter: unweighted coefficients differ.
    const plain = fitRegression({ termNames: terms.map((t) => t.name), rows, response: panel.liking });
    expect(Math.abs(plain.terms[1].estimate! - fit.terms[1].estimate!)).toBeGreaterThan(1e-3);
  });
});

describe('weighted least squares by hand: which figures are in the response’s units', () => {
  // Weighted least squares: b = (XᵀWX)⁻¹XᵀWy, residual variance Σwᵢeᵢ²/(n − p) (Draper & Smith,
  // Applied Regression Analysis, 3rd ed., ch. 9 — from memory; NIST/SEMATECH e-Handbook of Statistical
  // Methods §4.1.4.3, weighted least squares). Worked here by hand for a straight line:
  //   x = 0, 1, 2, 3; y = 1, 3, 4, 8; w = 1, 2, 2, 1.
  //   Σw = 6, Σwx = 9, Σwy = 23, Σwx² = 19, Σwxy = 46; x̄w = 3/2, ȳw = 23/6.
  //   slope = (46 − 6·3/2·23/6) / (19 − 6·9/4) = (23/2) / (11/2) = 23/11; intercept = 23/6 − 23/11·3/2 = 23/33.
  //   residuals e = 10/33, 7/33, −29/33, 34/33.
  //   Σwe² = (100 + 98 + 1682 + 1156)/1089 = 92/33 → s = √(92/33 / 2) = 1.18065 (weighted units).
  //   Σe² = (100 + 49 + 841 + 1156)/1089 = 2146/1089 → residual SD on the y scale √(2146/1089 / 2) = 0.99263.
  //   Weighted total SS Σw(y − ȳw)² = 161/6; weighted regression SS = 161/6 − 92/33 = 529/22.
  const input = { termNames: ['1', 'x'], rows: [0, 1, 2, 3].map((x) => [1, x]), response: [1, 3, 4, 8], weights: [1, 2, 2, 1] };

  it('the fit, the weighted sums of squares and both residual SDs', () => {
    const fit = fitRegression(input);
    expect(fit.terms[0].estimate).toBeCloseTo(23 / 33, 12);
    expect(fit.terms[1].estimate).toBeCloseTo(23 / 11, 12);
    fit.residuals.forEach((e, i) => expect(e).toBeCloseTo([10, 7, -29, 34][i] / 33, 12));
    expect(fit.anova!.residual.sumOfSquares).toBeCloseTo(92 / 33, 12);
    expect(fit.anova!.total.sumOfSquares).toBeCloseTo(161 / 6, 12);
    expect(fit.anova!.regression.sumOfSquares).toBeCloseTo(529 / 22, 12);
    expect(fit.residualStandardError).toBeCloseTo(Math.sqrt(92 / 33 / 2), 12);
    expect(fit.residualSdOnScale).toBeCloseTo(Math.sqrt(2146 / 1089 / 2), 12);
    expect(fit.residualSdOnScale).toBeCloseTo(0.99263, 5);
  });

  it('unweighted, the two residual SDs are one', () => {
    const fit = fitRegression({ ...input, weights: undefined });
    expect(fit.residualSdOnScale).toBe(fit.residualStandardError);
  });

  it('the prediction interval of a new run of weight w₀ is t·s·√(1/w₀ + h₀), on the y scale', () => {
    // At x = 1.5 (= x̄w) the leverage is 1/Σw = 1/6; t(0.975, 2) = 4.302653.
    const fit = fitRegression(input);
    const at = predictRow(fit.basis, [1, 1.5], { newRunWeight: 2 });
    expect(at.estimate).toBeCloseTo(23 / 6, 12);
    expect(at.leverage).toBeCloseTo(1 / 6, 12);
    expect(at.prediction!.high - at.estimate).toBeCloseTo(4.302653 * Math.sqrt(92 / 33 / 2) * Math.sqrt(1 / 2 + 1 / 6), 5);
  });
});

describe('warnings instead of numbers', () => {
  it('names the aliased terms: a column that is the sum of two others', () => {
    const rows = [[1, 1, 0, 1], [1, 0, 1, 1], [1, 1, 1, 2], [1, 0, 0, 0], [1, 2, 1, 3]];
    const fit = fitRegression({ termNames: ['1', 'sugar', 'fruit', 'total'], rows, response: [3, 4, 6, 1, 8] });
    expect(fit.terms[3].estimate).toBeNull();
    expect(fit.terms[3].aliasedWith).toEqual(['sugar', 'fruit']);
    expect(fit.warnings.map((w) => w.kind)).toContain('aliased');
    expect(fit.warnings.find((w) => w.kind === 'aliased')!.message).toContain('total (with sugar, fruit)');
    expect(fit.basis.hasAliasedTerms).toBe(true);
    expect(collectNonFiniteNumbers(fit)).toEqual([]);
  });

  it('too few runs: n ≤ p gives no standard errors and says so', () => {
    const terms = buildTerms(['a', 'b'], 'full_quadratic');
    const points = [[-1, -1], [1, -1], [-1, 1], [1, 1], [0, 0]];
    const fit = fitRegression({ termNames: terms.map((t) => t.name), rows: points.map((p) => designRow(terms, p)), response: [1, 2, 3, 5, 4] });
    expect(fit.warnings.map((w) => w.kind)).toContain('too_few_runs');
    expect(fit.terms.every((t) => t.standardError === null)).toBe(true);
    expect(fit.residualStandardError).toBeNull();
    expect(collectNonFiniteNumbers(fit)).toEqual([]);
  });

  it('high leverage: a run far from the rest exceeds 2p/n', () => {
    const x = [1, 2, 3, 4, 5, 6, 7, 8, 9, 30];
    const fit = fitRegression({ termNames: ['1', 'x'], rows: x.map((v) => [1, v]), response: x.map((v, i) => 2 * v + (i % 2 ? 0.3 : -0.3)) });
    // By hand: h = 1/n + (x − x̄)²/Sxx with x̄ = 7.5, Sxx = 116.25 + 506.25 = 622.5: h₁₀ = 0.1 + 506.25/622.5.
    expect(fit.leverages[9]).toBeCloseTo(0.1 + 506.25 / 622.5, 12);
    expect(fit.leverageLimit).toBeCloseTo(0.4, 12);
    expect(fit.highLeverageRuns).toEqual([9]);
    expect(fit.warnings.map((w) => w.kind)).toContain('high_leverage');
    // Leverages sum to p (the trace of the hat matrix).
    expect(fit.leverages.reduce((s, h) => s + h, 0)).toBeCloseTo(2, 12);
  });

  it('refuses malformed input: negative weights, wrong lengths, non-numbers', () => {
    expect(() => fitRegression({ termNames: ['1'], rows: [[1], [1]], response: [1, 2], weights: [1, -1] })).toThrow(/positive/);
    expect(() => fitRegression({ termNames: ['1'], rows: [[1]], response: [1, 2] })).toThrow(/number of runs/);
    expect(() => fitRegression({ termNames: ['1'], rows: [[1], [Number.NaN]], response: [1, 2] })).toThrow(/not a number/);
    expect(() => fitRegression({ termNames: ['1'], rows: [], response: [] })).toThrow(/no runs/);
    expect(() => buildTerms(Array.from({ length: 13 }, (_, i) => `f${i}`), 'full_quadratic')).toThrow(/at most 12 factors/);
  });
});

describe('curvature from centre points', () => {
  it('Montgomery first-order yield example: SS curvature 0.0027, pure error MS 0.0430', () => {
    // Source: Montgomery, Design and Analysis of Experiments, ch. 11, first-order design before the
    // path of steepest ascent: 2² in time and temperature with five centre runs (memory); by hand
    // ȳF = 40.425, ȳC = 40.46, SS = 4·5·0.035²/9 = 0.0027222…, pure error 0.172/4 = 0.043.
    const runs = [
      { coded: [-1, -1], response: 39.3 }, { coded: [-1, 1], response: 40.0 }, { coded: [1, -1], response: 40.9 }, { coded: [1, 1], response: 41.5 },
      ...[40.3, 40.5, 40.7, 40.2, 40.6].map((response) => ({ coded: [0, 0], response })),
    ];
    const test = centrePointCurvature(runs)!;
    expect(test.factorialMean).toBeCloseTo(40.425, 12);
    expect(test.centreMean).toBeCloseTo(40.46, 12);
    expect(test.sumOfSquares).toBeCloseTo((20 * 0.035 ** 2) / 9, 12);
    expect(test.pureErrorMeanSquare).toBeCloseTo(0.043, 12);
    expect(test.pureErrorDf).toBe(4);
    expect(test.f).toBeCloseTo((20 * 0.035 ** 2) / 9 / 0.043, 10);
    expect(test.p!).toBeGreaterThan(0.8);
  });

  it('strong curvature in the CCD yield data: the centre mean sits well above the corners', () => {
    const runs = yieldCcd.coded.slice(0, 9).map((coded, i) => ({ coded, response: yieldCcd.response[i] }));
    const test = centrePointCurvature(runs)!;
    // By hand: ȳF = 77.75, ȳC = 79.94, SS = 4·5·2.19²/9 = 10.658; pure error 0.212/4 = 0.053.
    expect(test.sumOfSquares).toBeCloseTo((20 * 2.19 ** 2) / 9, 10);
    expect(test.p!).toBeLessThan(0.001);
  });

  it('weighted runs: the curvature and its pure error are weighted like the other ANOVA rows', () => {
    // Source: weighted least squares minimises Σ wᵢ(yᵢ − ŷᵢ)² (NIST/SEMATECH e-Handbook of Statistical
    // Methods, §4.1.4.3), so the curvature is the weighted between-groups SS of corners and centre.
    // Worked by hand: corners y 10, 12, 11, 13 with w 1, 2, 1, 2 → WF = 6, ȳF = 71/6; centre y 8, 9, 7
    // with w 2, 1, 1 → WC = 4, ȳC = 32/4 = 8. SS = 6·4/10 · (71/6 − 8)² = 2.4 · 529/36 = 35.2667.
    // Check: weighted total SS about 10.3 = 44.1, minus within groups 6.8333 + 2 = 35.2667.
    // Pure error: Σ w(y − 8)² = 0 + 1 + 1 = 2 on 2 df, MS 1; F = 35.2667 on 1 and 2 df.
    // (Unweighted the same runs give SS 4·3/7 · 3.5² = 21 and F 21.)
    const runs = [
      { coded: [-1, -1], response: 10, weight: 1 }, { coded: [-1, 1], response: 12, weight: 2 },
      { coded: [1, -1], response: 11, weight: 1 }, { coded: [1, 1], response: 13, weight: 2 },
      { coded: [0, 0], response: 8, weight: 2 }, { coded: [0, 0], response: 9, weight: 1 }, { coded: [0, 0], response: 7, weight: 1 },
    ];
    const test = centrePointCurvature(runs)!;
    expect(test.factorialMean).toBeCloseTo(71 / 6, 12);
    expect(test.centreMean).toBeCloseTo(8, 12);
    expect(test.sumOfSquares).toBeCloseTo((2.4 * 529) / 36, 10);
    expect(test.pureErrorMeanSquare).toBeCloseTo(1, 12);
    expect(test.pureErrorDf).toBe(2);
    expect(test.f).toBeCloseTo((2.4 * 529) / 36, 10);
    // On 1 and 2 df the F upper tail has a closed form (F = t² with t on 2 df): p = 1 − √(F/(F + 2)).
    expect(test.p).toBeCloseTo(1 - Math.sqrt(test.f! / (test.f! + 2)), 8);
  });

  it('the model report\'s curvature uses the fitted surface\'s weights', () => {
    // The same runs as above as a weighted main-effects surface; the report's test must match by-hand 35.2667.
    const points = [[-1, -1], [-1, 1], [1, -1], [1, 1], [0, 0], [0, 0], [0, 0]];
    const y = [10, 12, 11, 13, 8, 9, 7];
    const w = [1, 2, 1, 2, 2, 1, 1];
    const surface = fitResponseSurface({
      factors: ['a', 'b'],
      kind: 'main_effects',
      runs: points.map(([a, b], i) => ({ point: { a, b }, response: y[i], weight: w[i] })),
    });
    const test = curvatureTest(surface)!;
    expect(test.sumOfSquares).toBeCloseTo((2.4 * 529) / 36, 8);
    expect(test.pureErrorMeanSquare).toBeCloseTo(1, 10);
  });

  it('is not applicable to runs off the corners, or without centre runs', () => {
    expect(centrePointCurvature(yieldCcd.coded.map((coded, i) => ({ coded, response: yieldCcd.response[i] })))).toBeNull();
    expect(centrePointCurvature([{ coded: [1], response: 2 }, { coded: [-1], response: 1 }])).toBeNull();
  });
});
