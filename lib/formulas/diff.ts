/**
 * Line-by-line difference between two formula revisions. Pure: the history page renders it on
 * the server, and nothing here touches a framework or the database.
 */
import type { IngredientComposition } from '@/lib/chemistry';
import type { FormulaRevisionView, FormulaSettingsInput, RevisionLine } from './schema';

export type SettingsField = keyof FormulaSettingsInput;
export type SettingValue = string | number | null;

export interface SettingChange {
  field: SettingsField;
  label: string;
  before: SettingValue;
  after: SettingValue;
}

/** Scalar composition fields; the sugar profile (label data feeding water activity) is compared on the label, not here. */
export type CompositionField = Exclude<keyof IngredientComposition, 'sugars'>;
export type CompositionValue = string | number | boolean | null;

export interface CompositionChange {
  field: CompositionField;
  label: string;
  before: CompositionValue;
  after: CompositionValue;
}

/** What the diff table shows of a line: the stored quantity (g or % of fruit) and the snapshot's solids. */
export interface LineSnapshot {
  quantity: number;
  unit: RevisionLine['unit'];
  solidsPct: number;
}

export type LineDiffStatus = 'added' | 'removed' | 'changed' | 'unchanged';

export interface LineDiff {
  status: LineDiffStatus;
  ingredientId: string;
  /** The newer name where the line exists in both revisions. */
  ingredientName: string;
  before?: LineSnapshot;
  after?: LineSnapshot;
  /** Changed keys: 'quantity', 'unit' and 'ingredient.<field>' for the ingredient snapshot. */
  changes: string[];
  /** The ingredient's own values that differ between the two snapshots (e.g. solids 10 → 11 %). */
  compositionChanges: CompositionChange[];
}

export interface RevisionDiff {
  beforeRevision: number;
  afterRevision: number;
  name: { before: string; after: string } | null;
  settings: SettingChange[];
  lines: LineDiff[];
  /** True when nothing differs: same name, settings, lines and ingredient snapshots. */
  identical: boolean;
}

export const SETTINGS_FIELD_LABELS: Record<SettingsField, string> = {
  productClass: 'Product class',
  ruleSet: 'Market rule set',
  ruleDate: 'Rule date (production / labelling)',
  targetSolidsPct: 'Target soluble solids (%)',
  jarNetFillG: 'Jar net fill (g)',
  altitudeM: 'Altitude (m)',
  measuredWaterBoilingC: 'Measured water boiling point (°C)',
  plannedPh: 'Planned pH',
  preservation: 'Preservation (reduced sugar)',
  sucroseInversionPct: 'Sucrose inverted in the boil (%)',
};

export const COMPOSITION_FIELD_LABELS: Record<CompositionField, string> = {
  name: 'Name',
  kind: 'Kind',
  solidsPct: 'Soluble solids (%)',
  phMin: 'pH, lower',
  phMax: 'pH, upper',
  acidPct: 'Acid (% as citric)',
  pectinLevel: 'Pectin level',
  euFruitGroup: 'EU fruit group',
  usFruitGroup: 'US fruit group',
  pectinType: 'Pectin type',
  pectinGrade: 'Pectin grade',
  sweetenerType: 'Sweetener type',
  acidType: 'Acid type',
  calciumSource: 'Calcium source',
};

const SETTINGS_FIELDS = Object.keys(SETTINGS_FIELD_LABELS) as SettingsField[];
const COMPOSITION_FIELDS = Object.keys(COMPOSITION_FIELD_LABELS) as CompositionField[];

/** Stored values pass through JSON and arithmetic, so 0.1 + 0.2 must still equal 0.3. */
const RELATIVE_TOLERANCE = 1e-9;

function sameNumber(a: number, b: number): boolean {
  if (a === b) return true;
  return Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

/** undefined and null both mean "not given"; an optional field absent in one revision and null in the other is no change. */
function normalise<T>(value: T | null | undefined): T | null {
  return value === undefined ? null : value;
}

function sameValue(a: unknown, b: unknown): boolean {
  const x = normalise(a);
  const y = normalise(b);
  if (typeof x === 'number' && typeof y === 'number') return sameNumber(x, y);
  return x === y;
}

function diffSettings(before: FormulaSettingsInput, after: FormulaSettingsInput): SettingChange[] {
  const changes: SettingChange[] = [];
  for (const field of SETTINGS_FIELDS) {
    const a = normalise(before[field]);
    const b = normalise(after[field]);
    if (!sameValue(a, b)) changes.push({ field, label: SETTINGS_FIELD_LABELS[field], before: a, after: b });
  }
  return changes;
}

export function diffComposition(before: IngredientComposition, after: IngredientComposition): CompositionChange[] {
  const changes: CompositionChange[] = [];
  for (const field of COMPOSITION_FIELDS) {
    const a = normalise(before[field]);
    const b = normalise(after[field]);
    if (!sameValue(a, b)) changes.push({ field, label: COMPOSITION_FIELD_LABELS[field], before: a, after: b });
  }
  return changes;
}

function snapshot(line: RevisionLine): LineSnapshot {
  return { quantity: line.quantity, unit: line.unit, solidsPct: line.ingredient.solidsPct };
}

/** Pairs lines by ingredient id; the k-th occurrence of an ingredient pairs with its k-th occurrence. */
function pairLines(before: RevisionLine[], after: RevisionLine[]): { afterToBefore: (number | null)[]; matchedBefore: Set<number> } {
  const queues = new Map<string, number[]>();
  before.forEach((line, index) => {
    const queue = queues.get(line.ingredientId);
    if (queue) queue.push(index);
    else queues.set(line.ingredientId, [index]);
  });
  const matchedBefore = new Set<number>();
  const afterToBefore = after.map((line) => {
    const match = queues.get(line.ingredientId)?.shift();
    if (match === undefined) return null;
    matchedBefore.add(match);
    return match;
  });
  return { afterToBefore, matchedBefore };
}

function pairedLineDiff(before: RevisionLine, after: RevisionLine): LineDiff {
  const changes: string[] = [];
  if (!sameNumber(before.quantity, after.quantity)) changes.push('quantity');
  if (before.unit !== after.unit) changes.push('unit');
  const compositionChanges = diffComposition(before.ingredient, after.ingredient);
  for (const c of compositionChanges) changes.push(`ingredient.${c.field}`);
  return {
    status: changes.length ? 'changed' : 'unchanged',
    ingredientId: after.ingredientId,
    ingredientName: after.ingredient.name,
    before: snapshot(before),
    after: snapshot(after),
    changes,
    compositionChanges,
  };
}

/**
 * Lines come out in the newer revision's order. A removed line is placed right after the line
 * that preceded it in the older revision, so it shows where it used to be.
 */
export function diffRevisions(before: FormulaRevisionView, after: FormulaRevisionView): RevisionDiff {
  const { afterToBefore, matchedBefore } = pairLines(before.lines, after.lines);

  const removedAfter = new Map<number, LineDiff[]>(); // key: output slot of the preceding matched line, -1 = top
  const outputSlotOfBefore = new Map<number, number>();
  afterToBefore.forEach((beforeIndex, afterIndex) => {
    if (beforeIndex !== null) outputSlotOfBefore.set(beforeIndex, afterIndex);
  });
  let previousSlot = -1;
  before.lines.forEach((line, beforeIndex) => {
    if (matchedBefore.has(beforeIndex)) {
      previousSlot = outputSlotOfBefore.get(beforeIndex) ?? previousSlot;
      return;
    }
    const removed: LineDiff = {
      status: 'removed',
      ingredientId: line.ingredientId,
      ingredientName: line.ingredient.name,
      before: snapshot(line),
      changes: [],
      compositionChanges: [],
    };
    const bucket = removedAfter.get(previousSlot);
    if (bucket) bucket.push(removed);
    else removedAfter.set(previousSlot, [removed]);
  });

  const lines: LineDiff[] = [...(removedAfter.get(-1) ?? [])];
  after.lines.forEach((line, afterIndex) => {
    const beforeIndex = afterToBefore[afterIndex];
    if (beforeIndex === null) {
      lines.push({
        status: 'added',
        ingredientId: line.ingredientId,
        ingredientName: line.ingredient.name,
        after: snapshot(line),
        changes: [],
        compositionChanges: [],
      });
    } else {
      lines.push(pairedLineDiff(before.lines[beforeIndex], line));
    }
    lines.push(...(removedAfter.get(afterIndex) ?? []));
  });

  const name = before.name === after.name ? null : { before: before.name, after: after.name };
  const settings = diffSettings(before.settings, after.settings);
  return {
    beforeRevision: before.number,
    afterRevision: after.number,
    name,
    settings,
    lines,
    identical: name === null && settings.length === 0 && lines.every((l) => l.status === 'unchanged'),
  };
}
