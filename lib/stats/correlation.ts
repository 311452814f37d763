/**
 * Pearson correlation, e.g. of a lab measurement (Brix, pH, gel strength) with the
 * sensory mean of each variant. Computed from centred values; the test uses
 * t = r·√((n − 2)/(1 − r²)) with n − 2 df, two-sided p from the t upper tail.
 */
import { compensatedSum, stableMean, studentTTwoSided } from './numeric';

export interface PairedValue {
  label?: string;
  /** e.g. the lab measurement */
  x: number | null | undefined;
  /** e.g. the sensory mean */
  y: number | null | undefined;
}

export interface CorrelationResult {
  n: number;
  r: number | null;
  t: number | null;
  df: number;
  /** Two-sided p-value for H0: ρ = 0. */
  p: number | null;
  warnings: string[];
  message: string | null;
}

/** Pearson correlation of the pairs with both values present. */
export function pearsonCorrelation(pairs: readonly PairedValue[]): CorrelationResult {
  const warnings: string[] = [];
  const complete = pairs.filter(
    (p): p is PairedValue & { x: number; y: number } =>
      typeof p.x === 'number' && Number.isFinite(p.x) && typeof p.y === 'number' && Number.isFinite(p.y),
  );
  if (complete.length < pairs.length) {
    warnings.push(`${pairs.length - complete.length} variant(s) without both values were left out.`);
  }
  const n = complete.length;
  const df = Math.max(0, n - 2);
  if (n < 3) {
    return { n, r: null, t: null, df, p: null, warnings, message: 'At least three variants with both values are needed.' };
  }
  const xMean = stableMean(complete.map((p) => p.x));
  const yMean = stableMean(complete.map((p) => p.y));
  const dx = complete.map((p) => p.x - xMean);
  const dy = complete.map((p) => p.y - yMean);
  const sxx = compensatedSum(dx.map((d) => d * d));
  const syy = compensatedSum(dy.map((d) => d * d));
  const sxy = compensatedSum(dx.map((d, i) => d * dy[i]));
  if (sxx === 0 || syy === 0) {
    return {
      n,
      r: null,
      t: null,
      df,
      p: null,
      warnings,
      message: 'One of the two variables does not vary across variants: the correlation is undefined.',
    };
  }
  const r = Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
  if (Math.abs(r) === 1) {
    warnings.push('The points lie exactly on a line.');
    return { n, r, t: null, df, p: 0, warnings, message: null };
  }
  const t = r * Math.sqrt(df / (1 - r * r));
  return { n, r, t, df, p: studentTTwoSided(t, df), warnings, message: null };
}
