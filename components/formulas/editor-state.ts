/**
 * Pure helpers of the formula editor: entered text ↔ stored values (grams, metres, °C), unit
 * toggles without drift, the live computation and the mapping of server field errors.
 * No React or Next imports, so every rule here is unit-testable on its own.
 */
import {
  fromGrams,
  isMassUnit,
  SUCROSE_BOILING_TABLE,
  toGrams,
  type LineUnit,
  type MassUnit,
  type PreservationMethod,
  type UnitPreference,
} from '@/lib/chemistry';
import { computeFormula, type ComputableLine, type ComputeOutcome } from '@/lib/formulas/compute';
import { formulaSettingsSchema, type FormulaSettingsInput } from '@/lib/formulas/schema';
import type { EditorIngredient } from '@/lib/ingredients/schema';
import { readDecimal } from '@/lib/format/numbers';
import { type DisplayScale, ENTRY_DECIMALS, type MeasuredDraft, type TemperatureUnit, altitudeScale, draftFromBase, draftFromText, formatEntryNumber, jarFillScale, redisplayDraft, temperatureScale } from '@/lib/format/quantities';

export type ProductClassId = FormulaSettingsInput['productClass'];
export type RuleSetId = FormulaSettingsInput['ruleSet'];

/** Parses a typed decimal ("1,5" allowed). null = empty, NaN = not a number. */
export const parseDecimal = readDecimal;

/** `base` is grams for mass units and percent of fruit for `pct_fruit`; null empty, NaN invalid. */
export interface LineDraft {
  key: string;
  ingredientId: string;
  unit: LineUnit;
  text: string;
  base: number | null;
}

export const LINE_UNIT_LABELS: Record<LineUnit, string> = { g: 'g', kg: 'kg', lb: 'lb', oz: 'oz', pct_fruit: '% of fruit' };

export function defaultLineUnit(system: UnitPreference): MassUnit {
  return system === 'metric' ? 'g' : 'oz';
}

function baseFromText(text: string, unit: LineUnit): number | null {
  const parsed = parseDecimal(text);
  if (parsed === null || Number.isNaN(parsed)) return parsed;
  return unit === 'pct_fruit' ? parsed : toGrams(parsed, unit);
}

export function newLineDraft(key: string, system: UnitPreference, ingredientId = ''): LineDraft {
  return { key, ingredientId, unit: defaultLineUnit(system), text: '', base: null };
}

/** A stored line (grams or % of fruit) as the editor shows it in the chosen unit system. */
export function lineDraftFromStored(
  key: string,
  stored: { ingredientId: string; quantity: number; unit: 'g' | 'pct_fruit' },
  system: UnitPreference,
): LineDraft {
  if (stored.unit === 'pct_fruit') {
    return { key, ingredientId: stored.ingredientId, unit: 'pct_fruit', text: formatEntryNumber(stored.quantity, ENTRY_DECIMALS.pct_fruit), base: stored.quantity };
  }
  const inGrams: LineDraft = { key, ingredientId: stored.ingredientId, unit: 'g', text: formatEntryNumber(stored.quantity, ENTRY_DECIMALS.g), base: stored.quantity };
  return convertLineForSystem(inGrams, system);
}

export function setLineText(line: LineDraft, text: string): LineDraft {
  return { ...line, text, base: baseFromText(text, line.unit) };
}

/** Changing a line's unit keeps the typed number: the user is saying which unit it was in. */
export function setLineUnit(line: LineDraft, unit: LineUnit): LineDraft {
  return { ...line, unit, base: baseFromText(line.text, unit) };
}

/** g ↔ oz and kg ↔ lb; % of fruit stays. */
export function counterpartUnit(unit: LineUnit, system: UnitPreference): LineUnit {
  if (system === 'imperial') return unit === 'g' ? 'oz' : unit === 'kg' ? 'lb' : unit;
  return unit === 'oz' ? 'g' : unit === 'lb' ? 'kg' : unit;
}

/** Converts a line in place for a unit system, from the stored grams (no drift). */
export function convertLineForSystem(line: LineDraft, system: UnitPreference): LineDraft {
  const unit = counterpartUnit(line.unit, system);
  if (unit === line.unit) return line;
  if (line.base === null || !Number.isFinite(line.base) || !isMassUnit(unit)) return { ...line, unit, base: baseFromText(line.text, unit) };
  return { ...line, unit, text: formatEntryNumber(fromGrams(line.base, unit), ENTRY_DECIMALS[unit]), base: line.base };
}

/** Quantity to send, in the line's own unit at full precision; NaN when empty or invalid. */
export function lineQuantityForSave(line: LineDraft): number {
  if (line.base === null || !Number.isFinite(line.base)) return Number.NaN;
  return line.unit === 'pct_fruit' ? line.base : fromGrams(line.base, line.unit);
}

export function linesForSave(lines: LineDraft[]): Array<{ ingredientId: string; quantity: number; unit: LineUnit }> {
  return lines.map((l) => ({ ingredientId: l.ingredientId, quantity: lineQuantityForSave(l), unit: l.unit }));
}

/** Moves the item at `index` by `offset` (−1 up, +1 down); out-of-range moves return the same array. */
export function moveItem<T>(items: T[], index: number, offset: -1 | 1): T[] {
  const target = index + offset;
  if (index < 0 || index >= items.length || target < 0 || target >= items.length) return items;
  const next = items.slice();
  [next[index], next[target]] = [next[target], next[index]];
  return next;
}

/* ---------- settings ---------- */

export type BoilingReference = 'altitude' | 'measured';

export interface SettingsDraft {
  productClass: ProductClassId;
  ruleSet: RuleSetId;
  ruleDate: string;
  targetSolids: MeasuredDraft;
  jarFill: MeasuredDraft;
  boilingReference: BoilingReference;
  altitude: MeasuredDraft;
  measuredBoiling: MeasuredDraft;
  plannedPh: MeasuredDraft;
  /** % of the sucrose inverted during the boil; empty: none assumed. */
  sucroseInversion: MeasuredDraft;
  /** '' while not stated. */
  preservation: PreservationMethod | '';
}

const IDENTITY_SCALE: DisplayScale = { toDisplay: (v) => v, toBase: (v) => v, decimals: 3, unitLabel: '' };

/** Local calendar date as YYYY-MM-DD (the rule date is a production/labelling day, not an instant). */
export function todayIso(now: Date = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** A 12 oz jar for imperial users and 340 g for metric ones (common practice, no published source). */
export const DEFAULT_JAR_FILL_G: Record<UnitPreference, number> = { metric: 340, imperial: toGrams(12, 'oz') };
export const DEFAULT_TARGET_SOLIDS_PCT = 65;

export function initialSettingsDraft(options: {
  settings?: Partial<FormulaSettingsInput>;
  system: UnitPreference;
  temperatureUnit: TemperatureUnit;
  today?: string;
}): SettingsDraft {
  const s = options.settings ?? {};
  return {
    productClass: s.productClass ?? 'jam',
    ruleSet: s.ruleSet ?? 'eu',
    ruleDate: s.ruleDate ?? options.today ?? todayIso(),
    targetSolids: draftFromBase(s.targetSolidsPct ?? DEFAULT_TARGET_SOLIDS_PCT, IDENTITY_SCALE),
    jarFill: draftFromBase(s.jarNetFillG ?? DEFAULT_JAR_FILL_G[options.system], jarFillScale(options.system)),
    boilingReference: s.measuredWaterBoilingC != null && s.altitudeM == null ? 'measured' : 'altitude',
    altitude: draftFromBase(s.altitudeM, altitudeScale(options.system)),
    measuredBoiling: draftFromBase(s.measuredWaterBoilingC, temperatureScale(options.temperatureUnit)),
    plannedPh: draftFromBase(s.plannedPh, IDENTITY_SCALE),
    sucroseInversion: draftFromBase(s.sucroseInversionPct, IDENTITY_SCALE),
    preservation: s.preservation ?? '',
  };
}

export function settingsTextToDraft(text: string): MeasuredDraft {
  return draftFromText(text, IDENTITY_SCALE);
}

export function convertSettingsForSystem(draft: SettingsDraft, system: UnitPreference): SettingsDraft {
  return { ...draft, jarFill: redisplayDraft(draft.jarFill, jarFillScale(system)), altitude: redisplayDraft(draft.altitude, altitudeScale(system)) };
}

export function convertSettingsForTemperature(draft: SettingsDraft, unit: TemperatureUnit): SettingsDraft {
  return { ...draft, measuredBoiling: redisplayDraft(draft.measuredBoiling, temperatureScale(unit)) };
}

/** NaN marks a required number that is missing or unreadable, so validation names the field. */
function requiredNumber(draft: MeasuredDraft): number {
  return draft.base === null ? Number.NaN : draft.base;
}

/** The settings as the schema and the chemistry want them: g, m, °C; only the chosen boiling reference. */
export function settingsFromDraft(draft: SettingsDraft): FormulaSettingsInput {
  const useAltitude = draft.boilingReference === 'altitude';
  return {
    productClass: draft.productClass,
    ruleSet: draft.ruleSet,
    ruleDate: draft.ruleDate,
    targetSolidsPct: requiredNumber(draft.targetSolids),
    jarNetFillG: requiredNumber(draft.jarFill),
    altitudeM: useAltitude ? draft.altitude.base : null,
    measuredWaterBoilingC: useAltitude ? null : draft.measuredBoiling.base,
    plannedPh: draft.plannedPh.base,
    preservation: draft.preservation || null,
    sucroseInversionPct: draft.sucroseInversion.base,
  };
}

/* ---------- live computation ---------- */

export interface EditorComputation {
  /** null = no usable line yet (the "add your first ingredient" state). */
  outcome: ComputeOutcome | null;
  /** The lines that went into the computation (grams or % of fruit). */
  lines: ComputableLine[];
  /** Editor line keys in the order of the computed lines (massBalance.lines[i] ↔ lineKeys[i]). */
  lineKeys: string[];
  /** Lines left out because they lack an ingredient or a readable quantity. */
  skippedLineKeys: string[];
  /** The settings' errors by the save schema (`settings.…` → messages), shown at their fields as they are typed. */
  settingsErrors: Record<string, string[]>;
}

const SETTING_LABELS: Record<string, string> = {
  'settings.targetSolidsPct': 'Target final soluble solids',
  'settings.jarNetFillG': 'Jar net fill',
  'settings.altitudeM': 'Kitchen altitude',
  'settings.measuredWaterBoilingC': 'Measured water boiling point',
  'settings.plannedPh': 'Planned pH',
  'settings.sucroseInversionPct': 'Sucrose inverted in the boil',
  'settings.ruleDate': 'Rule date',
  lines: 'Lines',
};

/** Rewrites "lines[2].quantity: …" as "Line 3 (Sugar): …" using the editor's own numbering. */
export function friendlyComputeMessage(field: string, message: string, lineLabels: string[]): string {
  const detail = message.startsWith(`${field}: `) ? message.slice(field.length + 2) : message;
  const lineMatch = /^lines\[(\d+)\]/.exec(field);
  if (lineMatch) {
    const label = lineLabels[Number(lineMatch[1])];
    return `${label ?? `Line ${Number(lineMatch[1]) + 1}`}: ${detail}`;
  }
  const label = SETTING_LABELS[field];
  return label ? `${label}: ${detail}` : detail.charAt(0).toUpperCase() + detail.slice(1);
}

export function ingredientIndex(ingredients: EditorIngredient[]): Map<string, EditorIngredient> {
  return new Map(ingredients.map((i) => [i.id, i]));
}

/**
 * The settings' field errors by formulaSettingsSchema, the rule saving applies. The chemistry accepts
 * wider ranges (any pH 0–14, altitude to 11 km), so without this the results showed what saving refuses.
 */
export function settingsFieldErrors(settings: FormulaSettingsInput): Record<string, string[]> {
  const check = formulaSettingsSchema.safeParse(settings);
  if (check.success) return {};
  return issuesToFieldErrors(check.error.issues.map((issue) => ({ ...issue, path: ['settings', ...issue.path] })));
}

/**
 * Runs computeFormula on the lines that are complete enough; incomplete ones are reported, not guessed.
 * Settings the save would refuse give no results, only their message.
 */
export function computeEditor(settings: SettingsDraft, lines: LineDraft[], ingredientsById: Map<string, EditorIngredient>): EditorComputation {
  const settingsInput = settingsFromDraft(settings);
  const settingsErrors = settingsFieldErrors(settingsInput);
  const computable: ComputableLine[] = [];
  const lineKeys: string[] = [];
  const lineLabels: string[] = [];
  const skippedLineKeys: string[] = [];
  lines.forEach((line, index) => {
    const ingredient = ingredientsById.get(line.ingredientId);
    if (!ingredient || line.base === null || !Number.isFinite(line.base)) {
      skippedLineKeys.push(line.key);
      return;
    }
    computable.push({
      ingredient,
      quantity: line.base,
      unit: line.unit === 'pct_fruit' ? 'pct_fruit' : 'g',
    });
    lineKeys.push(line.key);
    lineLabels.push(`Line ${index + 1} (${ingredient.name})`);
  });
  const parts = { lines: computable, lineKeys, skippedLineKeys, settingsErrors };
  if (computable.length === 0) return { outcome: null, ...parts };
  if (!computable.some((l) => l.ingredient.kind === 'fruit')) {
    return { outcome: { ok: false, field: 'lines', message: 'Add a fruit line to see results.' }, ...parts };
  }
  const [settingField, messages] = Object.entries(settingsErrors)[0] ?? [];
  if (settingField) return { outcome: { ok: false, field: settingField, message: friendlyComputeMessage(settingField, messages[0], lineLabels) }, ...parts };
  const outcome = computeFormula(settingsInput, computable);
  if (outcome.ok) return { outcome, ...parts };
  return { outcome: { ...outcome, message: friendlyComputeMessage(outcome.field, outcome.message, lineLabels) }, ...parts };
}

/* ---------- field errors from the server (or the shared schema) ---------- */

export type LineField = 'ingredientId' | 'quantity' | 'unit';

export interface MappedFieldErrors {
  /** name, note, settings.* and lines (the array itself). */
  fields: Record<string, string[]>;
  /** By editor line key. */
  lines: Record<string, Partial<Record<LineField, string[]>>>;
  /** Anything that matches no input, shown in the summary. */
  unplaced: string[];
}

/** Input names the editor can place an error next to. */
export const PLACEABLE_FIELDS: readonly string[] = [
  'name',
  'note',
  'lines',
  'settings.productClass',
  'settings.ruleSet',
  'settings.ruleDate',
  'settings.targetSolidsPct',
  'settings.jarNetFillG',
  'settings.altitudeM',
  'settings.measuredWaterBoilingC',
  'settings.plannedPh',
  'settings.sucroseInversionPct',
];

/** reviseFormulaAction wraps its input as `change`, other callers as `data`. */
export function stripFieldPrefix(key: string): string {
  return key.replace(/^(change|data)\./, '');
}

/** Maps dotted zod paths to inputs; `lines.N.*` goes to the line that was N-th when it was sent. */
export function mapFieldErrors(fields: Record<string, string[]> | undefined, sentLineKeys: string[]): MappedFieldErrors {
  const mapped: MappedFieldErrors = { fields: {}, lines: {}, unplaced: [] };
  for (const [rawKey, messages] of Object.entries(fields ?? {})) {
    const key = stripFieldPrefix(rawKey);
    const lineMatch = /^lines\.(\d+)\.(ingredientId|quantity|unit)$/.exec(key);
    if (lineMatch) {
      const lineKey = sentLineKeys[Number(lineMatch[1])];
      if (lineKey !== undefined) {
        const field = lineMatch[2] as LineField;
        const entry = (mapped.lines[lineKey] ??= {});
        entry[field] = [...(entry[field] ?? []), ...messages];
        continue;
      }
    }
    if (/^lines\.\d+$/.test(key)) {
      const lineKey = sentLineKeys[Number(key.split('.')[1])];
      if (lineKey !== undefined) {
        const entry = (mapped.lines[lineKey] ??= {});
        entry.ingredientId = [...(entry.ingredientId ?? []), ...messages];
        continue;
      }
    }
    if (PLACEABLE_FIELDS.includes(key)) {
      mapped.fields[key] = [...(mapped.fields[key] ?? []), ...messages];
      continue;
    }
    mapped.unplaced.push(...messages);
  }
  return mapped;
}

/** Dotted-path field errors from schema issues, the same shape the server sends. */
export function issuesToFieldErrors(issues: ReadonlyArray<{ path: ReadonlyArray<PropertyKey>; message: string }>): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

export function hasAnyFieldError(errors: MappedFieldErrors): boolean {
  return Object.keys(errors.fields).length > 0 || Object.keys(errors.lines).length > 0 || errors.unplaced.length > 0;
}

/** True while any field, line or unplaced error is left to fix. */
export function hasFieldErrors(errors: MappedFieldErrors): boolean {
  return Object.keys(errors.fields).length > 0 || Object.values(errors.lines).some((l) => Object.keys(l).length > 0) || errors.unplaced.length > 0;
}

export const EMPTY_FIELD_ERRORS: MappedFieldErrors = { fields: {}, lines: {}, unplaced: [] };

/* ---------- sources of the sucrose boiling table rows used ---------- */

/** The published rows the syrup boiling point was interpolated from (their own source texts). */
export function sucroseTableSourcesFor(targetSolidsPct: number): string[] {
  if (!Number.isFinite(targetSolidsPct)) return [];
  const rows = SUCROSE_BOILING_TABLE;
  const exact = rows.find((r) => r.solidsPct === targetSolidsPct);
  const picked = exact ? [exact] : rows.filter((r, i) => {
    const next = rows[i + 1];
    const previous = rows[i - 1];
    return (next && r.solidsPct < targetSolidsPct && next.solidsPct > targetSolidsPct) ||
      (previous && previous.solidsPct < targetSolidsPct && r.solidsPct > targetSolidsPct);
  });
  return [...new Set(picked.map((r) => `${r.solidsPct} %: ${r.source}`))];
}
