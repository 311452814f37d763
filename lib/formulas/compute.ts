/**
 * The bridge from stored formula data to lib/chemistry. Pure: the editor runs it in the
 * browser on every keystroke, and the server runs the same code when it saves or serves.
 */
import { computeBatch, toGrams, ChemistryInputError, type BatchComputation, type FormulaLineInput, type FormulaSettings, type IngredientComposition } from '@/lib/chemistry';
import type { FormulaSettingsInput } from './schema';

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

export function computeFormula(settings: FormulaSettingsInput, lines: ComputableLine[]): ComputeOutcome {
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
