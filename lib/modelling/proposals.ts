/**
 * From goals to formulas: the optimiser (lib/models/optimise.ts, Derringer–Suich desirability) over a
 * family model, with the constraints a developer states — the rule set's fruit minimum, the pH
 * window, sugar-ratio and soluble-solids ranges (reduced-sugar work) — and each proposal written
 * back into the base formula's own lines. PURE: the proposal screen runs it in the browser and the
 * trial action runs formulaAtPoint() on the server to build the variants.
 *
 * A cost ceiling per jar is not offered: the cost needs the day's prices of every line (lib/costing)
 * and the pack format, which the optimiser's pure search does not have; the trial's variants show
 * their cost per jar once created.
 */
import { RULES, type BatchComputation } from '@/lib/chemistry';
import { computeFormula } from '@/lib/formulas/compute';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import { ModelSpecError, optimise, predictResponse, windowConstraint, type Constraint, type Goal, type Interval } from '@/lib/models';
import { FACTOR_INFO, type FamilyModel, type ModelFactor, type ResponseKey } from './schema';

export interface ProposalBase {
  settings: FormulaSettingsInput;
  lines: RevisionLine[];
}

export type FormulaAtPoint =
  | { ok: true; settings: FormulaSettingsInput; lines: RevisionLine[]; computation: BatchComputation }
  | { ok: false; message: string };

/** Fixed-point passes for pectin and acid, which are shares of a finished mass they change a little. */
const PASSES = 4;

function scaleKind(lines: RevisionLine[], kind: string, target: number, what: string): RevisionLine[] | string {
  const current = lines.filter((l) => l.ingredient.kind === kind).reduce((s, l) => s + l.quantity, 0);
  if (current <= 0) return target > 0 ? `The base formula has no ${what} line to set.` : lines;
  const k = target / current;
  return lines.map((l) => (l.ingredient.kind === kind ? { ...l, quantity: l.quantity * k } : l));
}

/**
 * The base formula moved to a point of the model's factors: sweetener lines scaled to the sugar
 * ratio, the target soluble solids set, pectin and acid lines scaled to their share of the finished
 * product (acid counted as citric acid, as the features count it). Fruit and every other line stay.
 */
export function formulaAtPoint(base: ProposalBase, point: Partial<Record<ModelFactor, number>>): FormulaAtPoint {
  const settings = { ...base.settings, ...(point.targetSolidsPct !== undefined ? { targetSolidsPct: point.targetSolidsPct } : {}) };
  const first = computeFormula(settings, base.lines);
  if (!first.ok) return { ok: false, message: first.message };
  // Work in grams from here on, so "% of fruit" lines scale like the rest.
  let lines: RevisionLine[] = base.lines.map((l, i) => ({ ...l, quantity: first.computation.massBalance.lines[i].massG, unit: 'g' }));
  const fruit = first.computation.massBalance.fruitMassG;
  if (!(fruit > 0)) return { ok: false, message: 'The base formula has no fruit line.' };
  if (point.sugarRatio !== undefined) {
    const scaled = scaleKind(lines, 'sweetener', point.sugarRatio * fruit, 'sweetener');
    if (typeof scaled === 'string') return { ok: false, message: scaled };
    lines = scaled;
  }
  let outcome = computeFormula(settings, lines);
  for (let pass = 0; pass < PASSES && outcome.ok; pass++) {
    const finished = outcome.computation.massBalance.finishedMassG;
    if (point.pectinPct !== undefined) {
      const scaled = scaleKind(lines, 'pectin', (point.pectinPct / 100) * finished, 'pectin');
      if (typeof scaled === 'string') return { ok: false, message: scaled };
      lines = scaled;
    }
    if (point.acidPct !== undefined) {
      const acid = lines.filter((l) => l.ingredient.kind === 'acid');
      const citric = acid.reduce((s, l) => s + (l.quantity * (l.ingredient.acidPct ?? 100)) / 100, 0);
      if (citric <= 0 && point.acidPct > 0) return { ok: false, message: 'The base formula has no acid line to set.' };
      if (citric > 0) {
        const k = ((point.acidPct / 100) * finished) / citric;
        lines = lines.map((l) => (l.ingredient.kind === 'acid' ? { ...l, quantity: l.quantity * k } : l));
      }
    }
    outcome = computeFormula(settings, lines);
  }
  if (!outcome.ok) return { ok: false, message: outcome.message };
  // Shares too large to reach (pectin as much as the batch) do not settle: refuse rather than write a wrong formula.
  const mb = outcome.computation.massBalance;
  const acidNow = (lines.filter((l) => l.ingredient.kind === 'acid').reduce((s, l) => s + (l.quantity * (l.ingredient.acidPct ?? 100)) / 100, 0) / mb.finishedMassG) * 100;
  const off = (got: number, want: number | undefined) => want !== undefined && Math.abs(got - want) > 1e-3 * Math.max(want, 0.01);
  if (off(mb.pectinPctOfFinished, point.pectinPct) || off(acidNow, point.acidPct)) {
    return { ok: false, message: 'This combination cannot be made from the base formula: the pectin or acid share is out of reach at this soluble solids.' };
  }
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

export interface GoalInput {
  response: ResponseKey;
  goal: Goal;
  importance: number;
}

export interface ProposalRequest {
  factors: Array<{ name: ModelFactor; low: number; high: number }>;
  goals: GoalInput[];
  fruitMinimumPer1000g?: number;
  ph?: { low: number; high: number };
  proposals?: number;
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
}

export interface ProposalOutcome {
  proposals: ProposedFormula[];
  message: string | null;
  /** What the search could not hold to, in words (no pH model, for instance). */
  notes: string[];
}

const PH_KEY: ResponseKey = 'lab:measuredPh';

/** The best formulas inside the data's region for the goals and constraints; the request is checked first. */
export function proposeFormulas(model: FamilyModel, base: ProposalBase, request: ProposalRequest): ProposalOutcome {
  const notes: string[] = [];
  for (const f of request.factors) {
    if (!Number.isFinite(f.low) || !Number.isFinite(f.high) || !(f.high > f.low)) {
      throw new ModelSpecError(`The lowest ${FACTOR_INFO[f.name].name.toLowerCase()} must be below the highest.`);
    }
  }
  const goals = request.goals.map((g) => {
    const response = model.responses.find((r) => r.key === g.response);
    if (!response) throw new ModelSpecError('A goal names a response the family has no model for.');
    if (!Number.isFinite(g.importance) || g.importance <= 0) throw new ModelSpecError(`The importance of ${response.name} must be above 0.`);
    return { name: response.name, surface: response.surface, goal: g.goal, importance: g.importance, response };
  });
  const constraints: Constraint[] = [];
  const cache = new Map<string, FormulaAtPoint>();
  const formulaAt = (point: Readonly<Record<string, number>>) => {
    const key = model.factors.map((f) => point[f]).join('|');
    let hit = cache.get(key);
    if (!hit) {
      hit = formulaAtPoint(base, point as Partial<Record<ModelFactor, number>>);
      if (cache.size > 20_000) cache.clear();
      cache.set(key, hit);
    }
    return hit;
  };
  const fruitOf = (point: Readonly<Record<string, number>>) => {
    const formula = formulaAt(point);
    return formula.ok ? formula.computation.massBalance.fruitPer1000gFinishedG : Number.NaN;
  };
  if (request.fruitMinimumPer1000g !== undefined) {
    constraints.push(windowConstraint('fruit minimum', fruitOf, { low: request.fruitMinimumPer1000g }));
  }
  const phModel = model.responses.find((r) => r.key === PH_KEY);
  if (request.ph) {
    if (!(request.ph.high > request.ph.low)) throw new ModelSpecError('The lowest pH must be below the highest.');
    if (phModel) {
      constraints.push(windowConstraint('pH window', (p) => {
        const prediction = predictResponse(phModel.surface, p);
        return prediction.inRegion ? prediction.estimate : Number.NaN;
      }, request.ph));
    } else {
      notes.push('This family has no model of measured pH yet, so the pH window could not be held to: measure the pH of every cook of the proposal.');
    }
  }
  const result = optimise({ factors: request.factors, goals, constraints, proposals: request.proposals ?? 3 });
  const proposals = result.proposals.map((p): ProposedFormula => {
    const ph = phModel ? predictResponse(phModel.surface, p.point) : null;
    return {
      point: p.point as Record<ModelFactor, number>,
      desirability: p.desirability,
      responses: p.responses.map((r, i) => ({
        key: goals[i].response.key,
        name: r.name,
        unit: goals[i].response.unit,
        decimals: goals[i].response.decimals,
        estimate: r.estimate,
        prediction: r.prediction,
        desirability: r.desirability,
      })),
      fruitPer1000g: fruitOf(p.point),
      ph: ph && ph.inRegion ? { estimate: ph.estimate, prediction: ph.prediction } : null,
    };
  });
  return { proposals, message: result.message, notes };
}

/**
 * A few points around a proposal for the trial: each factor one step (a tenth of its allowed range)
 * down and up with the others held, kept only where every model still predicts (inside the data's
 * region) and the formula can be made; at most `count`.
 */
export function pointsAround(
  model: FamilyModel,
  base: ProposalBase,
  proposal: Record<ModelFactor, number>,
  ranges: ReadonlyArray<{ name: ModelFactor; low: number; high: number }>,
  count = 4,
): Array<Record<ModelFactor, number>> {
  const around: Array<Record<ModelFactor, number>> = [];
  for (const range of ranges) {
    for (const sign of [-1, 1]) {
      if (around.length >= count) return around;
      const point = { ...proposal, [range.name]: proposal[range.name] + (sign * (range.high - range.low)) / 10 };
      const inside = model.responses.every((r) => predictResponse(r.surface, point).inRegion);
      if (inside && formulaAtPoint(base, point).ok) around.push(point);
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
