/** The curvature test from centre points in a two-level factorial design. */
import { fUpperTail, stableMean } from '@/lib/stats';
import { weightedCentredSquares } from './regression';

export interface CurvatureTest {
  factorialRuns: number;
  centreRuns: number;
  factorialMean: number;
  centreMean: number;
  /** nF·nC·(ȳF − ȳC)² / (nF + nC), one df. */
  sumOfSquares: number;
  /** From the centre points alone. */
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
 */
export function centrePointCurvature(
  runs: ReadonlyArray<{ coded: readonly number[]; response: number }>,
): CurvatureTest | null {
  const isCentre = (c: readonly number[]) => c.every((v) => Math.abs(v) < 1e-9);
  const isCorner = (c: readonly number[]) => c.every((v) => Math.abs(Math.abs(v) - 1) < 1e-9);
  if (runs.some((r) => !isCentre(r.coded) && !isCorner(r.coded))) return null;
  const centre = runs.filter((r) => isCentre(r.coded)).map((r) => r.response);
  const factorial = runs.filter((r) => isCorner(r.coded)).map((r) => r.response);
  if (centre.length === 0 || factorial.length === 0) return null;
  const nF = factorial.length;
  const nC = centre.length;
  const factorialMean = stableMean(factorial);
  const centreMean = stableMean(centre);
  const difference = factorialMean - centreMean;
  const sumOfSquares = (nF * nC * difference * difference) / (nF + nC);
  const pureErrorDf = nC - 1;
  const pureErrorMeanSquare = pureErrorDf > 0 ? weightedCentredSquares(centre, centre.map(() => 1)) / pureErrorDf : null;
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
