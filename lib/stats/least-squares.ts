/**
 * Small least-squares solver: Householder QR with rank detection.
 *
 * Why QR and not the normal equations: forming XᵀX squares the condition number;
 * Householder reflections keep it. Columns that are (numerically) linear
 * combinations of earlier columns are marked `aliased` and left out, as R's `lm`
 * does, so unbalanced or disconnected designs still give a fit and a clear flag.
 * Callers centre the response first, so the offset of the data cannot hurt.
 * Householder QR is column-scaling invariant in its rounding errors, so columns of very different
 * size (x and x¹⁰ in NIST's Filip set) need no rescaling here; on Filip it keeps 8 digits of the
 * certified coefficients (tests/unit/models/nist.test.ts).
 */
import { compensatedSum } from './numeric';

export interface LeastSquaresFit {
  /** One per design column; null where the column is aliased. */
  coefficients: (number | null)[];
  aliased: boolean[];
  rank: number;
  observationCount: number;
  residualDf: number;
  residualSumOfSquares: number;
  residuals: number[];
  /**
   * (XᵀX)⁻¹ restricted to the estimable columns (zero rows/columns where aliased);
   * multiply by the residual mean square for the covariance of the coefficients.
   */
  unscaledCovariance: number[][];
  /** Indices of the estimable (non-aliased) design columns, in order. */
  estimableColumns: number[];
  /** R⁻¹ of the QR factors of the estimable columns (upper triangular, rank × rank). */
  inverseR: number[][];
  /** Diagonal of the hat matrix X(XᵀX)⁻¹Xᵀ: each row's leverage, from its row of Q. */
  leverages: number[];
}

/**
 * x₀ᵀ(XᵀX)⁻¹x₀ for a row laid out like the design's: ‖x₀ R⁻¹‖², which keeps the digits that
 * forming (XᵀX)⁻¹ would lose. For a row of the design it is that row's leverage.
 */
export function leverageOfRow(fit: Pick<LeastSquaresFit, 'estimableColumns' | 'inverseR'>, row: readonly number[]): number {
  const { estimableColumns, inverseR } = fit;
  let total = 0;
  for (let col = 0; col < estimableColumns.length; col++) {
    let z = 0;
    for (let k = 0; k <= col; k++) z += row[estimableColumns[k]] * inverseR[k][col];
    total += z * z;
  }
  return total;
}

/** Relative size below which a column's new direction counts as zero. */
const RANK_TOLERANCE = 1e-9;

/**
 * Fit y ≈ Xβ by least squares. `design` is row-major (one row per observation).
 */
export function fitLeastSquares(design: readonly (readonly number[])[], response: readonly number[]): LeastSquaresFit {
  const rowCount = response.length;
  const columnCount = rowCount > 0 ? design[0].length : 0;
  const reflectors: { vector: number[]; start: number }[] = [];
  const acceptedColumns: number[] = [];
  const aliased: boolean[] = new Array(columnCount).fill(true);
  // R is built column by column for the accepted columns only.
  const rColumns: number[][] = [];

  const applyReflectors = (column: number[]): void => {
    for (const { vector, start } of reflectors) {
      let dot = 0;
      for (let i = start; i < rowCount; i++) dot += vector[i - start] * column[i];
      for (let i = start; i < rowCount; i++) column[i] -= 2 * dot * vector[i - start];
    }
  };

  for (let j = 0; j < columnCount; j++) {
    const column = design.map((row) => row[j]);
    const originalNorm = Math.sqrt(compensatedSum(column.map((v) => v * v)));
    applyReflectors(column);
    const start = reflectors.length;
    if (start >= rowCount || originalNorm === 0) continue;
    let tailNormSquared = 0;
    for (let i = start; i < rowCount; i++) tailNormSquared += column[i] * column[i];
    const tailNorm = Math.sqrt(tailNormSquared);
    if (tailNorm <= RANK_TOLERANCE * originalNorm) continue;

    // Householder vector v so that (I − 2vvᵀ) maps the tail onto ±‖tail‖·e1.
    const alpha = column[start] > 0 ? -tailNorm : tailNorm;
    const vector = column.slice(start);
    vector[0] -= alpha;
    const vectorNorm = Math.sqrt(vector.reduce((sum, v) => sum + v * v, 0));
    for (let i = 0; i < vector.length; i++) vector[i] /= vectorNorm;
    reflectors.push({ vector, start });
    const rColumn = column.slice(0, start);
    rColumn.push(alpha);
    rColumns.push(rColumn);
    acceptedColumns.push(j);
    aliased[j] = false;
  }

  const rank = acceptedColumns.length;
  const transformed = [...response];
  applyReflectors(transformed);

  // Back-substitution: R β = (Qᵀy)[0..rank).
  const solution = new Array<number>(rank).fill(0);
  for (let i = rank - 1; i >= 0; i--) {
    let sum = transformed[i];
    for (let k = i + 1; k < rank; k++) sum -= rColumns[k][i] * solution[k];
    solution[i] = sum / rColumns[i][i];
  }

  const coefficients: (number | null)[] = new Array(columnCount).fill(null);
  acceptedColumns.forEach((column, index) => {
    coefficients[column] = solution[index];
  });

  const residuals = response.map((y, row) => {
    let fitted = 0;
    acceptedColumns.forEach((column, index) => {
      fitted += design[row][column] * solution[index];
    });
    return y - fitted;
  });
  // The tail of Qᵀy holds the residual vector's length exactly, without cancellation.
  const residualSumOfSquares = compensatedSum(transformed.slice(rank).map((v) => v * v));

  // R⁻¹ by back-substitution, then (XᵀX)⁻¹ = R⁻¹R⁻ᵀ.
  const rInverse: number[][] = Array.from({ length: rank }, () => new Array<number>(rank).fill(0));
  for (let col = 0; col < rank; col++) {
    rInverse[col][col] = 1 / rColumns[col][col];
    for (let row = col - 1; row >= 0; row--) {
      let sum = 0;
      for (let k = row + 1; k <= col; k++) sum += rColumns[k][row] * rInverse[k][col];
      rInverse[row][col] = -sum / rColumns[row][row];
    }
  }
  const unscaledCovariance: number[][] = Array.from({ length: columnCount }, () =>
    new Array<number>(columnCount).fill(0),
  );
  for (let a = 0; a < rank; a++) {
    for (let b = 0; b < rank; b++) {
      let sum = 0;
      for (let k = Math.max(a, b); k < rank; k++) sum += rInverse[a][k] * rInverse[b][k];
      unscaledCovariance[acceptedColumns[a]][acceptedColumns[b]] = sum;
    }
  }

  const factors = { estimableColumns: acceptedColumns, inverseR: rInverse };
  const leverages = design.map((row) => leverageOfRow(factors, row));

  return {
    coefficients,
    aliased,
    rank,
    observationCount: rowCount,
    residualDf: rowCount - rank,
    residualSumOfSquares,
    residuals,
    unscaledCovariance,
    estimableColumns: acceptedColumns,
    inverseR: rInverse,
    leverages,
  };
}
