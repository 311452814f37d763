/**
 * THE optimisation over a family model, shared by the optimise endpoint and the Propose screen:
 * goals → Derringer–Suich desirability, the fruit minimum and the pH window as constraints, and the
 * call into lib/models optimise(). Bad requests (a factor or response the model lacks, limits that do
 * not nest) are ValidationFailed. PURE: the Propose screen runs it in the browser.
 *
 * Where the fruit content comes from is the caller's: with a base formula (the screen) it is the
 * exact mass balance solved at the point (proposals.ts); without one (the API) the family's fitted
 * fruit-content surface, near-exact because fruit content is computed, not measured.
 */
import { ModelSpecError, optimise, windowConstraint, type Constraint, type Goal, type OptimiseResult } from '@/lib/models';
import { ValidationFailed } from '@/lib/errors';
import { estimateAt, predictOne, type ResponsePrediction } from './predict';
import { FACTOR_INFO, inFactorWords, type FactorValues, type FamilyModel, type ModelFactor, type OptimiseRequest, type ResponseKey, type ResponseModel } from './schema';

export interface SearchRequest {
  factors: Array<{ name: ModelFactor; low: number; high: number }>;
  goals: Array<{ response: ResponseKey; goal: Goal; importance?: number }>;
  /** The legal fruit minimum, g per 1000 g of finished product. */
  fruitMinimumPer1000g?: number;
  /** The window for the model of measured pH. */
  ph?: { low: number; high: number };
  proposals?: number;
}

export interface SearchSources {
  /** Fruit per 1000 g of finished product at a point (NaN where unknown); null when it cannot be computed. */
  fruitPer1000g: ((point: Readonly<Record<string, number>>) => number) | null;
  /** Further constraints of the caller (the screen's "the base formula can be moved there"). */
  constraints?: Constraint[];
  /**
   * A pH window without a pH model: the API refuses (a client must not read proposals as pH-safe);
   * the screen goes on and says so beside the proposals, where the developer sees it.
   */
  withoutPhModel: 'refuse' | 'note';
}

/** What a base formula gives a search (proposals.ts baseFormulaSources): exact fruit content, "can be made", and a cost ceiling when asked. */
export interface BaseSources {
  fruitPer1000g: (point: Readonly<Record<string, number>>) => number;
  constraints: Constraint[];
  /** Present when the search holds a cost ceiling per jar. */
  cost?: {
    currency: string;
    asOf: string;
    packFormat: string;
    ceilingPerJarMinor: number;
    /** The complete cost per jar at a point, in minor units; null where it is not known. */
    perJarAt: (point: Readonly<Record<string, number>>) => number | null;
  };
}

export interface FamilySearch {
  result: OptimiseResult;
  /** The response model of each goal, in the goals' order. */
  goalModels: ResponseModel[];
  phModel: ResponseModel | null;
  /** What the search could not hold to, in words. */
  notes: string[];
}

export const PH_KEY: ResponseKey = 'lab:measuredPh';

function refuse(field: string, message: string): never {
  throw new ValidationFailed(message, { [field]: [message] });
}

/** The best settings for the goals inside the data's region and the bounds asked for, meeting the constraints. */
export function searchFamily(model: FamilyModel, request: SearchRequest, sources: SearchSources): FamilySearch {
  for (const f of request.factors) {
    const name = FACTOR_INFO[f.name].name;
    if (!model.factors.includes(f.name)) refuse('factors', `${name} is not a factor of this model.`);
    // Equal bounds are allowed: they hold that factor fixed.
    if (!Number.isFinite(f.low) || !Number.isFinite(f.high) || !(f.high >= f.low)) refuse('factors', `The lowest ${name.toLowerCase()} must not be above the highest.`);
  }
  const missing = model.factors.find((f) => !request.factors.some((r) => r.name === f));
  if (missing) refuse('factors', `Give a range for ${FACTOR_INFO[missing].name.toLowerCase()}.`);
  const goalModels = request.goals.map((g, i) => {
    const response = model.responses.find((r) => r.key === g.response);
    if (!response) refuse(`goals.${i}.response`, 'There is no model of that response yet.');
    if (g.importance !== undefined && !(Number.isFinite(g.importance) && g.importance > 0)) refuse(`goals.${i}.importance`, `The importance of ${response.name} must be above 0.`);
    return response;
  });
  const goals = request.goals.map((g, i) => ({ name: goalModels[i].name, surface: goalModels[i].surface, goal: g.goal, importance: g.importance }));
  const constraints: Constraint[] = [...(sources.constraints ?? [])];
  const notes: string[] = [];
  if (request.fruitMinimumPer1000g !== undefined) {
    const fruitOf = sources.fruitPer1000g;
    if (!fruitOf) refuse('constraints.fruitMinimumPer1000g', 'The fruit content cannot be computed over this model’s factors.');
    constraints.push(windowConstraint(`fruit minimum (${request.fruitMinimumPer1000g} g per 1000 g)`, fruitOf, { low: request.fruitMinimumPer1000g }));
  }
  const phModel = model.responses.find((r) => r.key === PH_KEY) ?? null;
  const ph = request.ph;
  if (ph) {
    // A window of no width can never be met by a continuous estimate.
    if (!(ph.high > ph.low)) refuse('constraints.ph', 'The lowest pH must be below the highest.');
    if (phModel) constraints.push(windowConstraint(`pH window (${ph.low}–${ph.high})`, (p) => estimateAt(phModel.surface, p), ph));
    else if (sources.withoutPhModel === 'refuse') refuse('constraints.ph', 'There is no model of measured pH yet, so a pH window cannot be kept.');
    else notes.push('This family has no model of measured pH yet, so the pH window could not be held to: measure the pH of every cook of the proposal.');
  }
  let result: OptimiseResult;
  try {
    result = optimise({ factors: request.factors, goals, constraints, proposals: request.proposals ?? 3 });
  } catch (err) {
    if (err instanceof ModelSpecError) refuse('goals', inFactorWords(err.message));
    throw err;
  }
  return { result: { ...result, message: result.message ? inFactorWords(result.message) : null }, goalModels, phModel, notes };
}

/* ---------- the API's answer ---------- */

export interface FamilyProposal {
  point: Partial<FactorValues>;
  /** Fruit per 1000 g of finished product at the point (base formula's mass balance, else the fruit-content surface), when known. */
  fruitPer1000g: number | null;
  /** With a cost ceiling: the base formula's cost per jar at the point, in minor units (at most the ceiling). */
  costPerJarMinor?: number | null;
  desirability: number;
  /** Every modelled response at the point, goals first. */
  responses: ResponsePrediction[];
}

export interface FamilyOptimum {
  proposals: FamilyProposal[];
  searchBox: Array<{ name: ModelFactor; low: number; high: number }>;
  message: string | null;
  /** With a cost ceiling: what the costs are in and of (the day's prices, the base formula's pack format). */
  cost?: { currency: string; asOf: string; packFormat: string; ceilingPerJarMinor: number };
}

/**
 * POST /api/v1/models/{family}/optimise. With a base formula (`fromBase`, proposals.ts
 * baseFormulaSources) the fruit minimum holds on its exact mass balance, as on the Propose screen;
 * without one, on the family's fitted fruit-content surface. A cost ceiling per jar is the base
 * formula's cost (with its pack format), so it needs one: refused (422) without.
 */
export function optimiseFamily(model: FamilyModel, request: OptimiseRequest, fromBase?: BaseSources): FamilyOptimum {
  if (request.constraints?.costCeilingPerJarMinor !== undefined && !fromBase?.cost) {
    refuse('constraints.costCeilingPerJarMinor', 'A cost ceiling per jar needs a base formula (baseFormulaId): the cost is that formula’s, with its pack format, moved to each point.');
  }
  const fruitOf = fromBase ? fromBase.fruitPer1000g : model.fruitContent ? (p: Readonly<Record<string, number>>) => estimateAt(model.fruitContent, p) : null;
  const { result } = searchFamily(
    model,
    { factors: request.factors, goals: request.goals, fruitMinimumPer1000g: request.constraints?.fruitMinimumPer1000g, ph: request.constraints?.ph, proposals: request.proposals },
    { fruitPer1000g: fruitOf, constraints: fromBase?.constraints, withoutPhModel: 'refuse' },
  );
  const cost = fromBase?.cost;
  const goalKeys = request.goals.map((g) => g.response);
  const ordered = [...model.responses].sort((a, b) => Number(goalKeys.includes(b.key)) - Number(goalKeys.includes(a.key)));
  return {
    proposals: result.proposals.map((p) => {
      const point = p.point as Partial<FactorValues>;
      const fruit = fruitOf ? fruitOf(p.point) : Number.NaN;
      const proposal: FamilyProposal = { point, fruitPer1000g: Number.isFinite(fruit) ? fruit : null, desirability: p.desirability, responses: ordered.map((r) => predictOne(r, point)) };
      if (cost) proposal.costPerJarMinor = cost.perJarAt(p.point);
      return proposal;
    }),
    searchBox: result.searchBox.map((r) => ({ name: r.name as ModelFactor, low: r.low, high: r.high })),
    message: result.message,
    ...(cost ? { cost: { currency: cost.currency, asOf: cost.asOf, packFormat: cost.packFormat, ceilingPerJarMinor: cost.ceilingPerJarMinor } } : {}),
  };
}
