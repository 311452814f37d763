/**
 * What the formula editor predicts while a formula is typed: the family's fitted surfaces evaluated
 * at the formula's own factors, or the reason there is no number. PURE and cheap (a few dot products
 * per response), so it runs in the browser on every keystroke; no request is made.
 *
 * The region rule (lib/models/surface.ts): a prediction is withdrawn when a factor lies outside the
 * lowest…highest value the trials covered (the box), or when the combination lies farther from the
 * runs than any run itself (the leverage rule). The reasons are said here in the practitioner's words.
 */
import type { BatchComputation } from '@/lib/chemistry';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import { checkRegion, predictResponse, type ResponseSurface } from '@/lib/models';
import { formulaFeatures, type FeatureLine } from './features';
import { FACTOR_INFO, type FamilyInfo, type FamilyModel, type ModelFactor, type ResponseModel } from './schema';

export type PredictedValue =
  | { inRegion: true; estimate: number; interval: { low: number; high: number } | null }
  | { inRegion: false; reason: string };

export interface ResponsePredictionView {
  response: Pick<ResponseModel, 'key' | 'name' | 'unit' | 'decimals' | 'scale' | 'libraryKey'>;
  value: PredictedValue;
}

export type EditorPrediction =
  | { state: 'no_formula' }
  | { state: 'no_model'; family: FamilyInfo | null }
  | { state: 'ready'; family: FamilyInfo; factors: Partial<Record<ModelFactor, number>>; responses: ResponsePredictionView[]; outside: string | null };

/** A factor value in its unit, with the factor's own decimals: "0.95 % of finished product". */
export function factorText(factor: ModelFactor, value: number): string {
  const info = FACTOR_INFO[factor];
  return `${value.toFixed(info.decimals)} ${info.unit}`;
}

function isModelFactor(name: string): name is ModelFactor {
  return name in FACTOR_INFO;
}

/** Why a point has no prediction, in words: which factor leaves the trials' range, or which rule refuses it. */
export function outsideReason(surface: ResponseSurface, point: Readonly<Record<string, number>>): string | null {
  const region = checkRegion(surface, point);
  if (region.inRegion) return null;
  if (region.leverage === null) return 'The trials so far cannot tell this model’s effects apart, so it predicts nothing yet; more varied trials are needed.';
  for (const range of surface.dataBox) {
    const value = point[range.name];
    const slack = 1e-9 * (range.high - range.low);
    if ((value < range.low - slack || value > range.high + slack) && isModelFactor(range.name)) {
      const info = FACTOR_INFO[range.name];
      const side = value < range.low ? 'below' : 'above';
      return `${info.name} at ${factorText(range.name, value)} is ${side} anything the trials covered (${range.low.toFixed(info.decimals)} to ${factorText(range.name, range.high)}), so the model cannot say.`;
    }
  }
  return 'Each factor is within what the trials covered, but not in this combination: it is farther from the trials than any of them is from the rest (leverage test), so the model cannot say.';
}

/** The editor's predictions for a formula; `computation` is the editor's own chemistry result. */
export function predictForFormula(
  models: readonly FamilyModel[],
  settings: FormulaSettingsInput,
  lines: readonly FeatureLine[],
  computation: BatchComputation,
): EditorPrediction {
  const outcome = formulaFeatures(settings, lines, computation);
  if (!outcome.ok) return { state: 'no_formula' };
  const family = outcome.features.family;
  const model = family ? models.find((m) => m.family.slug === family.slug) : undefined;
  if (!family || !model || model.responses.length === 0) return { state: 'no_model', family };
  const point = Object.fromEntries(model.factors.map((f) => [f, outcome.features.factors[f]]));
  const responses = model.responses.map((response): ResponsePredictionView => {
    const prediction = predictResponse(response.surface, point, response.newRunWeight === null ? {} : { newRunWeight: response.newRunWeight });
    const value: PredictedValue = prediction.inRegion
      ? { inRegion: true, estimate: prediction.estimate, interval: prediction.prediction }
      : { inRegion: false, reason: outsideReason(response.surface, point) ?? 'Outside what the trials covered.' };
    return { response: { key: response.key, name: response.name, unit: response.unit, decimals: response.decimals, scale: response.scale, libraryKey: response.libraryKey }, value };
  });
  // One reason for the whole panel when every response is refused for the same one.
  const reasons = new Set(responses.map((r) => (r.value.inRegion ? null : r.value.reason)));
  const outside = reasons.size === 1 && !reasons.has(null) ? [...reasons][0] : null;
  return { state: 'ready', family, factors: point, responses, outside };
}
