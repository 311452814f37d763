/**
 * The ingredient's label data: the words for the screens (nutrients with units, allergens in plain
 * names, additive functional classes), the E-number rule, whether a composition is complete, and the
 * mapper from the library's view to the label's `IngredientLabelData`. Pure: no framework imports.
 */
import {
  EU_ALLERGENS, NUTRIENT_KEYS, US_ALLERGENS,
  type EuAllergen, type IngredientLabelData, type NutrientKey, type NutrientValues, type UsAllergen,
} from '@/lib/label/types';
import type { IngredientKind } from '@/lib/chemistry/types';

/**
 * Functional classes of Regulation (EC) 1333/2008 Annex I that a preserve maker meets. The key is
 * stored; the label says the class name (Regulation (EU) 1169/2011 Annex VII Part C).
 */
export const ADDITIVE_CLASSES = [
  'gelling_agent', 'thickener', 'stabiliser', 'firming_agent', 'acid', 'acidity_regulator', 'preservative',
  'antioxidant', 'colour', 'sweetener', 'sequestrant', 'anti_foaming_agent', 'humectant', 'emulsifier',
] as const;
export type AdditiveClass = (typeof ADDITIVE_CLASSES)[number];
export const ADDITIVE_CLASS_LABELS: Record<AdditiveClass, string> = {
  gelling_agent: 'Gelling agent',
  thickener: 'Thickener',
  stabiliser: 'Stabiliser',
  firming_agent: 'Firming agent',
  acid: 'Acid',
  acidity_regulator: 'Acidity regulator',
  preservative: 'Preservative',
  antioxidant: 'Antioxidant',
  colour: 'Colour',
  sweetener: 'Sweetener',
  sequestrant: 'Sequestrant',
  anti_foaming_agent: 'Anti-foaming agent',
  humectant: 'Humectant',
  emulsifier: 'Emulsifier',
};

/**
 * "E" and three or four digits (E100–E1599 are the EU's numbers), then an optional lower-case letter
 * and an optional roman numeral in brackets: E440, E160a, E472(ii), E160a(iv), E1422.
 */
export const E_NUMBER_PATTERN = /^E[1-9]\d{2,3}[a-z]?(?:\((?:i|ii|iii|iv|v|vi|vii|viii|ix|x)\))?$/;
export const E_NUMBER_MESSAGE = 'Write the E-number like E440, E160a or E472(ii).';

/** Typed as "e 440" or " E440 ": the capital E, no spaces, a lower-case suffix. */
export function normaliseENumber(raw: string): string {
  const compact = raw.trim().replace(/\s+/g, '');
  return compact.length ? compact[0].toUpperCase() + compact.slice(1).toLowerCase() : compact;
}

export const NUTRIENT_LABELS: Record<NutrientKey, { label: string; unit: string }> = {
  waterG: { label: 'Water', unit: 'g' },
  energyKj: { label: 'Energy', unit: 'kJ' },
  energyKcal: { label: 'Energy', unit: 'kcal' },
  proteinG: { label: 'Protein', unit: 'g' },
  fatG: { label: 'Fat', unit: 'g' },
  saturatesG: { label: 'of which saturates', unit: 'g' },
  carbohydrateG: { label: 'Carbohydrate', unit: 'g' },
  sugarsG: { label: 'of which sugars', unit: 'g' },
  sucroseG: { label: 'Sucrose', unit: 'g' },
  glucoseG: { label: 'Glucose', unit: 'g' },
  fructoseG: { label: 'Fructose', unit: 'g' },
  fibreG: { label: 'Fibre', unit: 'g' },
  polyolsG: { label: 'Polyols', unit: 'g' },
  organicAcidsG: { label: 'Organic acids', unit: 'g' },
  sodiumMg: { label: 'Sodium', unit: 'mg' },
  cholesterolMg: { label: 'Cholesterol', unit: 'mg' },
};

/**
 * The nutrients without which a finished product's declaration cannot be computed: the EU Annex XV
 * list (energy via its parts, fat, saturates, carbohydrate, sugars, protein, salt from sodium), fibre,
 * and water for the mass balance. Individual sugars, polyols and organic acids are optional detail;
 * cholesterol only the US panel asks for, and it names the ingredients that lack it.
 */
export const REQUIRED_NUTRIENTS: readonly NutrientKey[] = [
  'waterG', 'energyKj', 'energyKcal', 'proteinG', 'fatG', 'saturatesG', 'carbohydrateG', 'sugarsG', 'fibreG', 'sodiumMg',
];

export const EU_ALLERGEN_LABELS: Record<EuAllergen, string> = {
  cereals_gluten: 'Cereals containing gluten',
  crustaceans: 'Crustaceans',
  eggs: 'Eggs',
  fish: 'Fish',
  peanuts: 'Peanuts',
  soybeans: 'Soybeans',
  milk: 'Milk',
  nuts: 'Nuts (almond, hazelnut, walnut and other tree nuts)',
  celery: 'Celery',
  mustard: 'Mustard',
  sesame: 'Sesame seeds',
  sulphites: 'Sulphur dioxide and sulphites (above 10 mg/kg)',
  lupin: 'Lupin',
  molluscs: 'Molluscs',
};
export const US_ALLERGEN_LABELS: Record<UsAllergen, string> = {
  milk: 'Milk',
  eggs: 'Eggs',
  fish: 'Fish',
  crustacean_shellfish: 'Crustacean shellfish',
  tree_nuts: 'Tree nuts',
  peanuts: 'Peanuts',
  wheat: 'Wheat',
  soybeans: 'Soybeans',
  sesame: 'Sesame',
};

/** What the library stores for the label, per 100 g of the ingredient as used. */
export interface IngredientLabelFields {
  /** Name in the ingredient list; null = the ingredient's own name. */
  labelName: string | null;
  nutrients: NutrientValues;
  euAllergens: EuAllergen[];
  usAllergens: UsAllergen[];
  sulphiteMgPerKg: number | null;
  additive: { eNumber: string; functionalClass: AdditiveClass } | null;
  isAddedWater: boolean;
  /** Where the composition came from, in words for the screen. */
  source: string | null;
}

/** All nutrients unknown, no allergens, not an additive. */
export function emptyLabelFields(): IngredientLabelFields {
  return {
    labelName: null,
    nutrients: Object.fromEntries(NUTRIENT_KEYS.map((k) => [k, null])) as NutrientValues,
    euAllergens: [],
    usAllergens: [],
    sulphiteMgPerKg: null,
    additive: null,
    isAddedWater: false,
    source: null,
  };
}

/** The required nutrients this ingredient does not know; empty = its composition is complete. */
export function missingNutrients(fields: Pick<IngredientLabelFields, 'nutrients'>): NutrientKey[] {
  return REQUIRED_NUTRIENTS.filter((k) => fields.nutrients[k] == null);
}

/** A nutrient's own name with its unit, for a form box or a list ("Sugars (g)"). */
export function nutrientLabel(k: NutrientKey): string {
  const { label, unit } = NUTRIENT_LABELS[k];
  const name = label.startsWith('of which ') ? label.slice('of which '.length).replace(/^\w/, (c) => c.toUpperCase()) : label;
  return `${name} (${unit})`;
}

/** Words for the library and the form: "Complete", "Not entered", or which required nutrients are unknown. */
export function completenessText(fields: Pick<IngredientLabelFields, 'nutrients'>): { complete: boolean; text: string } {
  const missing = missingNutrients(fields);
  if (!missing.length) return { complete: true, text: 'Complete' };
  if (missing.length === REQUIRED_NUTRIENTS.length) return { complete: false, text: 'Not entered' };
  return { complete: false, text: `Unknown: ${missing.map((k) => nutrientLabel(k).toLowerCase()).join(', ')}` };
}

/** Keeps only the allergen keys of our lists, once each, in the lists' order (stored data may predate a list change). */
function known<T extends string>(list: readonly T[], values: readonly string[]): T[] {
  return list.filter((k) => values.includes(k));
}

/** The label's view of one library ingredient. */
export function toLabelData(ingredient: { name: string; kind: IngredientKind; labelData: Omit<IngredientLabelFields, 'source'> & { source?: string | null } }): IngredientLabelData {
  const d = ingredient.labelData;
  return {
    labelName: d.labelName ?? ingredient.name,
    kind: ingredient.kind,
    nutrients: { ...d.nutrients },
    euAllergens: known(EU_ALLERGENS, d.euAllergens),
    usAllergens: known(US_ALLERGENS, d.usAllergens),
    sulphiteMgPerKg: d.sulphiteMgPerKg,
    additive: d.additive ? { eNumber: d.additive.eNumber, className: ADDITIVE_CLASS_LABELS[d.additive.functionalClass].toLowerCase() } : null,
    isAddedWater: d.isAddedWater,
    source: d.source ?? null,
  };
}
