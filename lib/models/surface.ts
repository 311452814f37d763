/**
 * A response surface over named factors: the fit in coded units, predictions in natural units with
 * the data's region enforced, and the stationary point of a full quadratic.
 *
 * The region the data covers (a prediction outside it is withdrawn, with the reason):
 * 1. the box: every factor between the lowest and highest value in the data;
 * 2. the leverage rule: the point's leverage h₀ = x₀ᵀ(XᵀWX)⁻¹x₀ must not exceed the largest
 *    leverage of the data, h_max. The set h₀ ≤ h_max is the smallest ellipsoid of that shape holding
 *    every run, which flags "hidden extrapolation" between the runs that the box misses
 *    (Montgomery, Peck & Vining, Introduction to Linear Regression Analysis, §3.8 — memory).
 * 3. on request (`hull: true`), the convex hull of the runs (hull.ts): stricter still, it also refuses
 *    the empty corners between runs that the ellipsoid holds.
 */
import {
  buildTerms,
  codePoint,
  decodePoint,
  designRow,
  ModelSpecError,
  rangesFromData,
  validateRanges,
  type FactorRange,
  type ModelKind,
  type ModelTerm,
} from './terms';
import { estimateRow, fitRegression, predictRow, type RegressionFit, type RegressionPrediction } from './regression';
import { symmetricEigen } from './linear-algebra';
import { insideConvexHull } from './hull';

export interface SurfaceRun {
  /** Natural values by factor name. */
  point: Readonly<Record<string, number>>;
  response: number;
  /** Optional weight (see regression.ts: n / s² for a panel mean). */
  weight?: number;
}

export interface SurfaceInput {
  factors: readonly string[];
  kind: ModelKind;
  runs: readonly SurfaceRun[];
  /** Coding ranges (−1…+1); by default the data's own lowest and highest values. */
  coding?: readonly FactorRange[];
}

export interface ResponseSurface {
  factors: string[];
  kind: ModelKind;
  /** The ranges coded −1…+1 (coefficients are per coded unit). */
  coding: FactorRange[];
  /** Lowest and highest value of each factor in the data. */
  dataBox: FactorRange[];
  terms: ModelTerm[];
  fit: RegressionFit;
  /** The runs' coded points, for the convex-hull rule. */
  codedRuns: number[][];
}

/**
 * What a prediction reads of a surface: the coding, the data's box, the terms and the prediction
 * basis. A fitted ResponseSurface is one; the formula editor ships only this much to the browser
 * (the per-run diagnostics stay on the server).
 */
export type PredictionSurface = Pick<ResponseSurface, 'factors' | 'coding' | 'dataBox' | 'terms'> & { fit: Pick<RegressionFit, 'basis'> };

export function fitResponseSurface(input: SurfaceInput): ResponseSurface {
  const factors = [...input.factors];
  if (input.runs.length === 0) throw new ModelSpecError('There are no runs to fit.');
  const dataBox = rangesFromData(factors, input.runs.map((r) => r.point));
  const coding = input.coding
    ? factors.map((name) => {
        const range = input.coding!.find((r) => r.name === name);
        if (!range) throw new ModelSpecError(`No coding range for ${name}.`);
        return { ...range };
      })
    : dataBox.map((r) => ({ ...r }));
  for (const range of dataBox) {
    if (!(range.high > range.low)) throw new ModelSpecError(`${range.name} has the same value in every run, so its effect cannot be estimated.`);
  }
  validateRanges(coding);
  const terms = buildTerms(factors, input.kind);
  const weighted = input.runs.some((r) => r.weight !== undefined);
  if (weighted && input.runs.some((r) => r.weight === undefined)) throw new ModelSpecError('Give a weight for every run or for none.');
  const codedRuns = input.runs.map((r) => codePoint(coding, r.point));
  const fit = fitRegression({
    termNames: terms.map((t) => t.name),
    rows: codedRuns.map((coded) => designRow(terms, coded)),
    response: input.runs.map((r) => r.response),
    weights: weighted ? input.runs.map((r) => r.weight as number) : undefined,
  });
  return { factors, kind: input.kind, coding, dataBox, terms, fit, codedRuns };
}

export type SurfacePrediction =
  | ({ inRegion: true } & RegressionPrediction)
  | { inRegion: false; reason: string; leverage: number | null };

/** Share of a factor's data range allowed past its ends before a point counts as outside (rounding). */
const BOX_TOLERANCE = 1e-9;

/** Six significant digits: enough to read, no binary tails. */
function shortNumber(value: number): string {
  return String(Number(value.toPrecision(6)));
}

function boxViolation(surface: PredictionSurface, point: Readonly<Record<string, number>>): string | null {
  for (const range of surface.dataBox) {
    const value = point[range.name];
    const slack = BOX_TOLERANCE * (range.high - range.low);
    if (value < range.low - slack || value > range.high + slack) {
      return `${range.name} ${shortNumber(value)} is outside the data (${shortNumber(range.low)} to ${shortNumber(range.high)}).`;
    }
  }
  return null;
}

/** Leverage of a natural point under the surface's fit. */
export function leverageAt(surface: PredictionSurface, point: Readonly<Record<string, number>>): number {
  return estimateRow(surface.fit.basis, designRow(surface.terms, codePoint(surface.coding, point))).leverage;
}

export interface RegionRules {
  /** Also require the point to lie in the convex hull of the runs. */
  hull?: boolean;
}

export type RegionCheck =
  | { inRegion: true; estimate: number; leverage: number }
  | { inRegion: false; reason: string; leverage: number | null };

/**
 * The estimate at a natural point if it lies inside the data's region (see the module note), else the
 * reason. The hull rule needs the runs, so it takes a whole ResponseSurface.
 */
export function checkRegion(surface: PredictionSurface & Partial<Pick<ResponseSurface, 'codedRuns'>>, point: Readonly<Record<string, number>>, rules: RegionRules = {}): RegionCheck {
  if (surface.fit.basis.hasAliasedTerms) {
    return { inRegion: false, reason: 'The model has terms the data cannot separate; simplify the model or add runs first.', leverage: null };
  }
  const coded = codePoint(surface.coding, point);
  const { estimate, leverage } = estimateRow(surface.fit.basis, designRow(surface.terms, coded));
  const outsideBox = boxViolation(surface, point);
  if (outsideBox) return { inRegion: false, reason: outsideBox, leverage };
  const limit = surface.fit.basis.maxLeverage;
  if (leverage > limit * (1 + 1e-9)) {
    return {
      inRegion: false,
      reason: `This combination is far from the runs the model learned from (leverage ${leverage.toFixed(2)} above the data's largest, ${limit.toFixed(2)}).`,
      leverage,
    };
  }
  if (rules.hull && !surface.codedRuns) throw new ModelSpecError('The convex-hull rule needs the surface’s runs.');
  if (rules.hull && surface.codedRuns && !insideConvexHull(surface.codedRuns, coded)) {
    return { inRegion: false, reason: 'This combination lies outside the runs the model learned from (beyond their convex hull).', leverage };
  }
  return { inRegion: true, estimate, leverage };
}

/**
 * The prediction at a natural point with its intervals (95 % unless `level` says otherwise), or the
 * reason there is none: outside the box, beyond the leverage rule, or a model with aliased terms
 * (its predictions depend on a choice the data cannot make).
 */
export function predictResponse(
  surface: PredictionSurface & Partial<Pick<ResponseSurface, 'codedRuns'>>,
  point: Readonly<Record<string, number>>,
  options: { level?: number; newRunWeight?: number } & RegionRules = {},
): SurfacePrediction {
  const region = checkRegion(surface, point, options);
  if (!region.inRegion) return region;
  return { inRegion: true, ...predictRow(surface.fit.basis, designRow(surface.terms, codePoint(surface.coding, point)), options) };
}

export type StationaryNature = 'maximum' | 'minimum' | 'saddle' | 'ridge';

export interface StationaryPoint {
  nature: StationaryNature;
  /** Coded and natural location; null for a ridge (no single stationary point). */
  coded: number[] | null;
  natural: Record<string, number> | null;
  /** Fitted response there. */
  estimate: number | null;
  /** Eigenvalues of B (ascending) with their unit eigenvectors (coded units): the canonical form. */
  eigenvalues: number[];
  eigenvectors: number[][];
  /** Whether the point lies inside the data's region (box and leverage rule). */
  inRegion: boolean;
}

/** Eigenvalues smaller than this share of the largest count as zero: a ridge. */
const RIDGE_TOLERANCE = 1e-6;

/**
 * Stationary point of a fitted full quadratic ŷ = b₀ + xᵀb + xᵀBx in coded units
 * (Montgomery, Design and Analysis of Experiments, §11.3; Myers & Montgomery, RSM, ch. 6):
 * x_s = −½B⁻¹b, ŷ_s = b₀ + ½x_sᵀb; all eigenvalues of B negative → maximum, all positive →
 * minimum, mixed signs → saddle; an eigenvalue near zero → a ridge (no single point).
 */
export function stationaryPoint(surface: ResponseSurface): StationaryPoint | null {
  if (surface.kind !== 'full_quadratic' || surface.fit.basis.hasAliasedTerms) return null;
  const k = surface.factors.length;
  const coefficient = (name: string) => surface.fit.terms.find((t) => t.name === name)!.estimate as number;
  const b0 = coefficient('1');
  const b = surface.factors.map((f) => coefficient(f));
  const B = surface.factors.map((fi, i) =>
    surface.factors.map((fj, j) => (i === j ? coefficient(`${fi}²`) : coefficient(i < j ? `${fi}×${fj}` : `${fj}×${fi}`) / 2)),
  );
  const { values, vectors } = symmetricEigen(B);
  const largest = Math.max(...values.map(Math.abs));
  if (largest === 0 || values.some((v) => Math.abs(v) <= RIDGE_TOLERANCE * largest)) {
    return { nature: 'ridge', coded: null, natural: null, estimate: null, eigenvalues: values, eigenvectors: vectors, inRegion: false };
  }
  // x_s = −½ Σ (vₖᵀb / λₖ) vₖ
  const coded = new Array<number>(k).fill(0);
  values.forEach((lambda, m) => {
    const projection = vectors[m].reduce((sum, v, i) => sum + v * b[i], 0);
    vectors[m].forEach((v, i) => {
      coded[i] -= (0.5 * projection * v) / lambda;
    });
  });
  const estimate = b0 + 0.5 * coded.reduce((sum, x, i) => sum + x * b[i], 0);
  const nature: StationaryNature = values.every((v) => v < 0) ? 'maximum' : values.every((v) => v > 0) ? 'minimum' : 'saddle';
  const natural = decodePoint(surface.coding, coded);
  return { nature, coded, natural, estimate, eigenvalues: values, eigenvectors: vectors, inRegion: predictResponse(surface, natural).inRegion };
}
