/**
 * What the formula editor predicts while a formula is typed: the family's fitted surfaces evaluated
 * at the formula's own factors, or the reason there is no number. PURE and cheap (a few dot products
 * per response), so it runs in the browser on every keystroke; no request is made.
 * Each response goes through predictOne() (predict.ts), the same prediction and wording as the API.
 */
import type { BatchComputation } from '@/lib/chemistry';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import { formulaFeatures, type FeatureLine } from './features';
import { predictOne } from './predict';
import type { EditorFamilyModel, FamilyInfo, FamilyModel, ModelFactor, ResponseModel } from './schema';

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

/**
 * One object for all equal values: `one(x)` returns the first value given that serialises like x.
 * React's server payload writes an object it has already written as a reference to the first copy,
 * so responses fitted on the same runs send their design (terms, coding, the inverse R factor) once.
 */
function sharing<T>(): (value: T) => T {
  const seen = new Map<string, T>();
  return (value) => {
    const key = JSON.stringify(value);
    const first = seen.get(key);
    if (first !== undefined) return first;
    seen.set(key, value);
    return value;
  };
}

/**
 * A fitted family model cut to what the editor predicts from (built field by field, so nothing else
 * is sent). Equal parts of the responses' surfaces are one object (see sharing()): responses fitted
 * on the same runs share their design, and all share their terms, so the page sends each once.
 */
export function editorModelOf(model: FamilyModel): EditorFamilyModel {
  const names = sharing<string[]>();
  const ranges = sharing<FamilyModel['responses'][number]['surface']['coding']>();
  const terms = sharing<FamilyModel['responses'][number]['surface']['terms']>();
  const columns = sharing<number[]>();
  const matrices = sharing<number[][]>();
  return {
    family: model.family,
    factors: model.factors,
    responses: model.responses.map((r) => {
      const { basis } = r.surface.fit;
      return {
        key: r.key, name: r.name, unit: r.unit, decimals: r.decimals, newRunWeight: r.newRunWeight, scale: r.scale, libraryKey: r.libraryKey,
        surface: {
          factors: names(r.surface.factors), coding: ranges(r.surface.coding), dataBox: ranges(r.surface.dataBox), terms: terms(r.surface.terms),
          fit: { basis: { ...basis, estimableColumns: columns(basis.estimableColumns), inverseR: matrices(basis.inverseR) } },
        },
      };
    }),
  };
}

/** The editor's predictions for a formula; `computation` is the editor's own chemistry result. */
export function predictForFormula(
  models: readonly EditorFamilyModel[],
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
    const prediction = predictOne(response, point);
    const value: PredictedValue = prediction.inRegion
      ? { inRegion: true, estimate: prediction.estimate, interval: prediction.prediction }
      : { inRegion: false, reason: prediction.reason };
    return { response: { key: response.key, name: response.name, unit: response.unit, decimals: response.decimals, scale: response.scale, libraryKey: response.libraryKey }, value };
  });
  // One reason for the whole panel when every response is refused for the same one.
  const reasons = new Set(responses.map((r) => (r.value.inRegion ? null : r.value.reason)));
  const outside = reasons.size === 1 && !reasons.has(null) ? [...reasons][0] : null;
  return { state: 'ready', family, factors: point, responses, outside };
}
