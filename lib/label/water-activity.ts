/**
 * The bridge from the label's ingredient data to the sugar-based water activity of
 * lib/chemistry: each formula line's sucrose, glucose and fructose per 100 g, where known. PURE.
 */
import { ChemistryInputError } from '@/lib/chemistry/errors';
import { estimateWaterActivityFromSugars } from '@/lib/chemistry/water-activity';
import type { ResolvedLine } from '@/lib/chemistry/mass-balance';
import type { SugarMixEstimate, SugarMixOptions, SugarProfile, SugarProfileLine } from '@/lib/chemistry/water-activity';
import type { IngredientLabelData, LabelLine, NutrientValues } from './types';

/** The three sugars as an ingredient's label data holds them, g per 100 g; null is not known. */
export type SugarValues = Pick<NutrientValues, 'sucroseG' | 'glucoseG' | 'fructoseG'>;

/**
 * The one reading of a sugar profile, for the label and for the stored formula lines alike: all
 * three sugars, or null unless all three are known (an unknown sugar is never taken as zero).
 */
export function fullSugarProfile({ sucroseG, glucoseG, fructoseG }: SugarValues): { sucroseG: number; glucoseG: number; fructoseG: number } | null {
  if (sucroseG === null || glucoseG === null || fructoseG === null) return null;
  return { sucroseG, glucoseG, fructoseG };
}

/** The ingredient's sugar profile, or null unless all three sugars are known (unknown is never zero). */
export function sugarProfileOf(ingredient: IngredientLabelData): SugarProfile | null {
  return fullSugarProfile(ingredient.nutrients);
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
