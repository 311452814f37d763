/**
 * A family model put to use: predictions at a point (what the editor shows while a formula is typed)
 * and proposals for the best formula inside the data (the optimiser). PURE: the editor runs
 * predictFamily() in the browser on the model it was sent.
 */
import { ModelSpecError, optimise, predictResponse, checkRegion, windowConstraint, type Constraint, type Goal, type Interval } from '@/lib/models';
import { ValidationFailed } from '@/lib/errors';
import { FACTOR_INFO, inFactorWords, type FactorValues, type FamilyModel, type ModelFactor, type OptimiseRequest, type ResponseKey, type ResponseModel } from './schema';

export type ResponsePrediction =
  | { key: ResponseKey; name: string; unit: string; decimals: number; inRegion: true; estimate: number; confidence: Interval | null; prediction: Interval | null; leverage: number }
  | { key: ResponseKey; name: string; unit: string; decimals: number; inRegion: false; reason: string };

/** One response at a natural point, with 95 % intervals (a new variant's panel mean for sensory responses), or the reason there is none. */
export function predictOne(model: ResponseModel, point: Partial<FactorValues>): ResponsePrediction {
  const base = { key: model.key, name: model.name, unit: model.unit, decimals: model.decimals };
  const missing = model.surface.factors.find((f) => !Number.isFinite(point[f as ModelFactor]));
  if (missing) return { ...base, inRegion: false, reason: `${FACTOR_INFO[missing as ModelFactor].name} is not known for this formula.` };
  const prediction = predictResponse(model.surface, point as Record<string, number>, model.newRunWeight ? { newRunWeight: model.newRunWeight } : {});
  if (!prediction.inRegion) return { ...base, inRegion: false, reason: inFactorWords(prediction.reason) };
  return { ...base, inRegion: true, estimate: prediction.estimate, confidence: prediction.confidence, prediction: prediction.prediction, leverage: prediction.leverage };
}

/** Every modelled response at a point. */
export function predictFamily(model: FamilyModel, point: Partial<FactorValues>): ResponsePrediction[] {
  return model.responses.map((r) => predictOne(r, point));
}

export interface FamilyProposal {
  point: Partial<FactorValues>;
  /** Fruit per 1000 g of finished product at the point (from the fruit-content surface), when known. */
  fruitPer1000g: number | null;
  desirability: number;
  /** Every modelled response at the point, goals first. */
  responses: ResponsePrediction[];
}

export interface FamilyOptimum {
  proposals: FamilyProposal[];
  searchBox: Array<{ name: ModelFactor; low: number; high: number }>;
  message: string | null;
}

function estimateAt(surface: FamilyModel['fruitContent'], point: Readonly<Record<string, number>>): number {
  if (!surface) return Number.NaN;
  const check = checkRegion(surface, point);
  return check.inRegion ? check.estimate : Number.NaN;
}

/**
 * The best settings for the stated goals (Derringer–Suich desirability, lib/models/optimise.ts)
 * within the bounds asked for and the data's region, meeting the legal fruit minimum and the pH
 * window. Bad requests (a factor or a response the model lacks, a goal whose limits do not nest)
 * are ValidationFailed.
 */
export function optimiseFamily(model: FamilyModel, request: OptimiseRequest): FamilyOptimum {
  const ranges = request.factors.filter((f) => model.factors.includes(f.name));
  const unknownFactor = request.factors.find((f) => !model.factors.includes(f.name));
  if (unknownFactor) throw new ValidationFailed(`${FACTOR_INFO[unknownFactor.name].name} is not a factor of this model.`, { factors: [`${FACTOR_INFO[unknownFactor.name].name} is not a factor of this model.`] });
  const missing = model.factors.find((f) => !ranges.some((r) => r.name === f));
  if (missing) throw new ValidationFailed(`Give a range for ${FACTOR_INFO[missing].name.toLowerCase()}.`, { factors: [`Give a range for ${FACTOR_INFO[missing].name.toLowerCase()}.`] });
  const goals = request.goals.map((g, i) => {
    const response = model.responses.find((r) => r.key === g.response);
    if (!response) throw new ValidationFailed('There is no model of that response yet.', { [`goals.${i}.response`]: ['There is no model of that response yet.'] });
    return { name: response.name, surface: response.surface, goal: g.goal as Goal, importance: g.importance };
  });
  const constraints: Constraint[] = [];
  const fruitMinimum = request.constraints?.fruitMinimumPer1000g;
  if (fruitMinimum !== undefined) {
    if (!model.fruitContent) throw new ValidationFailed('The fruit content cannot be computed over this model’s factors.', { 'constraints.fruitMinimumPer1000g': ['The fruit content cannot be computed over this model’s factors.'] });
    constraints.push(windowConstraint('fruit minimum', (p) => estimateAt(model.fruitContent, p), { low: fruitMinimum }));
  }
  const ph = request.constraints?.ph;
  if (ph) {
    if (!(ph.high >= ph.low)) throw new ValidationFailed('The lowest pH must not be above the highest.', { 'constraints.ph': ['The lowest pH must not be above the highest.'] });
    const phModel = model.responses.find((r) => r.key === 'lab:measuredPh');
    if (!phModel) throw new ValidationFailed('There is no model of measured pH yet, so a pH window cannot be kept.', { 'constraints.ph': ['There is no model of measured pH yet.'] });
    constraints.push(windowConstraint('pH window', (p) => estimateAt(phModel.surface, p), { low: ph.low, high: ph.high }));
  }
  let result;
  try {
    result = optimise({ factors: ranges, goals, constraints, proposals: request.proposals ?? 3 });
  } catch (err) {
    if (err instanceof ModelSpecError) throw new ValidationFailed(inFactorWords(err.message), { goals: [inFactorWords(err.message)] });
    throw err;
  }
  const goalKeys = request.goals.map((g) => g.response);
  const ordered = [...model.responses].sort((a, b) => Number(goalKeys.includes(b.key)) - Number(goalKeys.includes(a.key)));
  return {
    proposals: result.proposals.map((p) => {
      const point = p.point as Partial<FactorValues>;
      const fruit = estimateAt(model.fruitContent, p.point);
      return { point, fruitPer1000g: Number.isFinite(fruit) ? fruit : null, desirability: p.desirability, responses: ordered.map((r) => predictOne(r, point)) };
    }),
    searchBox: result.searchBox.map((r) => ({ name: r.name as ModelFactor, low: r.low, high: r.high })),
    message: result.message ? inFactorWords(result.message) : null,
  };
}
