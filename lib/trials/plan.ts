/**
 * The plan helper: which variants to cook. Pure functions, no framework or database.
 *
 * A factor is measured on the formula itself (sugar ratio = sweetener ÷ fruit; acid and
 * pectin dose = grams per kilogram of fruit), so a level can be applied to any base formula
 * by scaling the lines of that kind. Designs follow the usual coding: low = −1, high = +1,
 * centre = 0 (Montgomery, Design and Analysis of Experiments, ch. 6).
 */
import { TRIAL_FACTORS, type TrialFactor } from './vocabulary';
import type { IngredientComposition } from '@/lib/chemistry';

export interface FactorLevel {
  factor: TrialFactor;
  /** −1 low, +1 high, 0 centre; other values when a level sits elsewhere (e.g. the base). */
  coded: number;
  /** The level in the factor's own unit (see FACTOR_LABELS). */
  value: number;
}

export interface FactorSpec {
  factor: TrialFactor;
  low: number;
  high: number;
}

export type DesignKind = 'one_factor_at_a_time' | 'full_factorial';

export interface PlannedRun {
  levels: FactorLevel[];
  /** Short description, e.g. "sugar ratio high, acid dose low". */
  description: string;
}

export class PlanError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'PlanError';
  }
}

/** A line in grams, with the composition needed to know what it is. */
export interface MassLine {
  ingredient: IngredientComposition;
  massG: number;
}

const KIND_OF: Record<TrialFactor, IngredientComposition['kind']> = {
  sugar_ratio: 'sweetener',
  acid_dose: 'acid',
  pectin_dose: 'pectin',
};

function massOf(lines: MassLine[], kind: IngredientComposition['kind']): number {
  return lines.filter((l) => l.ingredient.kind === kind).reduce((sum, l) => sum + l.massG, 0);
}

/** The base formula's own level of each factor. */
export function measureFactor(lines: MassLine[], factor: TrialFactor): number {
  const fruit = massOf(lines, 'fruit');
  if (fruit <= 0) throw new PlanError('base', 'The base formula has no fruit line, so ratios to fruit cannot be set.');
  const amount = massOf(lines, KIND_OF[factor]);
  return factor === 'sugar_ratio' ? amount / fruit : (amount / fruit) * 1000;
}

function code(spec: FactorSpec, value: number): number {
  const half = (spec.high - spec.low) / 2;
  return half === 0 ? 0 : (value - (spec.low + spec.high) / 2) / half;
}

function validateSpecs(specs: FactorSpec[]): void {
  if (specs.length === 0) throw new PlanError('factors', 'Choose at least one factor.');
  const seen = new Set<TrialFactor>();
  specs.forEach((s, i) => {
    if (!TRIAL_FACTORS.includes(s.factor)) throw new PlanError(`factors.${i}.factor`, 'Unknown factor.');
    if (seen.has(s.factor)) throw new PlanError(`factors.${i}.factor`, 'Each factor may be chosen once.');
    seen.add(s.factor);
    if (!Number.isFinite(s.low) || !Number.isFinite(s.high)) throw new PlanError(`factors.${i}.low`, 'Levels must be numbers.');
    if (s.low < 0 || s.high < 0) throw new PlanError(`factors.${i}.low`, 'Levels cannot be negative.');
    if (!(s.high > s.low)) throw new PlanError(`factors.${i}.high`, 'The high level must be above the low level.');
  });
}

const WORD = { '-1': 'low', '0': 'centre', '1': 'high' } as const;
const NAME: Record<TrialFactor, string> = { sugar_ratio: 'sugar ratio', acid_dose: 'acid dose', pectin_dose: 'pectin dose' };

function describe(levels: FactorLevel[], varied: TrialFactor[]): string {
  return levels
    .filter((l) => varied.includes(l.factor))
    .map((l) => `${NAME[l.factor]} ${WORD[String(l.coded) as keyof typeof WORD] ?? l.value}`)
    .join(', ');
}

/**
 * Full 2^k factorial: every combination of low and high, in standard (Yates) order — the
 * first factor alternates fastest — plus an optional centre point.
 * One-factor-at-a-time: each factor at its low and high level with the others at the base.
 */
export function planRuns(
  kind: DesignKind,
  specs: FactorSpec[],
  options: { centrePoint?: boolean; baseLevels?: Partial<Record<TrialFactor, number>> } = {},
): PlannedRun[] {
  validateSpecs(specs);
  const runs: PlannedRun[] = [];
  const factors = specs.map((s) => s.factor);
  if (kind === 'full_factorial') {
    if (specs.length > 3) throw new PlanError('factors', 'A full factorial here has at most three factors (8 runs).');
    const n = 2 ** specs.length;
    for (let r = 0; r < n; r++) {
      const levels = specs.map((s, j) => {
        const high = (r >> j) & 1;
        return { factor: s.factor, coded: high ? 1 : -1, value: high ? s.high : s.low };
      });
      runs.push({ levels, description: describe(levels, factors) });
    }
  } else {
    for (const s of specs) {
      for (const which of ['low', 'high'] as const) {
        const levels = specs.map((o) => {
          if (o.factor === s.factor) return { factor: o.factor, coded: which === 'low' ? -1 : 1, value: o[which] };
          const base = options.baseLevels?.[o.factor];
          if (base === undefined) throw new PlanError('base', `The base level of ${NAME[o.factor]} is needed for a one-factor-at-a-time plan.`);
          return { factor: o.factor, coded: code(o, base), value: base };
        });
        runs.push({ levels, description: describe(levels, [s.factor]) });
      }
    }
  }
  if (options.centrePoint) {
    const levels = specs.map((s) => ({ factor: s.factor, coded: 0, value: (s.low + s.high) / 2 }));
    runs.push({ levels, description: 'centre point' });
  }
  return runs;
}

/**
 * The base lines with the factor levels applied: the lines of the factor's kind are scaled
 * together so their sum meets the level; every other line stays as it is.
 */
export function applyFactorLevels(lines: MassLine[], levels: FactorLevel[]): MassLine[] {
  const fruit = massOf(lines, 'fruit');
  if (fruit <= 0) throw new PlanError('base', 'The base formula has no fruit line, so ratios to fruit cannot be set.');
  let result = lines.map((l) => ({ ...l }));
  for (const level of levels) {
    const kind = KIND_OF[level.factor];
    const current = massOf(result, kind);
    const target = level.factor === 'sugar_ratio' ? level.value * fruit : (level.value / 1000) * fruit;
    if (current <= 0) {
      if (target === 0) continue;
      throw new PlanError('base', `The base formula has no ${kind} line to scale for the ${NAME[level.factor]}.`);
    }
    const k = target / current;
    result = result.map((l) => (l.ingredient.kind === kind ? { ...l, massG: l.massG * k } : l));
  }
  return result;
}

/**
 * What makes two variants the same: the same ingredients at the same grams (to 0.001 g). Lines given
 * as % of fruit keep their unit in the key, so they never match grams by accident.
 */
export function variantLinesKey(lines: ReadonlyArray<{ ingredientId: string; quantity: number; unit: string }>): string {
  return lines.map((l) => `${l.ingredientId}:${l.quantity.toFixed(3)}${l.unit}`).sort().join('|');
}
