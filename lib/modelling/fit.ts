/**
 * From a data set to fitted response surfaces: the default model per response, the weights of
 * sensory means, and the model's history as trials were added. PURE (lib/models underneath), so
 * the page, the API and the tests share it; fitting on read is cheap (see `npm run bench`).
 *
 * Weighting. A sensory variant mean is known as well as its panel allows: its variance is s²/n
 * (the tasters' spread over the panel size). Each run is weighted w = n / s², so a mean from a
 * larger or more agreeing panel pulls the surface harder (lib/models/regression.ts). Two guards:
 * s² is floored at a quarter of the pooled within-panel variance (a panel that happened to agree
 * perfectly would otherwise get an infinite weight), and a mean of a single taster takes the pooled
 * variance. Lab measures (the mean of a variant's cooks) are unweighted: most variants are cooked
 * once, so there is no spread of their own to weigh them by.
 */
import { centrePointCurvature, fitResponseSurface, ModelSpecError, type CurvatureTest, type ModelKind, type ResponseSurface, type SurfaceRun } from '@/lib/models';
import {
  DEFAULT_MODEL_FACTORS,
  FACTOR_INFO,
  MODEL_KIND_LABELS,
  type Dataset,
  type DatasetRow,
  type FamilyInfo,
  type FamilyModel,
  type ModelFactor,
  type ModelKindKey,
  type ResponseInfo,
  type ResponseKey,
  type ResponseModel,
  type UnfittedResponse,
} from './schema';

/** Residual degrees of freedom a default model keeps, so its error estimate means something. */
export const MIN_RESIDUAL_DF = 3;

const KINDS_BY_SIZE: readonly ModelKind[] = ['full_quadratic', 'two_factor_interactions', 'main_effects'];

export function termCount(factorCount: number, kind: ModelKind): number {
  const k = factorCount;
  return kind === 'main_effects' ? 1 + k : kind === 'two_factor_interactions' ? 1 + k + (k * (k - 1)) / 2 : 1 + 2 * k + (k * (k - 1)) / 2;
}

/** Runs a model needs: its terms plus the residual degrees of freedom kept. */
export function runsNeeded(factorCount: number, kind: ModelKind): number {
  return termCount(factorCount, kind) + MIN_RESIDUAL_DF;
}

export interface WeightedRuns {
  runs: SurfaceRun[];
  /** Weight of a new typical panel mean; null when the runs are unweighted. */
  newRunWeight: number | null;
  weighting: string;
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

/** The runs of one response over the chosen factors, weighted as the module note says. */
export function runsFor(rows: readonly DatasetRow[], response: ResponseInfo, factors: readonly ModelFactor[]): WeightedRuns {
  const withValue = rows.filter((r) => r.responses[response.key] !== undefined);
  const point = (row: DatasetRow) => Object.fromEntries(factors.map((f) => [f, row.factors[f]]));
  const unweighted = (weighting: string): WeightedRuns => ({
    runs: withValue.map((row) => ({ point: point(row), response: row.responses[response.key]!.mean })),
    newRunWeight: null,
    weighting,
  });
  if (response.kind === 'lab') return unweighted('Each variant’s mean of its cooks counts once.');
  let pooledSquares = 0;
  let pooledDf = 0;
  for (const row of withValue) {
    const value = row.responses[response.key]!;
    if (value.sd !== null && value.n >= 2) {
      pooledSquares += (value.n - 1) * value.sd * value.sd;
      pooledDf += value.n - 1;
    }
  }
  const pooled = pooledDf > 0 ? pooledSquares / pooledDf : 0;
  if (!(pooled > 0)) return unweighted('Each variant’s panel mean counts once (the panels give no spread to weigh them by).');
  const runs = withValue.map((row) => {
    const value = row.responses[response.key]!;
    const variance = value.sd !== null && value.n >= 2 ? Math.max(value.sd * value.sd, pooled / 4) : pooled;
    return { point: point(row), response: value.mean, weight: value.n / variance };
  });
  const typicalPanel = median(withValue.map((r) => r.responses[response.key]!.n));
  return {
    runs,
    newRunWeight: typicalPanel / pooled,
    weighting: 'Each panel mean is weighted by its panel size over the spread of its tasters’ scores (n / s²), so a mean from a larger or more agreeing panel counts more.',
  };
}

/** Factors that vary in the runs (a factor held constant has no effect to estimate). */
export function varyingFactors(rows: readonly DatasetRow[], factors: readonly ModelFactor[]): ModelFactor[] {
  return factors.filter((f) => {
    const values = rows.map((r) => r.factors[f]);
    return values.length > 0 && Math.max(...values) - Math.min(...values) > 1e-9 * Math.max(1, Math.abs(values[0]));
  });
}

export type FitResult = { ok: true; model: ResponseModel } | { ok: false; unfitted: UnfittedResponse };

/**
 * The model of one response: `kind` when given, else the largest of full quadratic, two-factor
 * interactions and main effects that the runs allow (its terms plus three residual degrees of
 * freedom) and that the data can separate (no aliased term).
 */
export function fitResponse(rows: readonly DatasetRow[], response: ResponseInfo, factors: readonly ModelFactor[], kind?: ModelKindKey): FitResult {
  const weighted = runsFor(rows, response, factors);
  const n = weighted.runs.length;
  const unfitted = (reason: string, needed: number): FitResult => ({ ok: false, unfitted: { key: response.key, name: response.name, reason, runsNeeded: needed } });
  const simplest = kind ?? 'main_effects';
  if (n < runsNeeded(factors.length, simplest)) {
    const needed = runsNeeded(factors.length, simplest) - n;
    return unfitted(
      `${n} variant${n === 1 ? '' : 's'} with this response; a ${MODEL_KIND_LABELS[simplest].toLowerCase()} model in ${factors.length} factor${factors.length === 1 ? '' : 's'} needs ${needed} more.`,
      needed,
    );
  }
  const candidates = kind ? [kind] : KINDS_BY_SIZE.filter((k) => n >= runsNeeded(factors.length, k));
  let lastProblem = '';
  for (const candidate of candidates) {
    try {
      const surface = fitResponseSurface({ factors, kind: candidate, runs: weighted.runs });
      if (!kind && surface.fit.basis.hasAliasedTerms && candidate !== 'main_effects') continue;
      return {
        ok: true,
        model: {
          key: response.key,
          name: response.name,
          unit: response.unit,
          kind: response.kind,
          decimals: response.decimals,
          libraryKey: response.libraryKey,
          scale: response.scale,
          surface,
          weighting: weighted.weighting,
          newRunWeight: weighted.newRunWeight,
        },
      };
    } catch (err) {
      if (!(err instanceof ModelSpecError)) throw err;
      lastProblem = err.message;
    }
  }
  return unfitted(lastProblem || 'The runs cannot support this model.', 0);
}

/** Every response of the data set fitted over the factors (by default the ones that vary). */
export function fitFamilyModel(
  dataset: Dataset & { family: FamilyInfo },
  options: { factors?: readonly ModelFactor[]; kind?: ModelKindKey; now?: Date } = {},
): FamilyModel {
  const factors = options.factors ? [...options.factors] : varyingFactors(dataset.rows, DEFAULT_MODEL_FACTORS);
  const responses: ResponseModel[] = [];
  const unfitted: UnfittedResponse[] = [];
  for (const response of dataset.responses) {
    if (factors.length === 0) {
      unfitted.push({ key: response.key, name: response.name, reason: 'No factor varies between the variants.', runsNeeded: 0 });
      continue;
    }
    const result = fitResponse(dataset.rows, response, factors, options.kind);
    if (result.ok) responses.push(result.model);
    else unfitted.push(result.unfitted);
  }
  return {
    family: dataset.family, factors, runs: dataset.rows.length, responses, unfitted,
    fruitContent: factors.length ? fruitContentSurface(dataset.rows, factors) : null,
    fittedAt: (options.now ?? new Date()).toISOString(),
  };
}

/** Fruit per 1000 g over the factors: computed from each formula, so the largest model the runs carry fits it near exactly. */
function fruitContentSurface(rows: readonly DatasetRow[], factors: readonly ModelFactor[]): ResponseSurface | null {
  const runs = rows.map((row) => ({ point: Object.fromEntries(factors.map((f) => [f, row.factors[f]])), response: row.factors.fruitPer1000g }));
  for (const kind of KINDS_BY_SIZE) {
    if (runs.length < runsNeeded(factors.length, kind)) continue;
    try {
      const surface = fitResponseSurface({ factors, kind, runs });
      if (!surface.fit.basis.hasAliasedTerms) return surface;
    } catch (err) {
      if (!(err instanceof ModelSpecError)) throw err;
    }
  }
  return null;
}

/** How close to the middle (coded) a replicated point must sit to count as the centre point. */
const CENTRE_TOLERANCE = 0.2;
/** How far out (coded, in every factor) a run must sit to count as a corner. */
const CORNER_THRESHOLD = 0.5;

/**
 * The curvature test from centre points (lib/models centrePointCurvature; Montgomery, Design and
 * Analysis of Experiments, §6.8) on pooled trials. They rarely sit exactly on a grid (pectin % of the
 * finished product moves with the solids), so the centre is the replicated point nearest the middle
 * within 0.2 coded units in every factor, and the corners are the runs at least 0.5 out in every
 * factor, taken as ±1; other runs stay out of this test. Weighted with the model's weights, like the
 * report's other ANOVA rows. Null without a replicated centre or without corners.
 */
export function curvatureTest(surface: ResponseSurface): CurvatureTest | null {
  const y = surface.fit.fitted.map((f, i) => f + surface.fit.residuals[i]);
  const groups = new Map<string, number[]>();
  surface.codedRuns.forEach((coded, i) => {
    if (coded.some((x) => Math.abs(x) > CENTRE_TOLERANCE)) return;
    const key = coded.map((x) => x.toPrecision(10)).join('|');
    groups.set(key, [...(groups.get(key) ?? []), i]);
  });
  const centre = [...groups.values()].filter((g) => g.length >= 2).sort((a, b) => b.length - a.length)[0];
  const corners = surface.codedRuns.map((coded, i) => (coded.every((x) => Math.abs(x) >= CORNER_THRESHOLD) ? i : -1)).filter((i) => i >= 0);
  if (!centre || corners.length === 0) return null;
  const weight = (i: number) => (surface.fit.weights ? { weight: surface.fit.weights[i] } : {});
  return centrePointCurvature([
    ...centre.map((i) => ({ coded: surface.codedRuns[i].map(() => 0), response: y[i], ...weight(i) })),
    ...corners.map((i) => ({ coded: surface.codedRuns[i].map((x) => Math.sign(x)), response: y[i], ...weight(i) })),
  ]);
}

export interface HistoryStep {
  /** The trial added at this step. */
  trialCode: string;
  trialTitle: string;
  trialDate: string;
  runs: number;
  kind: ModelKindKey | null;
  rSquared: number | null;
  adjustedRSquared: number | null;
  predictedRSquared: number | null;
  /** Why there is no fit at this step. */
  note: string | null;
}

/** The model of one response refitted as each trial (in date order) joined the data. */
export function modelHistory(rows: readonly DatasetRow[], response: ResponseInfo, factors: readonly ModelFactor[], kind?: ModelKindKey): HistoryStep[] {
  const trials = [...new Map(rows.map((r) => [r.trialId, r])).values()].sort(
    (a, b) => a.trialDate.localeCompare(b.trialDate) || a.trialCode.localeCompare(b.trialCode),
  );
  const included = new Set<string>();
  return trials.map((trial) => {
    included.add(trial.trialId);
    const subset = rows.filter((r) => included.has(r.trialId));
    const varying = factors.filter((f) => varyingFactors(subset, [f]).length === 1);
    const base = { trialCode: trial.trialCode, trialTitle: trial.trialTitle, trialDate: trial.trialDate };
    const runs = subset.filter((r) => r.responses[response.key] !== undefined).length;
    if (varying.length < factors.length) {
      return { ...base, runs, kind: null, rSquared: null, adjustedRSquared: null, predictedRSquared: null, note: `${factors.filter((f) => !varying.includes(f)).map((f) => FACTOR_INFO[f].name).join(', ')} did not vary yet.` };
    }
    const result = fitResponse(subset, response, factors, kind);
    if (!result.ok) return { ...base, runs, kind: null, rSquared: null, adjustedRSquared: null, predictedRSquared: null, note: result.unfitted.reason };
    const fit = result.model.surface.fit;
    return { ...base, runs, kind: result.model.surface.kind, rSquared: fit.rSquared, adjustedRSquared: fit.adjustedRSquared, predictedRSquared: fit.predictedRSquared, note: null };
  });
}

/** A response's info by key, or undefined. */
export function responseOf(dataset: Pick<Dataset, 'responses'>, key: ResponseKey): ResponseInfo | undefined {
  return dataset.responses.find((r) => r.key === key);
}
