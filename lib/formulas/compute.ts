/**
 * The bridge from stored formula data to lib/chemistry. Pure: the editor runs it in the
 * browser on every keystroke, and the server runs the same code when it saves or serves.
 */
import { computeBatch, toGrams, ChemistryInputError, type BatchComputation, type FormulaLineInput, type FormulaSettings, type IngredientComposition } from '@/lib/chemistry';
import { SMALLEST_AMOUNT } from '@/lib/input';
import { formulaSettingsSchema, type FormulaSettingsInput } from './schema';

export interface ComputableLine {
  ingredient: IngredientComposition;
  quantity: number;
  unit: FormulaLineInput['unit'];
}

/** Drops nulls so optional settings reach the chemistry module as absent. */
export function toChemistrySettings(s: FormulaSettingsInput): FormulaSettings {
  return {
    productClass: s.productClass,
    ruleSet: s.ruleSet,
    ruleDate: s.ruleDate,
    targetSolidsPct: s.targetSolidsPct,
    jarNetFillG: s.jarNetFillG,
    ...(s.altitudeM != null ? { altitudeM: s.altitudeM } : {}),
    ...(s.measuredWaterBoilingC != null ? { measuredWaterBoilingC: s.measuredWaterBoilingC } : {}),
    ...(s.plannedPh != null ? { plannedPh: s.plannedPh } : {}),
    ...(s.preservation != null ? { preservation: s.preservation } : {}),
    ...(s.sucroseInversionPct != null ? { sucroseInversionPct: s.sucroseInversionPct } : {}),
  };
}

export type ComputeOutcome =
  | { ok: true; computation: BatchComputation }
  | { ok: false; field: string; message: string };

/**
 * A value saving refuses today but an older row may still hold (a jar fill of 1e-320 g was saved
 * before the bounds): the chemistry would divide by it and print nonsense (jar counts of Infinity),
 * so it is named as needing correction instead. The row itself is left as it is.
 */
// Built once: zod compiles a schema on its first parse, and a schema made per call (`.strip()` in
// the function) was compiled on every formula computed, several times per page.
const storedSettingsSchema = formulaSettingsSchema.strip();

export function storedValueProblem(settings: FormulaSettingsInput, lines: ReadonlyArray<{ quantity: number }>): { field: string; rule: string } | null {
  // Not strict: a key an older revision kept is not a wrong value.
  const check = storedSettingsSchema.safeParse(settings);
  if (!check.success) {
    const issue = check.error.issues[0];
    return { field: ['settings', ...issue.path.map(String)].join('.'), rule: issue.message };
  }
  const tiny = lines.findIndex((l) => !Number.isFinite(l.quantity) || (l.quantity !== 0 && Math.abs(l.quantity) < SMALLEST_AMOUNT));
  if (tiny >= 0) return { field: `lines[${tiny}].quantity`, rule: `Quantity must be at least ${SMALLEST_AMOUNT}.` };
  return null;
}

export function computeFormula(settings: FormulaSettingsInput, lines: ComputableLine[]): ComputeOutcome {
  const problem = storedValueProblem(settings, lines);
  if (problem) return { ok: false, field: problem.field, message: `Needs correcting before it can be used: ${problem.rule}` };
  try {
    return {
      ok: true,
      computation: computeBatch(
        lines.map((l) => ({ ingredient: l.ingredient, quantity: l.quantity, unit: l.unit })),
        toChemistrySettings(settings),
      ),
    };
  } catch (err) {
    if (err instanceof ChemistryInputError) return { ok: false, field: err.field, message: err.message };
    throw err;
  }
}

/** Entered units become the stored form: grams, or percent of the fruit mass. */
export function normaliseQuantity(quantity: number, unit: 'g' | 'kg' | 'lb' | 'oz' | 'pct_fruit'): { quantity: number; unit: 'g' | 'pct_fruit' } {
  if (unit === 'pct_fruit' || unit === 'g') return { quantity, unit };
  return { quantity: toGrams(quantity, unit), unit: 'g' };
}

/** 'lines[2].quantity' (chemistry) → 'lines.2.quantity' (zod-style, as forms expect). */
export function chemistryFieldPath(field: string): string {
  return field.replace(/\[(\d+)\]/g, '.$1');
}
