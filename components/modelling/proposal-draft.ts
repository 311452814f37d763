/**
 * The proposal form's typed text → an optimiser request, with a clear message per field for what
 * cannot be used (a lower limit at or above the upper, an importance of 0 or less, text that is no
 * number). PURE: the form checks before it searches, and nothing changes while a field is wrong.
 */
import { readDecimal } from '@/lib/format/numbers';
import type { Goal } from '@/lib/models';
import { FACTOR_INFO, type FamilyModel, type ModelFactor, type ResponseModel } from '@/lib/modelling/schema';
import { COST_CEILING_TOO_HIGH, MAX_COST_CEILING_PER_JAR, type ProposalRequest } from '@/lib/modelling/proposals';
import { minorDigits } from '@/lib/pricing/money';

export type GoalKind = 'none' | 'maximise' | 'minimise' | 'target' | 'band';

export const GOAL_KIND_LABELS: Record<GoalKind, string> = {
  none: 'No goal',
  maximise: 'As high as possible',
  minimise: 'As low as possible',
  target: 'At a target',
  band: 'Within a band',
};

export interface GoalDraft {
  kind: GoalKind;
  /** Least acceptable (maximise), worst acceptable (minimise), or the lower limit of a target/band. */
  low: string;
  /** Fully satisfying (maximise/minimise), or the upper limit of a target/band. */
  high: string;
  target: string;
  bandLow: string;
  bandHigh: string;
  importance: string;
}

export interface ProposalDraft {
  goals: Record<string, GoalDraft>;
  factors: Record<string, { low: string; high: string }>;
  fruitMinimum: string;
  phLow: string;
  phHigh: string;
  /** Cost ceiling per jar in the workspace currency (blank: none). */
  costCeiling: string;
}

const fmt = (v: number, d: number) => v.toFixed(d);

/** Starting goals: liking as high as possible, set firmness within a band, tartness at a target (by the attribute's library key). */
export function defaultGoal(response: ResponseModel): GoalDraft {
  const min = response.scale?.min ?? 0;
  const max = response.scale?.max ?? 10;
  const span = max - min;
  const d = response.decimals;
  const at = (share: number) => fmt(min + share * span, d);
  const blank = { low: '', high: '', target: '', bandLow: '', bandHigh: '', importance: '1' };
  switch (response.libraryKey) {
    case 'overall-liking':
      return { ...blank, kind: 'maximise', low: at(0.5), high: at(0.875), importance: '3' };
    case 'set-firmness':
      return { ...blank, kind: 'band', low: at(0.2), bandLow: at(0.4), bandHigh: at(0.7), high: at(0.9), importance: '2' };
    case 'tartness':
      return { ...blank, kind: 'target', low: at(0.2), target: at(0.5), high: at(0.8), importance: '1' };
    default:
      return { ...blank, kind: 'none' };
  }
}

/** The search box a family's data spans: each factor's lowest and highest value over every response's data. */
export function dataRanges(model: FamilyModel): Array<{ name: ModelFactor; low: number; high: number }> {
  return model.factors.map((name) => {
    const boxes = model.responses.map((r) => r.surface.dataBox.find((b) => b.name === name)!);
    return { name, low: Math.min(...boxes.map((b) => b.low)), high: Math.max(...boxes.map((b) => b.high)) };
  });
}

export function defaultDraft(model: FamilyModel, fruitMinimum: number | null): ProposalDraft {
  return {
    goals: Object.fromEntries(model.responses.filter((r) => r.key !== 'lab:measuredPh').map((r) => [r.key, defaultGoal(r)])),
    factors: Object.fromEntries(dataRanges(model).map((r) => [r.name, { low: fmt(r.low, FACTOR_INFO[r.name].decimals), high: fmt(r.high, FACTOR_INFO[r.name].decimals) }])),
    fruitMinimum: fruitMinimum === null ? '' : String(fruitMinimum),
    phLow: '3.0',
    phHigh: '3.6',
    costCeiling: '',
  };
}

export type DraftOutcome = { ok: true; request: ProposalRequest } | { ok: false; errors: Record<string, string> };

/**
 * Reads the draft; `errors` is keyed by field ("goal.<key>.low", "factor.<name>.high", "fruitMinimum",
 * "ph", "costCeiling"). `currency` is the workspace's, for the cost ceiling (null: none set).
 */
export function readProposalDraft(model: FamilyModel, draft: ProposalDraft, currency: string | null = null): DraftOutcome {
  const errors: Record<string, string> = {};
  const number = (field: string, text: string, what: string): number => {
    const value = readDecimal(text);
    if (value === null || !Number.isFinite(value)) {
      errors[field] ??= `${what}: enter a number.`;
      return Number.NaN;
    }
    return value;
  };
  const goals: ProposalRequest['goals'] = [];
  for (const response of model.responses) {
    const g = draft.goals[response.key];
    if (!g || g.kind === 'none') continue;
    const key = `goal.${response.key}`;
    const name = response.name;
    const importance = number(`${key}.importance`, g.importance, `Importance of ${name}`);
    if (importance <= 0) errors[`${key}.importance`] = `The importance of ${name} must be above 0.`;
    else if (importance > 10) errors[`${key}.importance`] = `The importance of ${name} must be at most 10.`;
    const low = number(`${key}.low`, g.low, `Lower limit of ${name}`);
    const high = number(`${key}.high`, g.high, `Upper limit of ${name}`);
    let goal: Goal;
    if (g.kind === 'maximise' || g.kind === 'minimise') {
      if (low >= high) errors[`${key}.low`] = `The lower limit of ${name} must be below its upper limit.`;
      goal = { kind: g.kind, low, high };
    } else if (g.kind === 'target') {
      const target = number(`${key}.target`, g.target, `Target of ${name}`);
      if (!(low < target && target < high)) errors[`${key}.target`] = `The target of ${name} must lie between its lower and upper limits.`;
      goal = { kind: 'target', low, target, high };
    } else {
      const bandLow = number(`${key}.bandLow`, g.bandLow, `Band start of ${name}`);
      const bandHigh = number(`${key}.bandHigh`, g.bandHigh, `Band end of ${name}`);
      if (!(low < bandLow && bandLow <= bandHigh && bandHigh < high)) errors[`${key}.bandLow`] = `The band of ${name} must lie between its lower and upper limits, start before its end.`;
      goal = { kind: 'band', low, bandLow, bandHigh, high };
    }
    goals.push({ response: response.key, goal, importance });
  }
  if (goals.length === 0) errors.goals = 'State at least one goal.';
  const factors = model.factors.map((name) => {
    const text = draft.factors[name] ?? { low: '', high: '' };
    const label = FACTOR_INFO[name].name;
    const low = number(`factor.${name}.low`, text.low, `Lowest ${label.toLowerCase()}`);
    const high = number(`factor.${name}.high`, text.high, `Highest ${label.toLowerCase()}`);
    if (low < 0) errors[`factor.${name}.low`] = `${label} cannot be below 0.`;
    if (low >= high) errors[`factor.${name}.low`] = `The lowest ${label.toLowerCase()} must be below the highest.`;
    return { name, low, high };
  });
  let fruitMinimumPer1000g: number | undefined;
  if (draft.fruitMinimum.trim() !== '') {
    fruitMinimumPer1000g = number('fruitMinimum', draft.fruitMinimum, 'Fruit minimum');
    if (fruitMinimumPer1000g < 0 || fruitMinimumPer1000g > 1000) errors.fruitMinimum = 'The fruit minimum lies between 0 and 1000 g per 1000 g.';
  }
  let ph: ProposalRequest['ph'];
  if (draft.phLow.trim() !== '' || draft.phHigh.trim() !== '') {
    const low = number('ph', draft.phLow, 'Lowest pH');
    const high = number('ph', draft.phHigh, 'Highest pH');
    if (!(low >= 0 && high <= 14)) errors.ph = 'pH runs from 0 to 14.';
    else if (low >= high) errors.ph = 'The lowest pH must be below the highest.';
    ph = { low, high };
  }
  let costCeilingPerJarMinor: number | undefined;
  if (draft.costCeiling.trim() !== '') {
    const ceiling = number('costCeiling', draft.costCeiling, 'Cost ceiling per jar');
    if (!currency) errors.costCeiling = 'A cost ceiling needs the workspace currency: an administrator sets it, then enters prices.';
    else if (!(ceiling > 0)) errors.costCeiling ??= 'The cost ceiling per jar must be above 0.';
    else if (ceiling > MAX_COST_CEILING_PER_JAR) errors.costCeiling = COST_CEILING_TOO_HIGH;
    else costCeilingPerJarMinor = ceiling * 10 ** minorDigits(currency);
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  return { ok: true, request: { factors, goals, fruitMinimumPer1000g, ph, costCeilingPerJarMinor, proposals: 3 } };
}
