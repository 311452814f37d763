/**
 * Descriptive statistics per group: n, mean, sample SD, standard error, a t-based confidence
 * interval, and the median and quartiles (simple-statistics; the mean and SD stay in numeric.ts,
 * which says why). Sums of squares are centred (two passes).
 */
import { medianSorted, quantileSorted } from 'simple-statistics';
import { centredSumOfSquares, stableMean, studentTQuantile } from './numeric';

export interface ConfidenceInterval {
  lower: number;
  upper: number;
  /** e.g. 0.95 */
  level: number;
}

export interface GroupDescription {
  label: string;
  n: number;
  mean: number | null;
  /** Sample standard deviation (divisor n − 1). */
  standardDeviation: number | null;
  standardError: number | null;
  /** mean ± t(1 − (1 − level)/2, n − 1) · SE */
  confidenceInterval: ConfidenceInterval | null;
  /** The middle score: on a 9-point hedonic or JAR scale it is robust to a few extreme tasters. */
  median: number | null;
  /** First and third quartiles, linear interpolation between order statistics (R's type 7). */
  quartiles: { lower: number; upper: number } | null;
  warnings: string[];
}

export interface LabelledValues {
  label: string;
  values: readonly number[];
}

/** Keep finite numbers only and say how many were dropped. */
export function finiteValues(values: readonly number[], warnings: string[], label: string): number[] {
  const kept = values.filter((v) => typeof v === 'number' && Number.isFinite(v));
  if (kept.length < values.length) {
    warnings.push(`${label}: ${values.length - kept.length} missing or non-numeric value(s) ignored.`);
  }
  return kept;
}

/** Describe one group. `confidenceLevel` defaults to 0.95. */
export function describeGroup(label: string, rawValues: readonly number[], confidenceLevel = 0.95): GroupDescription {
  const warnings: string[] = [];
  const values = finiteValues(rawValues, warnings, label);
  const n = values.length;
  if (n === 0) {
    warnings.push(`${label}: no values, nothing to describe.`);
    return { label, n, mean: null, standardDeviation: null, standardError: null, confidenceInterval: null, median: null, quartiles: null, warnings };
  }
  const mean = stableMean(values);
  const sorted = [...values].sort((a, b) => a - b);
  const median = medianSorted(sorted);
  const quartiles = { lower: quantileSorted(sorted, 0.25), upper: quantileSorted(sorted, 0.75) };
  if (n < 2) {
    warnings.push(`${label}: a single value has no standard deviation or confidence interval (n < 2).`);
    return { label, n, mean, standardDeviation: null, standardError: null, confidenceInterval: null, median, quartiles, warnings };
  }
  const standardDeviation = Math.sqrt(centredSumOfSquares(values) / (n - 1));
  const standardError = standardDeviation / Math.sqrt(n);
  if (standardDeviation === 0) warnings.push(`${label}: all values are equal (zero variance).`);
  const t = studentTQuantile(1 - (1 - confidenceLevel) / 2, n - 1);
  return {
    label,
    n,
    mean,
    standardDeviation,
    standardError,
    confidenceInterval: { lower: mean - t * standardError, upper: mean + t * standardError, level: confidenceLevel },
    median,
    quartiles,
    warnings,
  };
}

/** Describe several groups, in the order given. */
export function describeGroups(groups: readonly LabelledValues[], confidenceLevel = 0.95): GroupDescription[] {
  return groups.map((group) => describeGroup(group.label, group.values, confidenceLevel));
}
