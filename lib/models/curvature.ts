/** The curvature test from centre points in a two-level factorial design. */
import { compensatedSum, fUpperTail } from '@/lib/stats';
import { weightedCentredSquares } from './regression';

export interface CurvatureTest {
  factorialRuns: number;
  centreRuns: number;
  /** Weighted by the runs' weights when they have them. */
  factorialMean: number;
  centreMean: number;
  /** WF·WC·(ȳF − ȳC)² / (WF + WC), one df; W = the group's total weight (nF, nC unweighted). */
  sumOfSquares: number;
  /** From the centre points alone (weighted like the curvature). */
  pureErrorMeanSquare: number | null;
  pureErrorDf: number;
  f: number | null;
  p: number | null;
}

/**
 * Curvature from centre points in a two-level factorial (Montgomery, Design and Analysis of
 * Experiments, §6.8): if the surface were planar, the centre mean would equal the factorial mean.
 * `coded` holds the runs' coded levels: every factorial run at ±1 in each factor, centre runs at 0.
 * Returns null when the runs are not of that shape or there are no centre runs.
 *
 * With weights (the model's n/s² of panel means) every sum is weighted like the model's other ANOVA
 * rows: weighted least squares minimises Σ wᵢ(yᵢ − ŷᵢ)² (NIST/SEMATECH e-Handbook of Statistical
 * Methods, §4.1.4.3), so the curvature is the weighted between-groups SS of two groups (corners,
 * centre) about their weighted means, and the pure error the centre runs' weighted spread. Weights
 * must be all given or all left out; without them both reduce to Montgomery's unweighted formulas.
 */
export function centrePointCurvature(
  runs: ReadonlyArray<{ coded: readonly number[]; response: number; weight?: number }>,
): CurvatureTest | null {
  const isCentre = (c: readonly number[]) => c.every((v) => Math.abs(v) < 1e-9);
  const isCorner = (c: readonly number[]) => c.every((v) => Math.abs(Math.abs(v) - 1) < 1e-9);
  if (runs.some((r) => !isCentre(r.coded) && !isCorner(r.coded))) return null;
  const centre = runs.filter((r) => isCentre(r.coded));
  const factorial = runs.filter((r) => isCorner(r.coded));
  if (centre.length === 0 || factorial.length === 0) return null;
  const nF = factorial.length;
  const nC = centre.length;
  const weightOf = (r: { weight?: number }) => r.weight ?? 1;
  const totalF = compensatedSum(factorial.map(weightOf));
  const totalC = compensatedSum(centre.map(weightOf));
  const factorialMean = compensatedSum(factorial.map((r) => weightOf(r) * r.response)) / totalF;
  const centreMean = compensatedSum(centre.map((r) => weightOf(r) * r.response)) / totalC;
  const difference = factorialMean - centreMean;
  const sumOfSquares = (totalF * totalC * difference * difference) / (totalF + totalC);
  const pureErrorDf = nC - 1;
  const pureErrorMeanSquare = pureErrorDf > 0 ? weightedCentredSquares(centre.map((r) => r.response), centre.map(weightOf)) / pureErrorDf : null;
  const f = pureErrorMeanSquare && pureErrorMeanSquare > 0 ? sumOfSquares / pureErrorMeanSquare : null;
  return {
    factorialRuns: nF,
    centreRuns: nC,
    factorialMean,
    centreMean,
    sumOfSquares,
    pureErrorMeanSquare,
    pureErrorDf,
    f,
    p: f === null ? null : fUpperTail(f, 1, pureErrorDf),
  };
}
