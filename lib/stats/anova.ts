/**
 * One-way ANOVA and two-way ANOVA with assessors as blocks (randomised complete
 * block, main effects only, no interaction term).
 *
 * Every sum of squares is computed from data centred on the grand mean, in two
 * passes; no one-pass Σx² − (Σx)²/n formula is used anywhere. Complete balanced
 * blocks use the closed-form formulas; missing cells or unequal replication use a
 * least-squares fit (Householder QR) and adjusted sums of squares: each effect's SS
 * is the rise in residual SS when that effect is dropped from the main-effects
 * model (type II = type III here, since there is no interaction).
 */
import { describeGroup, finiteValues, type GroupDescription, type LabelledValues } from './descriptive';
import { fitLeastSquares } from './least-squares';
import { centredSumOfSquares, compensatedSum, fUpperTail, stableMean } from './numeric';

export type AnovaSource = 'treatments' | 'blocks' | 'error' | 'total';

export interface AnovaRow {
  source: AnovaSource;
  sumOfSquares: number;
  df: number;
  meanSquare: number | null;
  f: number | null;
  /** Upper-tail F probability; null when F is undefined. */
  p: number | null;
}

export interface TreatmentMean {
  label: string;
  n: number;
  /** Plain mean of the observations of this treatment. */
  rawMean: number;
  /**
   * Least-squares (block-adjusted) mean; equals the raw mean for complete balanced data.
   * Null when the design does not allow it to be estimated.
   */
  adjustedMean: number | null;
}

export interface AnovaResult {
  design: 'one-way' | 'blocked';
  rows: AnovaRow[];
  treatments: TreatmentMean[];
  grandMean: number | null;
  meanSquareError: number | null;
  dfError: number;
  /**
   * Standard errors of differences between (adjusted) treatment means, [i][j] in the
   * order of `treatments`; null where not estimable or when there is no error df.
   */
  differenceStandardErrors: (number | null)[][];
  /** True when some assessor did not score every sample. */
  incomplete: boolean;
  method: 'closed-form' | 'least-squares';
  warnings: string[];
  /**
   * The main note for the reader: why there is no F test, or else (for incomplete
   * data) that the sums of squares are adjusted. Null when there is nothing to say.
   */
  message: string | null;
}

function row(source: AnovaSource, sumOfSquares: number, df: number): AnovaRow {
  const meanSquare = source !== 'total' && df > 0 ? sumOfSquares / df : null;
  return { source, sumOfSquares, df, meanSquare, f: null, p: null };
}

function withFTests(rows: AnovaRow[], dfError: number, meanSquareError: number | null): AnovaRow[] {
  return rows.map((r) => {
    if (r.source === 'error' || r.source === 'total' || r.meanSquare === null || meanSquareError === null) return r;
    if (meanSquareError <= 0 || dfError <= 0) return { ...r, f: null, p: null };
    const f = r.meanSquare / meanSquareError;
    return { ...r, f, p: fUpperTail(f, r.df, dfError) };
  });
}

/** Explain a missing F test, or return null when F is defined. */
function explainMissingF(dfError: number, meanSquareError: number | null, dfTreatments: number): string | null {
  if (dfTreatments <= 0) return 'Fewer than two samples with data: there is nothing to compare.';
  if (dfError <= 0) return 'No residual degrees of freedom (each sample needs more than one score): F cannot be computed.';
  if (meanSquareError !== null && meanSquareError <= 0) {
    return 'The residual variance is zero (every score equals its fitted value): F is undefined.';
  }
  return null;
}

/**
 * One-way ANOVA of several groups (unequal sizes allowed).
 */
export function oneWayAnova(groups: readonly LabelledValues[]): AnovaResult {
  const warnings: string[] = [];
  const cleaned = groups
    .map((g) => ({ label: g.label, values: finiteValues(g.values, warnings, g.label) }))
    .filter((g) => {
      if (g.values.length === 0) warnings.push(`${g.label}: no values, left out of the analysis.`);
      return g.values.length > 0;
    });
  const all = cleaned.flatMap((g) => g.values);
  const n = all.length;
  const grandMean = n > 0 ? stableMean(all) : null;
  const centre = grandMean ?? 0;
  // Centre first: later sums then never see a large common offset.
  const centred = cleaned.map((g) => g.values.map((v) => v - centre));
  const centredGrand = n > 0 ? stableMean(centred.flat()) : 0;
  const groupMeansCentred = centred.map((values) => stableMean(values));
  const treatmentsSS = compensatedSum(
    groupMeansCentred.map((m, i) => centred[i].length * (m - centredGrand) * (m - centredGrand)),
  );
  const errorSS = compensatedSum(centred.map((values) => centredSumOfSquares(values)));
  const totalSS = centredSumOfSquares(centred.flat());
  const dfTreatments = Math.max(0, cleaned.length - 1);
  const dfError = Math.max(0, n - cleaned.length);
  const meanSquareError = dfError > 0 ? errorSS / dfError : null;

  const rows = withFTests(
    [
      row('treatments', treatmentsSS, dfTreatments),
      row('error', errorSS, dfError),
      row('total', totalSS, Math.max(0, n - 1)),
    ],
    dfError,
    meanSquareError,
  );
  const treatments: TreatmentMean[] = cleaned.map((g, i) => ({
    label: g.label,
    n: g.values.length,
    rawMean: groupMeansCentred[i] + centre,
    adjustedMean: groupMeansCentred[i] + centre,
  }));
  const differenceStandardErrors = treatments.map((a) =>
    treatments.map((b) =>
      meanSquareError !== null ? Math.sqrt(meanSquareError * (1 / a.n + 1 / b.n)) : null,
    ),
  );
  return {
    design: 'one-way',
    rows,
    treatments,
    grandMean,
    meanSquareError,
    dfError,
    differenceStandardErrors,
    incomplete: false,
    method: 'closed-form',
    warnings,
    message: explainMissingF(dfError, meanSquareError, dfTreatments),
  };
}

export interface BlockedObservation {
  /** The sample / variant scored. */
  treatment: string;
  /** The assessor (block). */
  block: string;
  value: number;
}

/** The values of each group, in their original order, in one pass (a filter per group grew with groups × values). */
function groupedInOrder(values: readonly number[], group: readonly number[], groups: number): number[][] {
  const out = Array.from({ length: groups }, () => [] as number[]);
  values.forEach((v, k) => out[group[k]].push(v));
  return out;
}

function uniqueInOrder(values: readonly string[]): string[] {
  return [...new Set(values)];
}

/**
 * Two-way ANOVA with assessors as blocks: y = μ + τ(sample) + β(assessor) + ε.
 * Complete data with equal replication → closed form; otherwise least squares with
 * adjusted SS and `incomplete: true` when cells are missing.
 * `method: 'least-squares'` forces the general route (same results on complete data).
 */
export function blockedAnova(
  rawObservations: readonly BlockedObservation[],
  options: { method?: 'auto' | 'least-squares' } = {},
): AnovaResult {
  const warnings: string[] = [];
  const observations = rawObservations.filter((o) => typeof o.value === 'number' && Number.isFinite(o.value));
  if (observations.length < rawObservations.length) {
    warnings.push(`${rawObservations.length - observations.length} missing or non-numeric score(s) ignored.`);
  }
  const treatmentLabels = uniqueInOrder(observations.map((o) => o.treatment));
  const blockLabels = uniqueInOrder(observations.map((o) => o.block));
  const t = treatmentLabels.length;
  const b = blockLabels.length;
  const n = observations.length;
  const grandMean = n > 0 ? stableMean(observations.map((o) => o.value)) : null;
  const centre = grandMean ?? 0;
  const y = observations.map((o) => o.value - centre);
  // Positions by lookup, not indexOf: a scan per observation grew with assessors × answers.
  const treatmentIndex = new Map(treatmentLabels.map((label, i) => [label, i]));
  const blockIndex = new Map(blockLabels.map((label, i) => [label, i]));
  const ti = observations.map((o) => treatmentIndex.get(o.treatment)!);
  const bi = observations.map((o) => blockIndex.get(o.block)!);

  const cellCounts = Array.from({ length: t }, () => new Array<number>(b).fill(0));
  ti.forEach((i, k) => {
    cellCounts[i][bi[k]] += 1;
  });
  const replication = n > 0 ? cellCounts[0][0] : 0;
  const incomplete = cellCounts.some((r) => r.some((c) => c === 0));
  const balanced = !incomplete && cellCounts.every((r) => r.every((c) => c === replication));

  const byTreatment = groupedInOrder(y, ti, t);
  const rawMeans = byTreatment.map(stableMean);
  const treatmentCounts = byTreatment.map((values) => values.length);
  const totalSS = centredSumOfSquares(y);

  if (b < 2) warnings.push('Only one assessor: there is no block effect to remove.');
  const incompleteNote =
    'Incomplete data: not every assessor scored every sample. Sums of squares are adjusted (least squares, each effect fitted after the other), and the test compares means adjusted for assessors, which can differ from the raw means.';
  if (incomplete) warnings.push(incompleteNote);

  let treatmentsSS: number;
  let blocksSS: number;
  let errorSS: number;
  let dfTreatments: number;
  let dfBlocks: number;
  let dfError: number;
  let adjustedCentredMeans: (number | null)[];
  let unscaledDifferenceVariance: (i: number, j: number) => number | null;
  let method: AnovaResult['method'];

  if (balanced && n > 0 && options.method !== 'least-squares') {
    method = 'closed-form';
    const yBar = stableMean(y);
    const blockMeans = groupedInOrder(y, bi, b).map(stableMean);
    treatmentsSS = b * replication * compensatedSum(rawMeans.map((m) => (m - yBar) ** 2));
    blocksSS = t * replication * compensatedSum(blockMeans.map((m) => (m - yBar) ** 2));
    // Residuals of the additive model, squared directly (no subtraction of SS totals).
    errorSS = compensatedSum(y.map((v, k) => (v - rawMeans[ti[k]] - blockMeans[bi[k]] + yBar) ** 2));
    dfTreatments = t - 1;
    dfBlocks = b - 1;
    dfError = n - t - b + 1;
    adjustedCentredMeans = rawMeans;
    unscaledDifferenceVariance = () => 2 / (b * replication);
  } else {
    method = 'least-squares';
    // Treatment coding: intercept, t − 1 sample columns, b − 1 assessor columns.
    const makeRow = (k: number, useTreatments: boolean, useBlocks: boolean): number[] => {
      const r = [1];
      if (useTreatments) for (let i = 1; i < t; i++) r.push(ti[k] === i ? 1 : 0);
      if (useBlocks) for (let j = 1; j < b; j++) r.push(bi[k] === j ? 1 : 0);
      return r;
    };
    const full = fitLeastSquares(y.map((_, k) => makeRow(k, true, true)), y);
    const withoutTreatments = fitLeastSquares(y.map((_, k) => makeRow(k, false, true)), y);
    const withoutBlocks = fitLeastSquares(y.map((_, k) => makeRow(k, true, false)), y);
    treatmentsSS = Math.max(0, withoutTreatments.residualSumOfSquares - full.residualSumOfSquares);
    blocksSS = Math.max(0, withoutBlocks.residualSumOfSquares - full.residualSumOfSquares);
    errorSS = full.residualSumOfSquares;
    dfTreatments = full.rank - withoutTreatments.rank;
    dfBlocks = full.rank - withoutBlocks.rank;
    dfError = full.residualDf;
    if (full.aliased.some((a) => a)) {
      warnings.push(
        'Samples and assessors are not fully connected: some sample means cannot be adjusted for assessors.',
      );
    }
    const treatmentColumn = (i: number): number | null => (i === 0 ? null : i); // column index in `full`
    const estimable = (i: number): boolean => {
      const column = treatmentColumn(i);
      return column === null || !full.aliased[column];
    };
    const blockAverageOfEffects = (() => {
      let sum = 0;
      for (let j = 1; j < b; j++) {
        const c = full.coefficients[t - 1 + j];
        if (c === null) return null;
        sum += c;
      }
      return b > 0 ? sum / b : 0;
    })();
    adjustedCentredMeans = treatmentLabels.map((_, i) => {
      const intercept = full.coefficients[0];
      const column = treatmentColumn(i);
      const effect = column === null ? 0 : full.coefficients[column];
      if (intercept === null || effect === null || blockAverageOfEffects === null) return null;
      return intercept + effect + blockAverageOfEffects;
    });
    unscaledDifferenceVariance = (i, j) => {
      if (!estimable(i) || !estimable(j)) return null;
      const ci = treatmentColumn(i);
      const cj = treatmentColumn(j);
      const v = full.unscaledCovariance;
      const vii = ci === null ? 0 : v[ci][ci];
      const vjj = cj === null ? 0 : v[cj][cj];
      const vij = ci === null || cj === null ? 0 : v[ci][cj];
      return vii + vjj - 2 * vij;
    };
  }

  const meanSquareError = dfError > 0 ? errorSS / dfError : null;
  const rows = withFTests(
    [
      row('treatments', treatmentsSS, dfTreatments),
      row('blocks', blocksSS, dfBlocks),
      row('error', errorSS, dfError),
      row('total', totalSS, Math.max(0, n - 1)),
    ],
    dfError,
    meanSquareError,
  );
  const treatments: TreatmentMean[] = treatmentLabels.map((label, i) => {
    const adjusted = adjustedCentredMeans[i];
    return {
      label,
      n: treatmentCounts[i],
      rawMean: rawMeans[i] + centre,
      adjustedMean: adjusted === null ? null : adjusted + centre,
    };
  });
  const differenceStandardErrors = treatmentLabels.map((_, i) =>
    treatmentLabels.map((__, j) => {
      if (meanSquareError === null) return null;
      if (i === j) return 0;
      const unscaled = unscaledDifferenceVariance(i, j);
      return unscaled === null ? null : Math.sqrt(Math.max(0, unscaled) * meanSquareError);
    }),
  );
  return {
    design: 'blocked',
    rows,
    treatments,
    grandMean,
    meanSquareError,
    dfError,
    differenceStandardErrors,
    incomplete,
    method,
    warnings,
    message: explainMissingF(dfError, meanSquareError, dfTreatments) ?? (incomplete ? incompleteNote : null),
  };
}

/** Convenience: descriptive statistics for each treatment of a blocked data set. */
export function describeTreatments(observations: readonly BlockedObservation[], confidenceLevel = 0.95): GroupDescription[] {
  const labels = uniqueInOrder(observations.map((o) => o.treatment));
  return labels.map((label) =>
    describeGroup(
      label,
      observations.filter((o) => o.treatment === label).map((o) => o.value),
      confidenceLevel,
    ),
  );
}
