/**
 * The bridge from the label's ingredient data to the sugar-based water activity of
 * lib/chemistry: each formula line's sucrose, glucose and fructose per 100 g, where known. PURE.
 */
import { ChemistryInputError } from '@/lib/chemistry/errors';
import { estimateWaterActivityFromSugars } from '@/lib/chemistry/water-activity';
import type { ResolvedLine } from '@/lib/chemistry/mass-balance';
import type { SugarMixEstimate, SugarMixOptions, SugarProfile, SugarProfileLine } from '@/lib/chemistry/water-activity';
import type { IngredientLabelData, LabelLine } from './types';

/** The ingredient's sugar profile, or null unless all three sugars are known (unknown is never zero). */
export function sugarProfileOf(ingredient: IngredientLabelData): SugarProfile | null {
  const { sucroseG, glucoseG, fructoseG } = ingredient.nutrients;
  if (sucroseG === null || glucoseG === null || fructoseG === null) return null;
  return { sucroseG, glucoseG, fructoseG };
}

/**
 * Pairs the mass balance's resolved lines with the label lines of the same formula, in the same
 * order (line i of the formula is `resolved[i]` and `labelLines[i]`).
 */
export function sugarProfileLines(resolved: readonly ResolvedLine[], labelLines: readonly LabelLine[]): SugarProfileLine[] {
  if (resolved.length !== labelLines.length) {
    throw new ChemistryInputError('lines', 'the label lines must match the formula lines one for one');
  }
  return resolved.map((line, i) => ({ line, sugars: sugarProfileOf(labelLines[i].ingredient) }));
}

/** aw of the finished product from the sugars the ingredients hold (lib/chemistry/water-activity.ts). */
export function waterActivityFromLabelLines(
  resolved: readonly ResolvedLine[],
  labelLines: readonly LabelLine[],
  finishedMassG: number,
  options: SugarMixOptions = {},
): SugarMixEstimate {
  return estimateWaterActivityFromSugars(sugarProfileLines(resolved, labelLines), finishedMassG, options);
}
