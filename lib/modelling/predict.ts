/**
 * A family model put to use at a point: THE prediction of one response (estimate and 95 % intervals)
 * or, outside the data, the reason in the practitioner's words. The formula editor (per keystroke,
 * in the browser), the predict endpoint and the optimiser's proposals all call predictOne(). PURE.
 *
 * The region rule (lib/models/surface.ts): a prediction is withdrawn when a factor lies outside the
 * lowest…highest value the trials covered (the box), or when the combination lies farther from the
 * runs than any run itself (the leverage rule).
 */
import { checkRegion, predictResponse, type Interval, type PredictionSurface } from '@/lib/models';
import { FACTOR_INFO, LAB_RESPONSE_INFO, LAB_RESPONSES, inFactorWords, type FactorValues, type FamilyModel, type ModelFactor, type PredictionModel, type ResponseKey } from './schema';

export type ResponsePrediction =
  | { key: ResponseKey; name: string; unit: string; decimals: number; inRegion: true; estimate: number; confidence: Interval | null; prediction: Interval | null; leverage: number }
  | { key: ResponseKey; name: string; unit: string; decimals: number; inRegion: false; reason: string };

/** A factor value in its unit, with the factor's own decimals: "0.95 % of finished product". */
export function factorText(factor: ModelFactor, value: number): string {
  const info = FACTOR_INFO[factor];
  return `${value.toFixed(info.decimals)} ${info.unit}`;
}

function isModelFactor(name: string): name is ModelFactor {
  return name in FACTOR_INFO;
}

/** Why a point has no prediction, in words: which factor leaves the trials' range, or which rule refuses it. */
export function outsideReason(surface: PredictionSurface, point: Readonly<Record<string, number>>): string | null {
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

/** The estimate of a surface at a point inside the data; NaN outside it or without a surface (for constraints). */
export function estimateAt(surface: PredictionSurface | null, point: Readonly<Record<string, number>>): number {
  if (!surface) return Number.NaN;
  const check = checkRegion(surface, point);
  return check.inRegion ? check.estimate : Number.NaN;
}

/** One response at a natural point, with 95 % intervals (a new variant's panel mean for sensory responses), or the reason there is none. */
export function predictOne(model: PredictionModel, point: Partial<FactorValues>): ResponsePrediction {
  const base = { key: model.key, name: model.name, unit: model.unit, decimals: model.decimals };
  const missing = model.surface.factors.find((f) => !Number.isFinite(point[f as ModelFactor]));
  if (missing) return { ...base, inRegion: false, reason: `${FACTOR_INFO[missing as ModelFactor].name} is not known for this formula.` };
  const natural = point as Record<string, number>;
  const prediction = predictResponse(model.surface, natural, model.newRunWeight ? { newRunWeight: model.newRunWeight } : {});
  if (!prediction.inRegion) return { ...base, inRegion: false, reason: outsideReason(model.surface, natural) ?? inFactorWords(prediction.reason) };
  return { ...base, inRegion: true, estimate: prediction.estimate, confidence: prediction.confidence, prediction: prediction.prediction, leverage: prediction.leverage };
}

/** The values a response can take: a sensory attribute's scale, a lab measure's own range. */
export function responseRange(response: { key: ResponseKey; scale: { min: number; max: number } | null }): { min: number; max: number } | null {
  if (response.scale) return response.scale;
  const lab = LAB_RESPONSES.find((k) => response.key === `lab:${k}`);
  return lab ? LAB_RESPONSE_INFO[lab].range : null;
}

/**
 * A prediction interval as a person reads it: "4.1 to 6.8", or cut where the response cannot go
 * ("0.00 to 1.62, cut at the end of the scale" for −0.08 to 1.62 on a 0–2 scale). The API keeps the
 * statistical interval; only the words on screen are cut.
 */
export function intervalText(interval: Interval, range: { min: number; max: number } | null, decimals: number): string {
  const low = range ? Math.max(range.min, interval.low) : interval.low;
  const high = range ? Math.min(range.max, interval.high) : interval.high;
  const cut = low !== interval.low || high !== interval.high;
  return `${low.toFixed(decimals)} to ${high.toFixed(decimals)}${cut ? ', cut at the end of the scale' : ''}`;
}

/** Every modelled response at a point. */
export function predictFamily(model: FamilyModel, point: Partial<FactorValues>): ResponsePrediction[] {
  return model.responses.map((r) => predictOne(r, point));
}
