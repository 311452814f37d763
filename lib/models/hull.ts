/**
 * Is a point inside the convex hull of the data points? It is exactly when some λ ≥ 0 with Σλᵢ = 1
 * gives Σλᵢ·xᵢ = x₀ — a linear feasibility problem, solved here by phase I of the simplex method
 * (minimise the sum of artificial variables; Bland's rule, so it cannot cycle). Stricter than the
 * leverage rule: it refuses the empty corners between runs that the leverage ellipsoid still holds.
 */

/** Feasibility tolerance on coded values (the points are of order 1). */
const TOLERANCE = 1e-9;

export function insideConvexHull(points: ReadonlyArray<readonly number[]>, target: readonly number[]): boolean {
  const n = points.length;
  if (n === 0) return false;
  const k = target.length;
  const m = k + 1;
  // Rows: one per coordinate and one for Σλ = 1; columns: λ₁…λₙ, artificials a₁…aₘ, right-hand side.
  const width = n + m + 1;
  const tableau: number[][] = [];
  for (let r = 0; r < m; r++) {
    const row = new Array<number>(width).fill(0);
    for (let i = 0; i < n; i++) row[i] = r < k ? points[i][r] : 1;
    row[n + r] = 1;
    row[width - 1] = r < k ? target[r] : 1;
    if (row[width - 1] < 0) for (let c = 0; c < width; c++) if (c < n || c === width - 1) row[c] = -row[c];
    tableau.push(row);
  }
  const basis = Array.from({ length: m }, (_, r) => n + r);
  // Reduced costs of "minimise Σ a": c_j − c_Bᵀ B⁻¹ A_j, kept as an extra row.
  const cost = new Array<number>(width).fill(0);
  for (let c = 0; c < width; c++) {
    if (c >= n && c < n + m) continue;
    for (let r = 0; r < m; r++) cost[c] -= tableau[r][c];
  }
  for (let iteration = 0; iteration < 50 * (n + m); iteration++) {
    const entering = cost.findIndex((value, c) => c < n + m && value < -TOLERANCE);
    if (entering < 0) break;
    let leaving = -1;
    let bestRatio = Infinity;
    for (let r = 0; r < m; r++) {
      const a = tableau[r][entering];
      if (a <= TOLERANCE) continue;
      const ratio = tableau[r][width - 1] / a;
      if (ratio < bestRatio - TOLERANCE || (Math.abs(ratio - bestRatio) <= TOLERANCE && basis[r] < basis[leaving])) {
        bestRatio = ratio;
        leaving = r;
      }
    }
    if (leaving < 0) break;
    const pivot = tableau[leaving][entering];
    for (let c = 0; c < width; c++) tableau[leaving][c] /= pivot;
    for (let r = 0; r < m; r++) {
      if (r === leaving) continue;
      const factor = tableau[r][entering];
      if (factor !== 0) for (let c = 0; c < width; c++) tableau[r][c] -= factor * tableau[leaving][c];
    }
    const factor = cost[entering];
    for (let c = 0; c < width; c++) cost[c] -= factor * tableau[leaving][c];
    basis[leaving] = entering;
  }
  // The remaining infeasibility is Σ of the artificial variables still in the basis.
  const infeasibility = basis.reduce((sum, column, r) => (column >= n ? sum + tableau[r][width - 1] : sum), 0);
  return infeasibility <= TOLERANCE * Math.max(1, ...target.map(Math.abs));
}
