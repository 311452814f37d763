/**
 * Least squares for response-surface models: the fit, its diagnostics and predictions with intervals.
 *
 * The solver is lib/stats' Householder QR (never the normal equations, which square the condition
 * number), with rank detection: a column that is a linear combination of others is aliased, left
 * out, and reported by name with the columns it depends on.
 *
 * Weights (weighted least squares): row i counts wᵢ times. For a variant mean from a tasting panel
 * use wᵢ = nᵢ / sᵢ² (panel size over the variance of the scores), i.e. 1 / SEᵢ² — a mean known
 * more precisely pulls the surface harder. Without weights every row counts once. The residual
 * variance is then the variance of a row of weight 1, as in R's lm(weights = ).
 *
 * Conventions follow R's lm/summary.lm/predict.lm/rstandard/rstudent, checked against its output
 * (tests/unit/models/regression.test.ts). Undefined values are null, never NaN.
 */
import {
  fitLeastSquares,
  fUpperTail,
  leverageOfRow,
  studentTQuantile,
  studentTTwoSided,
  compensatedSum,
} from '@/lib/stats';
import { ModelSpecError } from './terms';

export interface RegressionInput {
  /** Column names; a column of ones (the intercept) is recognised wherever it is. */
  termNames: readonly string[];
  /** Design matrix, one row per run. */
  rows: ReadonlyArray<readonly number[]>;
  response: readonly number[];
  /** Optional positive weights (see the module note). */
  weights?: readonly number[];
}

export interface TermEstimate {
  name: string;
  estimate: number | null;
  standardError: number | null;
  t: number | null;
  /** Two-sided p from t with the residual df. */
  p: number | null;
  /** For an aliased term: the estimable terms it is a linear combination of. Empty otherwise. */
  aliasedWith: string[];
}

export interface AnovaLine {
  sumOfSquares: number;
  df: number;
  meanSquare: number | null;
}

export interface ModelAnova {
  /** Regression vs the intercept-only model (vs zero when the model has no intercept). */
  regression: AnovaLine;
  residual: AnovaLine;
  total: AnovaLine;
  f: number | null;
  p: number | null;
}

export interface LackOfFitTest {
  lackOfFit: AnovaLine;
  pureError: AnovaLine;
  f: number | null;
  p: number | null;
}

export type ModelWarningKind = 'aliased' | 'too_few_runs' | 'high_leverage' | 'saturated';

export interface ModelWarning {
  kind: ModelWarningKind;
  message: string;
}

/** What predictions need from a fit; plain data. */
export interface PredictionBasis {
  coefficients: number[];
  estimableColumns: number[];
  inverseR: number[][];
  residualVariance: number | null;
  residualDf: number;
  maxLeverage: number;
  hasAliasedTerms: boolean;
  /** t(0.975, residual df), kept because predictions while typing ask for it on every keystroke. */
  t95: number | null;
}

export interface RegressionFit {
  terms: TermEstimate[];
  observationCount: number;
  /** Number of estimable coefficients (the rank). */
  parameterCount: number;
  residualDf: number;
  /**
   * √(Σ wᵢeᵢ² / df), R's sigma. With weights n/s² it is in units of the panels' own standard error
   * (about 1 when the means scatter as the panels predict), not in the response's units.
   */
  residualStandardError: number | null;
  /**
   * √(Σ eᵢ² / df): the residual SD of the runs in the response's own units. The same as
   * residualStandardError without weights.
   */
  residualSdOnScale: number | null;
  rSquared: number | null;
  adjustedRSquared: number | null;
  /** 1 − PRESS / total SS. */
  predictedRSquared: number | null;
  /** Σ (eᵢ / (1 − hᵢ))², weighted by wᵢ when weights are given; null when a run has leverage 1. */
  press: number | null;
  leverages: number[];
  fitted: number[];
  /** yᵢ − ŷᵢ (unweighted, like R's residuals()). */
  residuals: number[];
  /** Internally studentized eᵢ√wᵢ / (s√(1 − hᵢ)), R's rstandard(). */
  standardizedResiduals: (number | null)[];
  /** Externally studentized (deletion) residuals, R's rstudent(). */
  studentizedResiduals: (number | null)[];
  anova: ModelAnova | null;
  lackOfFit: LackOfFitTest | null;
  /** Leverage above which a run is flagged: 2p/n. */
  leverageLimit: number;
  highLeverageRuns: number[];
  weighted: boolean;
  /** The weights of the runs, null without weights (tests that regroup the runs weight them alike). */
  weights: number[] | null;
  warnings: ModelWarning[];
  basis: PredictionBasis;
}

/** Relative size below which a weight in an alias combination counts as zero. */
const ALIAS_TOLERANCE = 1e-8;
/** 1 − h below this: the run is fitted exactly by itself; its residual cannot be studentized. */
const LEVERAGE_ONE = 1e-10;

function validate(input: RegressionInput): void {
  const n = input.response.length;
  const p = input.termNames.length;
  if (p === 0) throw new ModelSpecError('The model has no terms.');
  if (n === 0) throw new ModelSpecError('There are no runs to fit.');
  if (input.rows.length !== n) throw new ModelSpecError('The design has a different number of runs than the response.');
  for (const row of input.rows) {
    if (row.length !== p) throw new ModelSpecError('Every design row needs one value per term.');
    if (row.some((v) => !Number.isFinite(v))) throw new ModelSpecError('The design holds a value that is not a number.');
  }
  if (input.response.some((v) => !Number.isFinite(v))) throw new ModelSpecError('Every response must be a number.');
  if (input.weights) {
    if (input.weights.length !== n) throw new ModelSpecError('One weight per run is needed.');
    if (input.weights.some((w) => !Number.isFinite(w) || w <= 0)) throw new ModelSpecError('Weights must be positive numbers.');
  }
}

function line(sumOfSquares: number, df: number): AnovaLine {
  return { sumOfSquares, df, meanSquare: df > 0 ? sumOfSquares / df : null };
}

/** Weighted sum of squares about the weighted mean. */
export function weightedCentredSquares(values: readonly number[], weights: readonly number[]): number {
  const totalWeight = compensatedSum(weights);
  const mean = compensatedSum(values.map((v, i) => v * weights[i])) / totalWeight;
  const deviations = values.map((v) => v - mean);
  const sumSquares = compensatedSum(deviations.map((d, i) => weights[i] * d * d));
  const sumDeviations = compensatedSum(deviations.map((d, i) => weights[i] * d));
  return Math.max(0, sumSquares - (sumDeviations * sumDeviations) / totalWeight);
}

/**
 * Runs at the same settings (identical design rows) are replicates: their spread is pure error.
 * Lack of fit is the rest of the residual SS (Montgomery, Design and Analysis of Experiments, §11.2).
 */
function lackOfFitTest(
  rows: ReadonlyArray<readonly number[]>,
  response: readonly number[],
  weights: readonly number[],
  residualSumOfSquares: number,
  residualDf: number,
): LackOfFitTest | null {
  const groups = new Map<string, number[]>();
  rows.forEach((row, i) => {
    const key = row.map((v) => v.toPrecision(12)).join('|');
    const members = groups.get(key);
    if (members) members.push(i);
    else groups.set(key, [i]);
  });
  let pureErrorSs = 0;
  let pureErrorDf = 0;
  for (const members of groups.values()) {
    if (members.length < 2) continue;
    pureErrorSs += weightedCentredSquares(members.map((i) => response[i]), members.map((i) => weights[i]));
    pureErrorDf += members.length - 1;
  }
  const lackDf = residualDf - pureErrorDf;
  if (pureErrorDf === 0 || lackDf <= 0) return null;
  const lack = line(Math.max(0, residualSumOfSquares - pureErrorSs), lackDf);
  const pure = line(pureErrorSs, pureErrorDf);
  const f = pure.meanSquare && pure.meanSquare > 0 && lack.meanSquare !== null ? lack.meanSquare / pure.meanSquare : null;
  return { lackOfFit: lack, pureError: pure, f, p: f === null ? null : fUpperTail(f, lackDf, pureErrorDf) };
}

/** Names of the estimable columns that an aliased column is a combination of. */
function aliasPartners(
  weightedRows: number[][],
  column: number,
  estimable: readonly number[],
  termNames: readonly string[],
): string[] {
  const target = weightedRows.map((row) => row[column]);
  const targetNorm = Math.sqrt(compensatedSum(target.map((v) => v * v)));
  if (targetNorm === 0) return [];
  const basis = weightedRows.map((row) => estimable.map((j) => row[j]));
  const weightsOfCombination = fitLeastSquares(basis, target).coefficients;
  return estimable.filter((j, k) => {
    const norm = Math.sqrt(compensatedSum(weightedRows.map((row) => row[j] * row[j])));
    return Math.abs((weightsOfCombination[k] ?? 0) * norm) > ALIAS_TOLERANCE * targetNorm;
  }).map((j) => termNames[j]);
}

export function fitRegression(input: RegressionInput): RegressionFit {
  validate(input);
  const { termNames, rows, response } = input;
  const n = response.length;
  const weights = input.weights ? [...input.weights] : new Array<number>(n).fill(1);
  const roots = weights.map(Math.sqrt);
  const weightedRows = rows.map((row, i) => row.map((v) => v * roots[i]));
  const weightedResponse = response.map((y, i) => y * roots[i]);
  const interceptColumn = termNames.findIndex((_, j) => rows.every((row) => row[j] === 1));
  const hasIntercept = interceptColumn >= 0;

  const qr = fitLeastSquares(weightedRows, weightedResponse);
  const rank = qr.rank;
  const residualDf = n - rank;
  const residualSumOfSquares = qr.residualSumOfSquares;
  const residualVariance = residualDf > 0 ? residualSumOfSquares / residualDf : null;
  const s = residualVariance === null ? null : Math.sqrt(residualVariance);
  const coefficients = qr.coefficients.map((c) => c ?? 0);
  const fitted = rows.map((row) => compensatedSum(row.map((v, j) => v * coefficients[j])));
  const residuals = response.map((y, i) => y - fitted[i]);
  const leverages = qr.leverages;

  const warnings: ModelWarning[] = [];
  const terms: TermEstimate[] = termNames.map((name, j) => {
    const estimate = qr.coefficients[j];
    if (estimate === null) {
      return { name, estimate: null, standardError: null, t: null, p: null, aliasedWith: aliasPartners(weightedRows, j, qr.estimableColumns, termNames) };
    }
    const standardError = residualVariance === null ? null : Math.sqrt(residualVariance * qr.unscaledCovariance[j][j]);
    const t = standardError && standardError > 0 ? estimate / standardError : null;
    return { name, estimate, standardError, t, p: t === null ? null : studentTTwoSided(t, residualDf), aliasedWith: [] };
  });
  const aliased = terms.filter((t) => t.estimate === null);
  if (aliased.length > 0) {
    const described = aliased.map((t) => (t.aliasedWith.length ? `${t.name} (with ${t.aliasedWith.join(', ')})` : `${t.name} (never varies)`));
    warnings.push({ kind: 'aliased', message: `These terms cannot be told apart from others with these runs and were left out: ${described.join('; ')}.` });
  }
  if (n <= termNames.length) {
    warnings.push({ kind: 'too_few_runs', message: `${n} runs for ${termNames.length} terms: a model needs more runs than terms to estimate its error.` });
  } else if (residualDf === 0) {
    warnings.push({ kind: 'saturated', message: 'The model fits every run exactly; there is nothing left to estimate its error.' });
  }

  const totalSs = hasIntercept ? weightedCentredSquares(response, weights) : compensatedSum(response.map((y, i) => weights[i] * y * y));
  const totalDf = hasIntercept ? n - 1 : n;
  const rSquared = totalSs > 0 ? Math.max(0, 1 - residualSumOfSquares / totalSs) : null;
  const adjustedRSquared = rSquared !== null && residualDf > 0 ? 1 - (1 - rSquared) * (totalDf / residualDf) : null;
  const pressTerms = residuals.map((e, i) => (1 - leverages[i] > LEVERAGE_ONE ? (weights[i] * e * e) / (1 - leverages[i]) ** 2 : null));
  const press = pressTerms.every((v) => v !== null) ? compensatedSum(pressTerms as number[]) : null;
  const predictedRSquared = press !== null && totalSs > 0 ? 1 - press / totalSs : null;

  const standardizedResiduals = residuals.map((e, i) => {
    const room = 1 - leverages[i];
    return s && s > 0 && room > LEVERAGE_ONE ? (e * roots[i]) / (s * Math.sqrt(room)) : null;
  });
  const studentizedResiduals = standardizedResiduals.map((r) => {
    if (r === null || residualDf <= 1) return null;
    const rest = residualDf - r * r;
    return rest > 0 ? r * Math.sqrt((residualDf - 1) / rest) : null;
  });

  const regressionDf = hasIntercept ? rank - 1 : rank;
  const regression = line(Math.max(0, totalSs - residualSumOfSquares), regressionDf);
  const residualLine = line(residualSumOfSquares, residualDf);
  const f = regression.meanSquare !== null && residualLine.meanSquare ? regression.meanSquare / residualLine.meanSquare : null;
  const anova: ModelAnova | null = regressionDf > 0 ? {
    regression,
    residual: residualLine,
    total: line(totalSs, totalDf),
    f,
    p: f === null ? null : fUpperTail(f, regressionDf, residualDf),
  } : null;

  // High leverage: hᵢ > 2p/n (Hoaglin & Welsch 1978; Montgomery, Peck & Vining, Introduction to
  // Linear Regression Analysis, §6.2 — memory). Only meaningful while 2p/n < 1.
  const leverageLimit = (2 * rank) / n;
  const highLeverageRuns = leverageLimit < 1 ? leverages.flatMap((h, i) => (h > leverageLimit ? [i] : [])) : [];
  if (highLeverageRuns.length > 0) {
    warnings.push({
      kind: 'high_leverage',
      message: `${highLeverageRuns.length === 1 ? 'One run sits' : `${highLeverageRuns.length} runs sit`} far from the others (leverage above 2p/n = ${leverageLimit.toFixed(2)}) and pull the surface strongly.`,
    });
  }

  return {
    terms,
    observationCount: n,
    parameterCount: rank,
    residualDf,
    residualStandardError: s,
    residualSdOnScale: input.weights === undefined ? s : residualDf > 0 ? Math.sqrt(compensatedSum(residuals.map((e) => e * e)) / residualDf) : null,
    rSquared,
    adjustedRSquared,
    predictedRSquared,
    press,
    leverages,
    fitted,
    residuals,
    standardizedResiduals,
    studentizedResiduals,
    anova,
    lackOfFit: residualDf > 0 ? lackOfFitTest(rows, response, weights, residualSumOfSquares, residualDf) : null,
    leverageLimit,
    highLeverageRuns,
    weighted: input.weights !== undefined,
    weights: input.weights ? [...input.weights] : null,
    warnings,
    basis: {
      coefficients,
      estimableColumns: qr.estimableColumns,
      inverseR: qr.inverseR,
      residualVariance,
      residualDf,
      maxLeverage: Math.max(...leverages),
      hasAliasedTerms: aliased.length > 0,
      t95: residualDf > 0 ? studentTQuantile(0.975, residualDf) : null,
    },
  };
}

export interface Interval {
  low: number;
  high: number;
}

export interface RegressionPrediction {
  estimate: number;
  /** x₀ᵀ(XᵀWX)⁻¹x₀: the new point's leverage. */
  leverage: number;
  standardErrorOfMean: number | null;
  /** Interval for the mean response at the point. */
  confidence: Interval | null;
  /** Interval for one new run at the point (weight `newRunWeight`). */
  prediction: Interval | null;
}

/** ŷ₀ = x₀ᵀβ and the row's leverage, without intervals (the optimiser's inner loop). */
export function estimateRow(basis: PredictionBasis, row: readonly number[]): { estimate: number; leverage: number } {
  let estimate = 0;
  for (let j = 0; j < row.length; j++) estimate += row[j] * basis.coefficients[j];
  return { estimate, leverage: leverageOfRow(basis, row) };
}

/**
 * ŷ₀ = x₀ᵀβ with its intervals (Montgomery, Peck & Vining, §3.4–3.5; R's predict.lm):
 * mean: ŷ₀ ± t(1 − α/2, df) · s·√h₀; new run: ŷ₀ ± t · s·√(1/w₀ + h₀).
 */
export function predictRow(
  basis: PredictionBasis,
  row: readonly number[],
  options: { level?: number; newRunWeight?: number } = {},
): RegressionPrediction {
  const level = options.level ?? 0.95;
  const newRunWeight = options.newRunWeight ?? 1;
  const { estimate, leverage } = estimateRow(basis, row);
  if (basis.residualVariance === null || basis.residualDf <= 0) {
    return { estimate, leverage, standardErrorOfMean: null, confidence: null, prediction: null };
  }
  const s2 = basis.residualVariance;
  const t = level === 0.95 && basis.t95 !== null ? basis.t95 : studentTQuantile(1 - (1 - level) / 2, basis.residualDf);
  const seMean = Math.sqrt(s2 * leverage);
  const seNew = Math.sqrt(s2 * (1 / newRunWeight + leverage));
  return {
    estimate,
    leverage,
    standardErrorOfMean: seMean,
    confidence: { low: estimate - t * seMean, high: estimate + t * seMean },
    prediction: { low: estimate - t * seNew, high: estimate + t * seNew },
  };
}
