/**
 * From goals to formulas: the optimisation core (optimise.ts) over a family model with the base
 * formula known — the rule set's fruit minimum on its exact mass balance, the pH window, the factor
 * ranges (reduced-sugar work), a cost ceiling per jar — and each proposal written back into the base
 * formula's own lines. PURE: the proposal screen runs it in the browser and the trial action runs
 * formulaAtPoint() on the server to build the variants.
 *
 * The cost per jar at a point is the editor's own costing (lib/costing costComputation) of the
 * formula at that point, with the prices and pack format the page read for a user who may see prices.
 */
import { RULES, type BatchComputation } from '@/lib/chemistry';
import { computeFormula } from '@/lib/formulas/compute';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import { ValidationFailed } from '@/lib/errors';
import { costComputation, historiesBy, type FormulaCostOutcome, type FormulaPrices } from '@/lib/costing';
import type { EditorCostBasis } from '@/lib/costs/schema';
import { predictResponse, windowConstraint, type Constraint, type Interval } from '@/lib/models';
import { formatMoney, minorDigits } from '@/lib/pricing/money';
import { searchFamily, type BaseSources, type SearchRequest } from './optimise';
import { predictOne } from './predict';
import { FACTOR_INFO, type FamilyModel, type ModelFactor, type ResponseKey } from './schema';

export interface ProposalBase {
  settings: FormulaSettingsInput;
  lines: RevisionLine[];
}

export type FormulaAtPoint =
  | { ok: true; settings: FormulaSettingsInput; lines: RevisionLine[]; computation: BatchComputation }
  | { ok: false; message: string };

type ScaledKind = 'sweetener' | 'pectin' | 'acid';

interface KindTotals {
  massG: number;
  solidsG: number;
  /** Acid as citric acid (each line's acidity; a powder without one counts whole). */
  citricG: number;
}

export interface PointSolver {
  /** The base formula's lines in grams (so "% of fruit" lines scale like the rest), computed once. */
  grams: RevisionLine[];
  /** Finished mass and the new total of each scaled kind at a point; null when the point cannot be made. */
  at(point: Partial<Record<ModelFactor, number>>): { finishedMassG: number; fruitPer1000g: number; totals: Record<ScaledKind, number> } | null;
}

/**
 * The mass balance solved for a point, without iterating: the finished mass is the soluble solids
 * over the target (lib/chemistry/mass-balance.ts), and pectin and acid are shares of that mass, so
 * F = (fixed solids + r·fruit·σ_sweetener) / (t − p·σ_pectin − a·σ_acid/acidity). Lines of one kind
 * keep their proportions. Cheap enough for every step of the optimiser's search.
 */
export function pointSolver(base: ProposalBase): PointSolver | string {
  const outcome = computeFormula(base.settings, base.lines);
  if (!outcome.ok) return outcome.message;
  const mb = outcome.computation.massBalance;
  const fruit = mb.fruitMassG;
  if (!(fruit > 0)) return 'The base formula has no fruit line.';
  const totals: Record<ScaledKind | 'other', KindTotals> = { sweetener: { massG: 0, solidsG: 0, citricG: 0 }, pectin: { massG: 0, solidsG: 0, citricG: 0 }, acid: { massG: 0, solidsG: 0, citricG: 0 }, other: { massG: 0, solidsG: 0, citricG: 0 } };
  for (const l of mb.lines) {
    const kind = l.ingredient.kind === 'sweetener' || l.ingredient.kind === 'pectin' || l.ingredient.kind === 'acid' ? l.ingredient.kind : 'other';
    totals[kind].massG += l.massG;
    totals[kind].solidsG += l.solidsG;
    if (kind === 'acid') totals.acid.citricG += (l.massG * (l.ingredient.acidPct ?? 100)) / 100;
  }
  const perGram = (k: ScaledKind) => (totals[k].massG > 0 ? totals[k].solidsG / totals[k].massG : 0);
  return {
    grams: base.lines.map((l, i) => ({ ...l, quantity: mb.lines[i].massG, unit: 'g' as const })),
    at(point: Partial<Record<ModelFactor, number>>) {
      const t = (point.targetSolidsPct ?? base.settings.targetSolidsPct) / 100;
      let fixed = totals.other.solidsG;
      let shares = 0;
      const sweetener = point.sugarRatio !== undefined ? point.sugarRatio * fruit : totals.sweetener.massG;
      if (sweetener > 0 && totals.sweetener.massG <= 0) return null;
      fixed += sweetener * perGram('sweetener');
      if (point.pectinPct !== undefined) {
        if (point.pectinPct > 0 && totals.pectin.massG <= 0) return null;
        shares += (point.pectinPct / 100) * perGram('pectin');
      } else fixed += totals.pectin.solidsG;
      const acidity = totals.acid.massG > 0 ? totals.acid.citricG / totals.acid.massG : 0;
      if (point.acidPct !== undefined) {
        if (point.acidPct > 0 && !(acidity > 0)) return null;
        if (point.acidPct > 0) shares += ((point.acidPct / 100) * perGram('acid')) / acidity;
      } else fixed += totals.acid.solidsG;
      const denominator = t - shares;
      if (!(denominator > 0) || !(fixed > 0)) return null;
      const finishedMassG = fixed / denominator;
      return {
        finishedMassG,
        fruitPer1000g: (fruit / finishedMassG) * 1000,
        totals: {
          sweetener,
          pectin: point.pectinPct !== undefined ? (point.pectinPct / 100) * finishedMassG : totals.pectin.massG,
          acid: point.acidPct !== undefined ? (acidity > 0 ? ((point.acidPct / 100) * finishedMassG) / acidity : 0) : totals.acid.massG,
        },
      };
    },
  };
}

/**
 * The base formula moved to a point of the model's factors: sweetener lines scaled to the sugar
 * ratio, the target soluble solids set, pectin and acid lines scaled to their share of the finished
 * product (acid counted as citric acid, as the features count it). Fruit and every other line stay.
 */
export function formulaAtPoint(base: ProposalBase, point: Partial<Record<ModelFactor, number>>, solver?: PointSolver): FormulaAtPoint {
  const solved = solver ?? pointSolver(base);
  if (typeof solved === 'string') return { ok: false, message: solved };
  const at = solved.at(point);
  if (!at) return { ok: false, message: 'This combination cannot be made from the base formula: a line it needs is missing, or the pectin or acid share is out of reach at this soluble solids.' };
  const settings = { ...base.settings, ...(point.targetSolidsPct !== undefined ? { targetSolidsPct: point.targetSolidsPct } : {}) };
  const grams = solved.grams;
  const current = (kind: ScaledKind) => grams.filter((l) => l.ingredient.kind === kind).reduce((sum, l) => sum + l.quantity, 0);
  const factor = { sweetener: at.totals.sweetener / current('sweetener'), pectin: at.totals.pectin / current('pectin'), acid: at.totals.acid / current('acid') };
  const lines = grams.map((l) => {
    const kind = l.ingredient.kind;
    return kind === 'sweetener' || kind === 'pectin' || kind === 'acid' ? { ...l, quantity: l.quantity * factor[kind] } : l;
  });
  if (lines.some((l) => !(l.quantity > 0))) return { ok: false, message: 'This combination would leave a line of the base formula at nothing; take that line out of the formula first.' };
  const outcome = computeFormula(settings, lines);
  if (!outcome.ok) return { ok: false, message: outcome.message };
  return { ok: true, settings, lines, computation: outcome.computation };
}

export interface FruitMinimum {
  /** g fruit per 1000 g of finished product. */
  value: number;
  /** Where the figure comes from, in words. */
  basis: string;
}

const PER_1000G = 'fruit_per_1000g_finished';

/**
 * The fruit minimum of the formula's rule set, from its own compliance check. Where the product class
 * has none (a reduced-sugar spread under the EU rules), the jam minimum of the same rule set is
 * offered as the benchmark, said so; null where the rule is a ratio to sweetener (US), not per 1000 g.
 */
export function fruitMinimumOf(base: ProposalBase): FruitMinimum | null {
  const own = computeFormula(base.settings, base.lines);
  const find = (computation: BatchComputation) =>
    computation.compliance.results.find((r) => r.requiredValue !== null && RULES.find((rule) => rule.id === r.ruleId)?.metric === PER_1000G);
  if (!own.ok) return null;
  const rule = find(own.computation);
  if (rule) return { value: rule.requiredValue!, basis: `${rule.title} (${rule.source})` };
  const asJam = computeFormula({ ...base.settings, productClass: 'jam' }, base.lines);
  const jam = asJam.ok ? find(asJam.computation) : undefined;
  return jam ? { value: jam.requiredValue!, basis: `No fruit minimum for this product class in the rule set; the jam minimum is the benchmark: ${jam.title} (${jam.source})` } : null;
}

export type GoalInput = SearchRequest['goals'][number];

/** What the Propose screen asks: the optimisation core's request and, for users who may see prices, a cost ceiling. */
export type ProposalRequest = SearchRequest & {
  /** The highest cost per jar, in the workspace currency's minor units. */
  costCeilingPerJarMinor?: number;
};

/** The day's prices and the formula's pack format, as the formula editor's cost panel uses them. */
export interface ProposalCosting {
  /** Null until an admin picks the workspace's currency. */
  currency: string | null;
  prices: FormulaPrices;
  /** Refuse/trim % per ingredient id. */
  refuse: ReadonlyMap<string, number>;
}

/** The page's cost basis and the formula's pack format (null: none chosen) → the costing of proposals. */
export function proposalCosting(basis: EditorCostBasis, packFormatId: string | null): ProposalCosting {
  return {
    currency: basis.currency,
    prices: {
      asOf: basis.asOf,
      packFormat: basis.packFormats.find((f) => f.id === packFormatId) ?? null,
      overfillPct: basis.overfillPct,
      ingredientPrices: historiesBy(basis.ingredientPrices, (p) => p.ingredientId),
      packagingPrices: historiesBy(basis.packagingPrices, (p) => p.packagingItemId),
    },
    refuse: new Map(basis.refuse),
  };
}

/** The cost of the base formula moved to a point (formulaAtPoint), priced as the editor prices it. */
export function costAtPoint(base: ProposalBase, point: Partial<Record<ModelFactor, number>>, costing: ProposalCosting, solver?: PointSolver): FormulaCostOutcome {
  const at = formulaAtPoint(base, point, solver);
  if (!at.ok) return at;
  const lines = at.lines.map((l) => ({ ingredientId: l.ingredientId, name: l.ingredient.name, refusePct: costing.refuse.get(l.ingredientId) ?? 0 }));
  return costComputation(at.computation, lines, costing.prices);
}

/** The complete cost per jar at a point, in minor units; null where it is not known. */
function knownCostPerJar(outcome: FormulaCostOutcome): number | null {
  return outcome.ok && outcome.cost.complete && outcome.cost.perJar?.complete ? outcome.cost.perJar.minor : null;
}

/** The complete cost per jar of the base formula moved to a point, in minor units; null where it is not known. */
export function costPerJarAt(base: ProposalBase, point: Partial<Record<ModelFactor, number>>, costing: ProposalCosting, solver?: PointSolver): number | null {
  return knownCostPerJar(costAtPoint(base, point, costing, solver));
}

/** The highest cost ceiling per jar, in the currency's major units: far above any jar's cost, and its minor units a safe integer. */
export const MAX_COST_CEILING_PER_JAR = 1_000_000;

export const COST_CEILING_TOO_HIGH = 'The cost ceiling per jar must be at most 1,000,000.';

/** The field a refused ceiling is named by, on the screen and in the optimise API alike. */
export const COST_CEILING_FIELD = 'constraints.costCeilingPerJarMinor';

/**
 * Why the formula has no known cost per jar, naming what is missing (the currency, the pack format,
 * the lines without a price on the day); null when it has one. Every point keeps the base formula's
 * lines and packaging, so the base answers for all of them.
 */
export function costPerJarProblem(base: ProposalBase, costing: ProposalCosting): string | null {
  if (!costing.currency) return 'Costs need the workspace currency: an administrator sets it, then enters prices.';
  if (!costing.prices.packFormat) return 'This formula has no pack format, so it has no cost per jar: choose its pack format (jar and packaging) first.';
  const atBase = costAtPoint(base, {}, costing);
  if (!atBase.ok) return `The cost per jar cannot be worked out: ${atBase.message}`;
  if (atBase.cost.missing.length) return `The cost per jar is incomplete on ${atBase.cost.asOf}: no price for ${atBase.cost.missing.join(', ')}.`;
  return null;
}

function refuseCeiling(message: string): never {
  throw new ValidationFailed(message, { [COST_CEILING_FIELD]: [message] });
}

/**
 * The cost ceiling as a constraint: the cost per jar of the formula at each point at most the
 * ceiling. Refused, naming what is missing, when the cost per jar cannot be known
 * (costPerJarProblem): an unknown price is never a zero.
 */
export function costCeilingConstraint(base: ProposalBase, costing: ProposalCosting | null, ceilingMinor: number): Constraint {
  if (!costing) refuseCeiling('A cost ceiling needs the permission to see prices.');
  if (!(Number.isFinite(ceilingMinor) && ceilingMinor > 0)) refuseCeiling('The cost ceiling per jar must be a positive amount.');
  const problem = costPerJarProblem(base, costing);
  if (problem) refuseCeiling(`${problem} Until then the search cannot hold a cost ceiling.`);
  if (ceilingMinor > MAX_COST_CEILING_PER_JAR * 10 ** minorDigits(costing.currency!)) refuseCeiling(COST_CEILING_TOO_HIGH);
  const solver = pointSolver(base);
  const reusable = typeof solver === 'string' ? undefined : solver;
  return windowConstraint(`cost ceiling per jar (${formatMoney(ceilingMinor, costing.currency!)})`, (p) => knownCostPerJar(costAtPoint(base, p, costing, reusable)) ?? Number.NaN, { high: ceilingMinor });
}

export interface ProposedResponse {
  key: ResponseKey;
  name: string;
  unit: string;
  decimals: number;
  estimate: number;
  prediction: Interval | null;
  desirability: number;
}

export interface ProposedFormula {
  point: Record<ModelFactor, number>;
  desirability: number;
  responses: ProposedResponse[];
  fruitPer1000g: number;
  /** Predicted measured pH, when the family has a pH model. */
  ph: { estimate: number; prediction: Interval | null } | null;
  /** Cost per jar in minor units with the day's prices, when costing is given and every price is known. */
  costPerJarMinor: number | null;
}

export interface ProposalOutcome {
  proposals: ProposedFormula[];
  message: string | null;
  /** What the search could not hold to, in words (no pH model, for instance). */
  notes: string[];
}

/** A cost ceiling asked of a search: the costing the caller may see (null without prices.read) and the ceiling. */
export interface CeilingRequest {
  costing: ProposalCosting | null;
  perJarMinor: number;
}

/**
 * The fruit content and the "can be made" constraint from a base formula: its mass balance solved at
 * each point — exact, better than the fitted fruit-content surface the API falls back on without one.
 * With a ceiling, the cost ceiling per jar as a constraint (refused by name when the cost per jar
 * cannot be known, costCeilingConstraint) and each point's cost: the screen and the API alike.
 */
export function baseFormulaSources(base: ProposalBase, ceiling?: CeilingRequest): BaseSources {
  const solver = pointSolver(base);
  if (typeof solver === 'string') throw new ValidationFailed(solver, { baseFormulaId: [solver] });
  const sources: BaseSources = {
    fruitPer1000g: (point) => solver.at(point)?.fruitPer1000g ?? Number.NaN,
    // A point the base formula cannot be moved to is no proposal.
    constraints: [windowConstraint('the base formula can be made', (p) => (solver.at(p) ? 0 : Number.NaN), { low: 0 })],
  };
  if (!ceiling) return sources;
  sources.constraints.push(costCeilingConstraint(base, ceiling.costing, ceiling.perJarMinor));
  // costCeilingConstraint refused anything without a currency and a pack format.
  const costing = ceiling.costing!;
  sources.cost = {
    currency: costing.currency!,
    asOf: costing.prices.asOf,
    packFormat: costing.prices.packFormat!.name,
    ceilingPerJarMinor: ceiling.perJarMinor,
    perJarAt: (point) => costPerJarAt(base, point, costing, solver),
  };
  return sources;
}

/**
 * The best formulas inside the data's region for the goals and constraints, through the one
 * optimisation core (optimise.ts), with the fruit minimum on the base formula's exact mass balance.
 */
export function proposeFormulas(model: FamilyModel, base: ProposalBase, request: ProposalRequest, costing: ProposalCosting | null = null): ProposalOutcome {
  const { costCeilingPerJarMinor, ...searchRequest } = request;
  const sources = baseFormulaSources(base, costCeilingPerJarMinor !== undefined ? { costing, perJarMinor: costCeilingPerJarMinor } : undefined);
  const fruitOf = sources.fruitPer1000g;
  const { result, goalModels, phModel, notes } = searchFamily(model, searchRequest, { ...sources, withoutPhModel: 'note' });
  const proposals = result.proposals.map((p): ProposedFormula => {
    const point = Object.fromEntries(model.factors.map((f) => [f, p.point[f]])) as Record<ModelFactor, number>;
    const ph = phModel ? predictOne(phModel, point) : null;
    return {
      point,
      desirability: p.desirability,
      responses: p.responses.map((r, i) => {
        // The interval of one new variant's mean: a panel mean carries its panel's weight (fit.ts).
        const predicted = predictOne(goalModels[i], point);
        const response = goalModels[i];
        return { key: response.key, name: r.name, unit: response.unit, decimals: response.decimals, estimate: r.estimate, prediction: predicted.inRegion ? predicted.prediction : null, desirability: r.desirability };
      }),
      fruitPer1000g: fruitOf(p.point),
      ph: ph && ph.inRegion ? { estimate: ph.estimate, prediction: ph.prediction } : null,
      costPerJarMinor: costing?.currency ? costPerJarAt(base, point, costing) : null,
    };
  });
  return { proposals, message: result.message, notes };
}

/** The points around a proposal, and how many were left out for costing more per jar than the ceiling. */
export interface PointsAround {
  points: Array<Record<ModelFactor, number>>;
  overCeiling: number;
}

/**
 * A few points around a proposal for the trial: each factor one step (a tenth of its allowed range)
 * down and up with the others held, kept only where every model still predicts (inside the data's
 * region) and the formula can be made, and — with a cost ceiling — where the cost per jar is known
 * and at most the ceiling (the others are counted in `overCeiling`); at most `count`.
 */
export function pointsAround(
  model: FamilyModel,
  base: ProposalBase,
  proposal: Record<ModelFactor, number>,
  ranges: ReadonlyArray<{ name: ModelFactor; low: number; high: number }>,
  options: { count?: number; ceiling?: { costing: ProposalCosting; perJarMinor: number } } = {},
): PointsAround {
  const count = options.count ?? 4;
  const ceiling = options.ceiling;
  const around: PointsAround = { points: [], overCeiling: 0 };
  for (const range of ranges) {
    for (const sign of [-1, 1]) {
      if (around.points.length >= count) return around;
      const point = { ...proposal, [range.name]: proposal[range.name] + (sign * (range.high - range.low)) / 10 };
      const inside = model.responses.every((r) => predictResponse(r.surface, point).inRegion);
      if (!inside || !(point[range.name] >= 0) || !formulaAtPoint(base, point).ok) continue;
      if (ceiling) {
        const cost = costPerJarAt(base, point, ceiling.costing);
        // An unknown cost is never taken as under the ceiling.
        if (cost === null || cost > ceiling.perJarMinor) {
          around.overCeiling += 1;
          continue;
        }
      }
      around.points.push(point);
    }
  }
  return around;
}

/** "sugar ratio 0.36, target soluble solids 45.0 %, …" for a variant's description. */
export function describePoint(point: Partial<Record<ModelFactor, number>>): string {
  return (Object.keys(FACTOR_INFO) as ModelFactor[])
    .filter((f) => point[f] !== undefined)
    .map((f) => `${FACTOR_INFO[f].name.toLowerCase()} ${point[f]!.toFixed(FACTOR_INFO[f].decimals)}`)
    .join(', ');
}
