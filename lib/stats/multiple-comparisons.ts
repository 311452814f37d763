/**
 * Pairwise comparison of treatment means after an ANOVA: Tukey HSD (studentized
 * range; Tukey–Kramer form when standard errors differ) or Fisher's LSD (t), with
 * simultaneous / per-comparison confidence intervals and a compact letter display.
 *
 * Letter display: insert-and-absorb algorithm of Piepho (2004), "An algorithm for a
 * letter-based representation of all-pairwise comparisons", J. Comput. Graph. Stat.
 * 13:456–466. Means that share a letter are not significantly different.
 */
import type { AnovaResult } from './anova';
import {
  studentizedRangeQuantile,
  studentizedRangeUpperTail,
  studentTQuantile,
  studentTTwoSided,
} from './numeric';

export type ComparisonMethod = 'tukey-hsd' | 'fisher-lsd';

export interface ComparisonOptions {
  method?: ComparisonMethod;
  alpha?: number;
  /**
   * Each pair's p-value (default true). The letters, intervals and `significant` need only the
   * critical value; a Tukey p is a studentized-range integral per pair, most of a large tasting's
   * analysis time, so a caller that shows none leaves them out.
   */
  pairwiseP?: boolean;
}

export interface MeanToCompare {
  label: string;
  mean: number;
  n: number;
}

export interface ComparisonInput {
  means: readonly MeanToCompare[];
  meanSquareError: number | null;
  dfError: number;
  /**
   * Optional standard errors of differences [i][j] (e.g. from a blocked least-squares fit).
   * Default: √(MSE · (1/nᵢ + 1/nⱼ)).
   */
  differenceStandardErrors?: readonly (readonly (number | null)[])[];
}

export interface PairComparison {
  first: string;
  second: string;
  /** mean(first) − mean(second) */
  difference: number;
  standardErrorOfDifference: number | null;
  /** Studentized range q (Tukey) or t (LSD); null when not estimable. */
  statistic: number | null;
  /** Tukey: family-wise adjusted p. LSD: unadjusted two-sided p. Null when not estimable, or not asked for (`pairwiseP: false`). */
  p: number | null;
  lower: number | null;
  upper: number | null;
  significant: boolean;
}

export interface ComparisonResult {
  method: ComparisonMethod;
  alpha: number;
  /** q(1 − α; k, df) for Tukey, t(1 − α/2; df) for LSD. */
  criticalValue: number | null;
  /** The least difference declared significant, when all pairs share one standard error. */
  criticalDifference: number | null;
  pairs: PairComparison[];
  /** Letters per label (highest mean gets "a"). */
  letters: Record<string, string>;
  /** Labels sorted by mean, highest first. */
  orderedLabels: string[];
  warnings: string[];
  message: string | null;
}

/** Compare all pairs of means. `alpha` defaults to 0.05. */
export function compareMeans(
  input: ComparisonInput,
  options: ComparisonOptions = {},
): ComparisonResult {
  const method = options.method ?? 'tukey-hsd';
  const alpha = options.alpha ?? 0.05;
  const warnings: string[] = [];
  const means = input.means;
  const k = means.length;
  const orderedLabels = [...means].sort((a, b) => b.mean - a.mean).map((m) => m.label);
  const { meanSquareError, dfError } = input;
  const empty = (message: string): ComparisonResult => ({
    method,
    alpha,
    criticalValue: null,
    criticalDifference: null,
    pairs: [],
    letters: Object.fromEntries(means.map((m) => [m.label, 'a'])),
    orderedLabels,
    warnings,
    message,
  });
  if (k < 2) return empty('Fewer than two means: there is nothing to compare.');
  if (meanSquareError === null || dfError <= 0) {
    return empty('No residual degrees of freedom: pairwise comparisons need an error variance.');
  }
  if (meanSquareError <= 0) {
    return empty('The error variance is zero: every difference would be infinitely significant, so none is reported.');
  }

  const criticalValue =
    method === 'tukey-hsd'
      ? studentizedRangeQuantile(1 - alpha, k, dfError)
      : studentTQuantile(1 - alpha / 2, dfError);

  const pairs: PairComparison[] = [];
  const standardErrors: number[] = [];
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      const a = means[i];
      const b = means[j];
      const given = input.differenceStandardErrors?.[i]?.[j];
      const se =
        given === undefined ? Math.sqrt(meanSquareError * (1 / a.n + 1 / b.n)) : given;
      const difference = a.mean - b.mean;
      if (se === null || !Number.isFinite(se) || se <= 0) {
        warnings.push(`${a.label} vs ${b.label}: the difference cannot be estimated from this design.`);
        pairs.push({
          first: a.label,
          second: b.label,
          difference,
          standardErrorOfDifference: null,
          statistic: null,
          p: null,
          lower: null,
          upper: null,
          significant: false,
        });
        continue;
      }
      standardErrors.push(se);
      // Tukey's q uses the SE of one mean: SE(diff)/√2 (Tukey–Kramer when unequal).
      const scale = method === 'tukey-hsd' ? se / Math.SQRT2 : se;
      const statistic = Math.abs(difference) / scale;
      const p =
        options.pairwiseP === false
          ? null
          : method === 'tukey-hsd'
            ? studentizedRangeUpperTail(statistic, k, dfError)
            : studentTTwoSided(statistic, dfError);
      const halfWidth = criticalValue * scale;
      pairs.push({
        first: a.label,
        second: b.label,
        difference,
        standardErrorOfDifference: se,
        statistic,
        p,
        lower: difference - halfWidth,
        upper: difference + halfWidth,
        significant: Math.abs(difference) > halfWidth,
      });
    }
  }
  const sameStandardError =
    standardErrors.length > 0 &&
    standardErrors.every((se) => Math.abs(se - standardErrors[0]) <= 1e-12 * standardErrors[0]);
  const criticalDifference = sameStandardError
    ? criticalValue * (method === 'tukey-hsd' ? standardErrors[0] / Math.SQRT2 : standardErrors[0])
    : null;
  if (method === 'fisher-lsd') {
    warnings.push("Fisher's LSD does not control the family-wise error rate; use it only after a significant F test.");
  }
  const letters = compactLetterDisplay(
    orderedLabels,
    pairs.filter((p) => p.significant).map((p) => [p.first, p.second] as [string, string]),
  );
  return { method, alpha, criticalValue, criticalDifference, pairs, letters, orderedLabels, warnings, message: null };
}

/** Compare the treatments of an ANOVA result, using its MSE and error df. */
export function compareTreatmentMeans(
  anova: AnovaResult,
  options: ComparisonOptions = {},
): ComparisonResult {
  const means = anova.treatments.map((t) => ({ label: t.label, n: t.n, mean: t.adjustedMean ?? t.rawMean }));
  const result = compareMeans(
    {
      means,
      meanSquareError: anova.meanSquareError,
      dfError: anova.dfError,
      differenceStandardErrors: anova.differenceStandardErrors,
    },
    options,
  );
  if (anova.treatments.some((t) => t.adjustedMean === null)) {
    result.warnings.push('Some adjusted means are not estimable; their raw means are shown instead.');
  }
  return result;
}

/**
 * Compact letter display by insert-and-absorb (Piepho 2004).
 * `orderedLabels` sets the letter order (first label gets "a");
 * `significantPairs` lists the pairs that differ.
 */
export function compactLetterDisplay(
  orderedLabels: readonly string[],
  significantPairs: readonly (readonly [string, string])[],
): Record<string, string> {
  let columns: Set<string>[] = [new Set(orderedLabels)];
  for (const [a, b] of significantPairs) {
    const next: Set<string>[] = [];
    for (const column of columns) {
      if (column.has(a) && column.has(b)) {
        // Insert: split the column so that a and b no longer share it.
        const withoutA = new Set(column);
        withoutA.delete(a);
        const withoutB = new Set(column);
        withoutB.delete(b);
        next.push(withoutA, withoutB);
      } else {
        next.push(column);
      }
    }
    // Absorb: drop columns contained in another column (and duplicates).
    columns = next.filter(
      (column, index) =>
        !next.some(
          (other, otherIndex) =>
            otherIndex !== index &&
            [...column].every((label) => other.has(label)) &&
            (other.size > column.size || otherIndex < index),
        ),
    );
  }
  const position = (label: string) => orderedLabels.indexOf(label);
  columns.sort((x, y) => {
    const firstX = Math.min(...[...x].map(position));
    const firstY = Math.min(...[...y].map(position));
    return firstX - firstY;
  });
  const letters: Record<string, string> = Object.fromEntries(orderedLabels.map((l) => [l, '']));
  columns.forEach((column, index) => {
    const letter = letterName(index);
    for (const label of orderedLabels) if (column.has(label)) letters[label] += letter;
  });
  return letters;
}

/** a, b, …, z, then aa, ab, … for very many groups. */
function letterName(index: number): string {
  const alphabet = 'abcdefghijklmnopqrstuvwxyz';
  return index < 26 ? alphabet[index] : letterName(Math.floor(index / 26) - 1) + alphabet[index % 26];
}
