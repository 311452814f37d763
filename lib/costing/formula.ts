/**
 * Costs a formula as stored (quantities in grams or % of fruit): the chemistry's mass balance
 * resolves every line to grams and gives the finished mass after evaporation, and cost.ts prices it.
 * Pure, so the editor runs it on every keystroke and the server runs the same code.
 */
import { computeFormula, type ComputableLine } from '@/lib/formulas/compute';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import type { BatchComputation } from '@/lib/chemistry';
import { costFormula, CostingInputError, type CostingInput, type FormulaCost } from './cost';

export interface CostableLine extends ComputableLine {
  ingredientId: string;
  /** Refuse/trim of the ingredient, % (0 when not set). */
  refusePct: number;
}

export type FormulaCostOutcome = { ok: true; cost: FormulaCost } | { ok: false; message: string };

export type FormulaPrices = Omit<CostingInput, 'lines' | 'chargeG' | 'finishedMassG'>;

/** Prices a batch the chemistry has already computed (the editor has it at hand); lines in the computation's order. */
export function costComputation(
  computation: BatchComputation,
  lines: Array<{ ingredientId: string; name: string; refusePct: number }>,
  prices: FormulaPrices,
): FormulaCostOutcome {
  const mb = computation.massBalance;
  try {
    return {
      ok: true,
      cost: costFormula({
        ...prices,
        lines: lines.map((l, i) => ({ ingredientId: l.ingredientId, name: l.name, grams: mb.lines[i].massG, refusePct: l.refusePct })),
        chargeG: mb.totalChargeG,
        finishedMassG: mb.finishedMassG,
        formulaJarFillG: computation.settings.jarNetFillG,
      }),
    };
  } catch (err) {
    if (err instanceof CostingInputError) return { ok: false, message: err.message };
    throw err;
  }
}

export function costStoredFormula(settings: FormulaSettingsInput, lines: CostableLine[], prices: FormulaPrices): FormulaCostOutcome {
  if (lines.length === 0) return { ok: false, message: 'The formula has no lines to cost.' };
  const outcome = computeFormula(settings, lines);
  if (!outcome.ok) return { ok: false, message: `Cost needs the formula's results first: ${outcome.message}` };
  return costComputation(outcome.computation, lines.map((l) => ({ ingredientId: l.ingredientId, name: l.ingredient.name, refusePct: l.refusePct })), prices);
}
