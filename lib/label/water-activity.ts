/**
 * An ingredient's sugar profile from its label data: the sucrose, glucose and fructose per 100 g
 * that the sugar-based water activity of lib/chemistry reads (the library stores the profile on the
 * ingredient's composition, lib/ingredients/queries.ts). PURE.
 */
import type { NutrientValues } from './types';

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

