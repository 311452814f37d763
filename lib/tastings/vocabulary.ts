/** Panel vocabulary shared by entities, schemas and screens. Pure data. */
export const TASTING_METHODS = ['rated', 'ranking', 'triangle'] as const;
export type TastingMethod = (typeof TASTING_METHODS)[number];
export const TASTING_METHOD_LABELS: Record<TastingMethod, string> = {
  rated: 'Rated attributes',
  ranking: 'Ranking',
  triangle: 'Triangle test',
};

/** draft → open → closed. Keys are stable; labels are what people read. */
export const TASTING_STATES = ['draft', 'open', 'closed'] as const;
export type TastingState = (typeof TASTING_STATES)[number];
export const TASTING_STATE_LABELS: Record<TastingState, string> = {
  draft: 'Being set up',
  open: 'Taking answers',
  closed: 'Closed',
};

export const SEAT_KINDS = ['staff', 'guest'] as const;
export type SeatKind = (typeof SEAT_KINDS)[number];

/** One served cup: the code the taster sees and, for the kitchen only, which sample it is. */
export interface ServedCup {
  code: string;
  sampleId: string;
}

/**
 * PURE. Why a tasting's title would unblind it, or null. Tasters see the title, so it must not name a
 * variant of the trial ("Variant J vs Q") or the recipe being tried (the base formula's name).
 */
export function titleBlindingProblem(title: string, trial: { variantLabels: readonly string[]; formulaName: string }): string | null {
  const named = [...title.matchAll(/\bvariants?\s+([A-Z]{1,2})\b/gi)].map((m) => m[1].toUpperCase()).filter((l) => trial.variantLabels.includes(l));
  if (named.length) return `Tasters see the title: leave out the variant names (“Variant ${named[0]}”) so the tasting stays blind.`;
  const recipe = trial.formulaName.trim().toLowerCase();
  // A short, generic name ("Jam") says nothing a taster cannot taste; a full recipe name may name the treatment.
  if (recipe.length >= 8 && title.toLowerCase().includes(recipe)) return `Tasters see the title: leave out the recipe’s name (“${trial.formulaName.trim()}”) so the tasting stays blind.`;
  return null;
}
