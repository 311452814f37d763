/**
 * Friedman rank test for ranking data (each assessor ranks or scores every sample),
 * with the tie correction, and a multiple comparison of rank sums.
 *
 * Statistic (ties corrected, as R's friedman.test and Hollander & Wolfe):
 *   T = 12 Σⱼ (Rⱼ − b(k+1)/2)² / ( b·k·(k+1) − Σ_blocks Σ_tie-groups (t³ − t)/(k − 1) ),
 * referred to chi-square with k − 1 df (upper tail computed directly).
 *
 * Rank-sum comparisons (no tie adjustment in either):
 * - 'iso-8587-lsd' (default): least significant difference on rank sums,
 *   LSD = z(1 − α/2) · √(b·k·(k+1)/6), as in ISO 8587 (memory: clause on the Friedman test);
 *   pairwise, not family-wise.
 * - 'nemenyi': Nemenyi's test, |Rᵢ − Rⱼ| compared with q(1 − α; k, ∞) · √(b·k·(k+1)/12);
 *   family-wise.
 */
import { compactLetterDisplay } from './multiple-comparisons';
import {
  chiSquareUpperTail,
  normalQuantile,
  normalUpperTail,
  studentizedRangeQuantile,
  studentizedRangeUpperTail,
} from './numeric';

export type RankComparisonMethod = 'iso-8587-lsd' | 'nemenyi';

export interface RankingBlock {
  /** Assessor id. */
  block: string;
  /**
   * Rank or score per sample label. Lower value = rank 1 (e.g. rank 1 = most preferred).
   * Values are re-ranked within the block, ties get mid-ranks.
   */
  values: Readonly<Record<string, number>>;
}

export interface RankSumComparison {
  first: string;
  second: string;
  /** R(first) − R(second) */
  difference: number;
  p: number;
  significant: boolean;
}

export interface FriedmanResult {
  treatments: string[];
  rankSums: Record<string, number>;
  meanRanks: Record<string, number>;
  blockCount: number;
  statistic: number | null;
  df: number;
  p: number | null;
  tieCorrection: number;
  comparisonMethod: RankComparisonMethod;
  /** Critical difference between rank sums at α. */
  criticalDifference: number | null;
  comparisons: RankSumComparison[];
  letters: Record<string, string>;
  warnings: string[];
  message: string | null;
}

/** Mid-ranks of values (1 = smallest) and the sizes of tie groups. */
export function midRanks(values: readonly number[]): { ranks: number[]; tieSizes: number[] } {
  const order = values.map((value, index) => ({ value, index })).sort((a, b) => a.value - b.value);
  const ranks = new Array<number>(values.length).fill(0);
  const tieSizes: number[] = [];
  let start = 0;
  while (start < order.length) {
    let end = start;
    while (end + 1 < order.length && order[end + 1].value === order[start].value) end++;
    const rank = (start + end) / 2 + 1;
    for (let i = start; i <= end; i++) ranks[order[i].index] = rank;
    tieSizes.push(end - start + 1);
    start = end + 1;
  }
  return { ranks, tieSizes };
}

/**
 * Friedman test. Blocks lacking a value for some sample are dropped (the test needs
 * complete blocks) and listed in `warnings`.
 */
export function friedmanTest(
  blocks: readonly RankingBlock[],
  options: { alpha?: number; comparison?: RankComparisonMethod; treatments?: readonly string[] } = {},
): FriedmanResult {
  const alpha = options.alpha ?? 0.05;
  const comparisonMethod = options.comparison ?? 'iso-8587-lsd';
  const warnings: string[] = [];
  const treatments = options.treatments
    ? [...options.treatments]
    : [...new Set(blocks.flatMap((b) => Object.keys(b.values)))];
  const k = treatments.length;
  const complete = blocks.filter((b) => {
    const ok = treatments.every((t) => typeof b.values[t] === 'number' && Number.isFinite(b.values[t]));
    if (!ok) warnings.push(`Assessor ${b.block} did not rank every sample and was left out.`);
    return ok;
  });
  const n = complete.length;
  const rankSumsList = new Array<number>(k).fill(0);
  let tieTerm = 0;
  for (const block of complete) {
    const { ranks, tieSizes } = midRanks(treatments.map((t) => block.values[t]));
    ranks.forEach((r, j) => {
      rankSumsList[j] += r;
    });
    tieTerm += tieSizes.reduce((sum, size) => sum + size ** 3 - size, 0);
  }
  const rankSums = Object.fromEntries(treatments.map((t, j) => [t, rankSumsList[j]]));
  const meanRanks = Object.fromEntries(treatments.map((t, j) => [t, n > 0 ? rankSumsList[j] / n : 0]));
  const base = {
    treatments,
    rankSums,
    meanRanks,
    blockCount: n,
    df: Math.max(0, k - 1),
    tieCorrection: tieTerm,
    comparisonMethod,
    warnings,
  };
  const noTest = (message: string): FriedmanResult => ({
    ...base,
    statistic: null,
    p: null,
    criticalDifference: null,
    comparisons: [],
    letters: Object.fromEntries(treatments.map((t) => [t, 'a'])),
    message,
  });
  if (k < 2) return noTest('Fewer than two samples: there is nothing to rank.');
  if (n < 2) return noTest('Fewer than two complete assessors: the Friedman test needs at least two.');
  const denominator = n * k * (k + 1) - tieTerm / (k - 1);
  if (denominator <= 0) {
    return noTest('Every assessor tied all samples: the rankings carry no information, so no test is possible.');
  }
  const expected = (n * (k + 1)) / 2;
  const statistic = (12 * rankSumsList.reduce((sum, r) => sum + (r - expected) ** 2, 0)) / denominator;
  const p = chiSquareUpperTail(statistic, k - 1);
  if (tieTerm > 0) warnings.push('Ties within assessors: the statistic includes the tie correction.');
  if (n < 10 || k < 3) warnings.push('Few assessors or samples: the chi-square approximation is rough.');

  const lsdScale = Math.sqrt((n * k * (k + 1)) / 6);
  const nemenyiScale = Math.sqrt((n * k * (k + 1)) / 12);
  const criticalDifference =
    comparisonMethod === 'iso-8587-lsd'
      ? normalQuantile(1 - alpha / 2) * lsdScale
      : studentizedRangeQuantile(1 - alpha, k, Infinity) * nemenyiScale;
  const comparisons: RankSumComparison[] = [];
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      const difference = rankSumsList[i] - rankSumsList[j];
      const pairP =
        comparisonMethod === 'iso-8587-lsd'
          ? Math.min(1, 2 * normalUpperTail(Math.abs(difference) / lsdScale))
          : studentizedRangeUpperTail(Math.abs(difference) / nemenyiScale, k, Infinity);
      comparisons.push({
        first: treatments[i],
        second: treatments[j],
        difference,
        p: pairP,
        significant: Math.abs(difference) >= criticalDifference,
      });
    }
  }
  // Lowest rank sum first (rank 1 = most of the ranked attribute) gets "a".
  const ordered = [...treatments].sort((a, b) => rankSums[a] - rankSums[b]);
  const letters = compactLetterDisplay(
    ordered,
    comparisons.filter((c) => c.significant).map((c) => [c.first, c.second] as [string, string]),
  );
  return { ...base, statistic, p, criticalDifference, comparisons, letters, message: null };
}
