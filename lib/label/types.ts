/**
 * The label's shared vocabulary: what an ingredient contributes (per 100 g as used) and what the
 * label of a finished product is computed from. Pure types; `lib/label/*` computes, the ingredient
 * library stores. `null` always means "not known", never zero.
 */
import type { MassBalance } from '@/lib/chemistry/mass-balance';
import type { FormulaSettings, IngredientKind } from '@/lib/chemistry/types';

/** Nutrients held per 100 g of an ingredient as used. Grams unless the name says otherwise. */
export const NUTRIENT_KEYS = [
  'waterG', 'energyKcal', 'energyKj', 'proteinG', 'fatG', 'saturatesG', 'carbohydrateG',
  'sugarsG', 'sucroseG', 'glucoseG', 'fructoseG', 'fibreG', 'polyolsG', 'organicAcidsG', 'sodiumMg', 'cholesterolMg',
] as const;
export type NutrientKey = (typeof NUTRIENT_KEYS)[number];
/**
 * `carbohydrateG` is carbohydrate as the source lists it (for USDA SR28: "by difference", which
 * includes fibre); `energyKcal`/`energyKj` are the source's own listed energy, kept for reference.
 */
export type NutrientValues = Record<NutrientKey, number | null>;

/** EU Regulation 1169/2011 Annex II. */
export const EU_ALLERGENS = [
  'cereals_gluten', 'crustaceans', 'eggs', 'fish', 'peanuts', 'soybeans', 'milk', 'nuts',
  'celery', 'mustard', 'sesame', 'sulphites', 'lupin', 'molluscs',
] as const;
export type EuAllergen = (typeof EU_ALLERGENS)[number];
/** US major food allergens, FALCPA as amended by the FASTER Act (2021). */
export const US_ALLERGENS = [
  'milk', 'eggs', 'fish', 'crustacean_shellfish', 'tree_nuts', 'peanuts', 'wheat', 'soybeans', 'sesame',
] as const;
export type UsAllergen = (typeof US_ALLERGENS)[number];

/** What the label needs to know about one library ingredient. */
export interface IngredientLabelData {
  /** Name as it appears in the ingredient list ("strawberries", "sugar", "gelling agent"…). */
  labelName: string;
  kind: IngredientKind;
  nutrients: NutrientValues;
  euAllergens: EuAllergen[];
  usAllergens: UsAllergen[];
  /** Sulphur dioxide content of the ingredient, mg/kg; null when not known. */
  sulphiteMgPerKg: number | null;
  /** Set when the ingredient is a food additive: "E440", with its functional class ("gelling agent"). */
  additive: { eNumber: string; className: string } | null;
  /** True for water added as such (EU 1169/2011 Annex VII Part A(1)). */
  isAddedWater?: boolean;
  /** Where the composition came from ("USDA SR28 NDB 09316", or the supplier's sheet). */
  source: string | null;
}

/** One formula line at the time of use: grams weighed, and the library's data. */
export interface LabelLine {
  grams: number;
  ingredient: IngredientLabelData;
  /** Fruit lines: the fruit's name for the jam statements ("strawberries"). */
  fruitName?: string;
}

/** Everything a label is computed from. The mass balance supplies finished mass and water lost. */
export interface LabelInput {
  lines: LabelLine[];
  settings: FormulaSettings;
  massBalance: Pick<MassBalance, 'finishedMassG' | 'waterToEvaporateG' | 'totalChargeG' | 'fruitMassG' | 'targetSolidsPct'>;
}

/**
 * Per 100 g of finished product, unrounded, summed over the ingredients whose value is known.
 * `unknownFrom` names, per nutrient, the ingredients with no value: such a figure is incomplete
 * and every view says so (it is never shown as if the unknown were zero). A nutrient no
 * ingredient knows is null.
 */
export type FinishedNutrients = NutrientValues & {
  unknownFrom: Partial<Record<NutrientKey, string[]>>;
};
