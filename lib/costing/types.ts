/**
 * Costing's shared vocabulary. Money is held in the workspace currency's minor units (cents,
 * pence) as plain numbers while computing and rounded once, at the end, to whole minor units
 * (lib/costing decides and tests the rounding rule). `null` always means "no price known".
 */

/** ISO 4217 code, one per workspace; figures are never converted between currencies. */
export type CurrencyCode = string;

/** One dated price of an ingredient: what a pack costs and how much it holds. */
export interface IngredientPricePoint {
  ingredientId: string;
  /** YYYY-MM-DD; the price holds from this day until the next point's day. */
  validFrom: string;
  packPriceMinor: number;
  packSizeG: number;
  supplier: string | null;
}

/** One dated price of a packaging item (jar, lid, label, case), per piece. */
export interface PackagingPricePoint {
  packagingItemId: string;
  validFrom: string;
  unitPriceMinor: number;
  supplier: string | null;
}

/** A container with its net fill and the packaging that goes with one jar. */
export interface PackFormatData {
  id: string;
  name: string;
  netFillG: number;
  items: { packagingItemId: string; name: string; /** Pieces per jar (a case of 12 = 1/12). */ perJar: number }[];
}

/** One formula line to cost: grams weighed as used, with the ingredient's refuse/trim share. */
export interface CostLineInput {
  ingredientId: string;
  name: string;
  grams: number;
  /** Share of the purchased mass trimmed away, % (bought mass = grams ÷ (1 − refuse/100)). */
  refusePct: number;
}
