/**
 * The plan helper: which variants to cook. Pure functions, no framework or database.
 *
 * A factor is measured on the formula itself (sugar ratio = sweetener ÷ fruit; acid and
 * pectin dose = grams per kilogram of fruit), so a level can be applied to any base formula
 * by scaling the lines of that kind. Designs follow the usual coding: low = −1, high = +1,
 * centre = 0 (Montgomery, Design and Analysis of Experiments, ch. 6). Target soluble solids is a
 * setting of the cook, not a line: its level changes the variant's target and leaves the lines alone.
 * The response-surface designs (central composite, Box–Behnken) come from lib/models/designs.
 */
import { TRIAL_FACTORS, type TrialFactor } from './vocabulary';
import type { IngredientComposition } from '@/lib/chemistry';
import { boxBehnken, centralComposite, ModelSpecError, type SurfaceDesign } from '@/lib/models';

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

export const DESIGN_KINDS = ['one_factor_at_a_time', 'full_factorial', 'central_composite_face_centred', 'central_composite_rotatable', 'box_behnken'] as const;
export type DesignKind = (typeof DESIGN_KINDS)[number];
export const SURFACE_DESIGNS: readonly DesignKind[] = ['central_composite_face_centred', 'central_composite_rotatable', 'box_behnken'];

/** Centre runs of a response-surface design: replicates that give the pure error and the curvature test. */
export const CENTRE_RUNS = { min: 1, max: 6, default: 3 } as const;

export interface PlannedRun {
  levels: FactorLevel[];
  /** Short description, e.g. "sugar ratio high, acid dose low". */
  description: string;
}

export interface PlannedDesign {
  runs: PlannedRun[];
  /** What to check before cooking (rotatable axial runs beyond the stated levels). */
  warnings: string[];
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

type LineFactor = Exclude<TrialFactor, 'target_solids'>;

const KIND_OF: Record<LineFactor, IngredientComposition['kind']> = {
  sugar_ratio: 'sweetener',
  acid_dose: 'acid',
  pectin_dose: 'pectin',
};

/** Target soluble solids must stay a possible end point (as in the formula settings: above 0, below 100 %). */
const SOLIDS_LIMITS = { low: 0, high: 100 };

function massOf(lines: MassLine[], kind: IngredientComposition['kind']): number {
  return lines.filter((l) => l.ingredient.kind === kind).reduce((sum, l) => sum + l.massG, 0);
}

/** The base formula's own level of each factor (target soluble solids from its settings). */
export function measureFactor(lines: MassLine[], factor: TrialFactor, settings?: { targetSolidsPct: number }): number {
  if (factor === 'target_solids') {
    if (!settings) throw new PlanError('base', 'The base formula\'s target soluble solids is needed.');
    return settings.targetSolidsPct;
  }
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
    if (s.factor === 'target_solids' && !(s.low > SOLIDS_LIMITS.low && s.high < SOLIDS_LIMITS.high)) {
      throw new PlanError(`factors.${i}.high`, 'Target soluble solids must lie between 0 and 100 %.');
    }
  });
}

const WORD = { '-1': 'low', '0': 'centre', '1': 'high' } as const;
const NAME: Record<TrialFactor, string> = { sugar_ratio: 'sugar ratio', acid_dose: 'acid dose', pectin_dose: 'pectin dose', target_solids: 'target soluble solids' };

function levelText(level: FactorLevel): string {
  const word = WORD[String(level.coded) as keyof typeof WORD];
  if (word) return `${NAME[level.factor]} ${word}`;
  // Rotatable axial runs sit beyond low and high: say so, with the level itself.
  const value = Number(level.value.toPrecision(3));
  return `${NAME[level.factor]} ${level.coded < -1 ? 'below low' : level.coded > 1 ? 'above high' : 'at'} (${value})`;
}

function describe(levels: FactorLevel[], varied: TrialFactor[]): string {
  return levels.filter((l) => varied.includes(l.factor)).map(levelText).join(', ');
}

function surfaceDesign(kind: DesignKind, specs: FactorSpec[], centreRuns: number): SurfaceDesign {
  const ranges = specs.map((s) => ({ name: s.factor, low: s.low, high: s.high }));
  if (!Number.isInteger(centreRuns) || centreRuns < CENTRE_RUNS.min || centreRuns > CENTRE_RUNS.max) {
    throw new PlanError('centreRuns', `Choose between ${CENTRE_RUNS.min} and ${CENTRE_RUNS.max} centre runs.`);
  }
  try {
    if (kind === 'box_behnken') return boxBehnken(ranges, { centrePoints: centreRuns });
    return centralComposite(ranges, { alpha: kind === 'central_composite_rotatable' ? 'rotatable' : 'face_centred', centrePoints: centreRuns });
  } catch (err) {
    if (err instanceof ModelSpecError) throw new PlanError('factors', err.message);
    throw err;
  }
}

/** The runs of a central composite or Box–Behnken design as planned runs with readable descriptions. */
function surfaceRuns(kind: DesignKind, specs: FactorSpec[], centreRuns: number): PlannedDesign {
  const design = surfaceDesign(kind, specs, centreRuns);
  const factors = specs.map((s) => s.factor);
  const centres = design.runs.filter((r) => r.kind === 'centre').length;
  let centre = 0;
  const runs = design.runs.map((r) => {
    const levels = specs.map((s, j) => ({ factor: s.factor, coded: r.coded[j], value: r.natural[s.factor] }));
    levels.forEach((l, j) => {
      if (l.value < 0) throw new PlanError(`factors.${j}.low`, `The ${NAME[l.factor]} would go below zero (${Number(l.value.toPrecision(3))}) on an axial run: narrow its range or use the face-centred design.`);
      if (l.factor === 'target_solids' && !(l.value > SOLIDS_LIMITS.low && l.value < SOLIDS_LIMITS.high)) {
        throw new PlanError(`factors.${j}.high`, 'An axial run would take the target soluble solids outside 0–100 %: narrow its range.');
      }
    });
    if (r.kind === 'centre') return { levels, description: `centre point (${++centre} of ${centres})` };
    const moved = levels.filter((l) => l.coded !== 0).map((l) => l.factor);
    const rest = factors.length > moved.length ? ', others centre' : '';
    return { levels, description: describe(levels, moved) + rest };
  });
  const warnings = design.alpha !== null && design.alpha > 1
    ? [`The single-factor runs go beyond low and high (${Number(design.alpha.toFixed(2))} × half the range from the centre): check those levels can be cooked.`]
    : [];
  return { runs, warnings };
}

/**
 * Full 2^k factorial: every combination of low and high, in standard (Yates) order — the
 * first factor alternates fastest — plus an optional centre point.
 * One-factor-at-a-time: each factor at its low and high level with the others at the base.
 */
export function planRuns(
  kind: DesignKind,
  specs: FactorSpec[],
  options: { centrePoint?: boolean; centreRuns?: number; baseLevels?: Partial<Record<TrialFactor, number>> } = {},
): PlannedRun[] {
  return planDesign(kind, specs, options).runs;
}

/**
 * planRuns with the design's warnings. Central composite and Box–Behnken designs always carry
 * their replicated centre runs (`centreRuns`, default 3); the factorial plans an optional single one.
 */
export function planDesign(
  kind: DesignKind,
  specs: FactorSpec[],
  options: { centrePoint?: boolean; centreRuns?: number; baseLevels?: Partial<Record<TrialFactor, number>> } = {},
): PlannedDesign {
  validateSpecs(specs);
  if (SURFACE_DESIGNS.includes(kind)) return surfaceRuns(kind, specs, options.centreRuns ?? CENTRE_RUNS.default);
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
  return { runs, warnings: [] };
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
    if (level.factor === 'target_solids') continue;
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

/** The target soluble solids a run sets: its level when the plan varies it, otherwise the base's. */
export function targetSolidsOf(levels: FactorLevel[], baseTargetPct: number): number {
  return levels.find((l) => l.factor === 'target_solids')?.value ?? baseTargetPct;
}

/**
 * What makes two variants the same: the same ingredients at the same grams (to 0.001 g) boiled to
 * the same target soluble solids (to 0.01 %). Lines given as % of fruit keep their unit in the key,
 * so they never match grams by accident.
 */
export function variantLinesKey(lines: ReadonlyArray<{ ingredientId: string; quantity: number; unit: string }>, targetSolidsPct?: number): string {
  const key = lines.map((l) => `${l.ingredientId}:${l.quantity.toFixed(3)}${l.unit}`).sort().join('|');
  return targetSolidsPct === undefined ? key : `${key}@${targetSolidsPct.toFixed(2)}`;
}
