/** Ingredient library: the zod schemas shared by forms and the API, and the plain types pages receive. */
import { z } from 'zod';
import type { IngredientComposition } from '@/lib/chemistry';
import { boundedNumber, longText, name, noTinyAmount, searchText, text } from '@/lib/input';
import { EU_ALLERGENS, NUTRIENT_KEYS, US_ALLERGENS, type NutrientKey } from '@/lib/label/types';
import {
  ADDITIVE_CLASSES, E_NUMBER_MESSAGE, E_NUMBER_PATTERN, NUTRIENT_LABELS, normaliseENumber, type IngredientLabelFields,
} from './label-data';

export const INGREDIENT_KINDS = ['fruit', 'sweetener', 'pectin', 'acid', 'water', 'other'] as const;
export const SWEETENER_TYPES = ['sucrose', 'glucose_syrup', 'invert_sugar', 'honey', 'fructose', 'dextrose', 'other'] as const;
export const PECTIN_TYPES = ['hm_rapid_set', 'hm_slow_set', 'lm_conventional', 'lm_amidated'] as const;
export const PECTIN_LEVELS = ['high', 'medium', 'low'] as const;
export const ACID_TYPES = ['citric', 'malic', 'tartaric', 'lemon_juice', 'other'] as const;
export const EU_FRUIT_GROUPS = ['general', 'reduced_minimum_fruits', 'ginger', 'cashew_apple', 'passion_fruit', 'citrus'] as const;
export const US_FRUIT_GROUPS = ['1', '2'] as const;

export const KIND_LABELS: Record<(typeof INGREDIENT_KINDS)[number], string> = {
  fruit: 'Fruit, juice or purée',
  sweetener: 'Sweetener',
  pectin: 'Pectin',
  acid: 'Acid',
  water: 'Water',
  other: 'Other',
};
export const PECTIN_TYPE_LABELS: Record<(typeof PECTIN_TYPES)[number], string> = {
  hm_rapid_set: 'High-methoxyl, rapid set',
  hm_slow_set: 'High-methoxyl, slow set',
  lm_conventional: 'Low-methoxyl, conventional (needs calcium)',
  lm_amidated: 'Low-methoxyl, amidated (needs calcium)',
};
export const EU_GROUP_LABELS: Record<(typeof EU_FRUIT_GROUPS)[number], string> = {
  general: 'General fruit',
  reduced_minimum_fruits: 'Redcurrant, rowanberry, sea-buckthorn, blackcurrant, rosehip, quince',
  ginger: 'Ginger',
  cashew_apple: 'Cashew apple',
  passion_fruit: 'Passion fruit',
  citrus: 'Citrus (marmalade)',
};

const optionalNumber = (min: number, max: number, what: string, unit = '') =>
  noTinyAmount(z.number({ error: `${what} must be a number.` }).min(min, `${what} must be at least ${min}.`).max(max, `${what} must be at most ${max}.`), what, unit).nullable().optional();

/**
 * Bounds per 100 g. A mass cannot exceed the 100 g it is part of; energy bounds sit above pure fat
 * (37 kJ / 9 kcal per g, Regulation (EU) 1169/2011 Annex XIV) with room for sources' own factors;
 * sodium and sulphur dioxide up to the whole sample. Project limits, no published source.
 */
const NUTRIENT_MAX: Record<NutrientKey, number> = {
  waterG: 100, energyKcal: 950, energyKj: 4000, proteinG: 100, fatG: 100, saturatesG: 100, carbohydrateG: 100, sugarsG: 100,
  sucroseG: 100, glucoseG: 100, fructoseG: 100, fibreG: 100, polyolsG: 100, organicAcidsG: 100, sodiumMg: 100_000, cholesterolMg: 100_000,
};
export const SULPHITE_MAX_MG_PER_KG = 1_000_000;
/**
 * How far the parts may exceed their whole: sources round each value on its own (SR28's strawberry
 * lists sugars 4.89 g and sucrose + glucose + fructose 4.90 g). Common practice, no published source.
 */
export const COMPOSITION_TOLERANCE_G = 1;

function nutrientField(key: NutrientKey) {
  const { label, unit } = NUTRIENT_LABELS[key];
  const what = `${label.replace(/^of which /, '').replace(/^\w/, (c) => c.toUpperCase())} (${unit} per 100 g)`;
  return boundedNumber(what, 0, NUTRIENT_MAX[key]).nullable().default(null);
}

function uniqueList<T extends string>(values: readonly [T, ...T[]], what: string) {
  return z
    .array(z.enum(values, { error: `Choose ${what} from the list.` }), { error: `Choose ${what} from the list.` })
    .max(values.length, `Choose each ${what} once.`)
    .refine((list) => new Set(list).size === list.length, `Choose each ${what} once.`)
    .default([]);
}

const nutrientsSchema = z
  .object(Object.fromEntries(NUTRIENT_KEYS.map((k) => [k, nutrientField(k)])) as Record<NutrientKey, ReturnType<typeof nutrientField>>)
  .strict();

/** The label data an ingredient carries (see IngredientLabelFields); every nutrient left out is unknown. */
export const labelDataSchema = z
  .object({
    labelName: text({ max: 120 }).nullable().default(null).transform((v) => (v ? v : null)),
    nutrients: nutrientsSchema.default(() => nutrientsSchema.parse({})),
    euAllergens: uniqueList(EU_ALLERGENS, 'an EU allergen'),
    usAllergens: uniqueList(US_ALLERGENS, 'a US allergen'),
    sulphiteMgPerKg: boundedNumber('Sulphite (mg/kg)', 0, SULPHITE_MAX_MG_PER_KG).nullable().default(null),
    additive: z
      .object({
        eNumber: text({ min: 1, max: 12, required: 'Give the E-number.' }).transform(normaliseENumber).pipe(z.string().regex(E_NUMBER_PATTERN, E_NUMBER_MESSAGE)),
        functionalClass: z.enum(ADDITIVE_CLASSES, { error: 'Choose the additive’s class.' }),
      })
      .strict()
      .nullable()
      .default(null),
    isAddedWater: z.boolean({ error: 'Say yes or no.' }).default(false),
    source: longText(500).nullable().default(null).transform((v) => (v ? v : null)),
  })
  .strict()
  .superRefine((d, ctx) => {
    for (const problem of compositionProblems(d.nutrients)) ctx.addIssue({ code: 'custom', path: ['nutrients', problem.key], message: problem.message });
  }) satisfies z.ZodType<IngredientLabelFields, unknown>;

/** Parts that exceed their whole, with the tolerance; each names the field to correct. */
export function compositionProblems(n: Record<NutrientKey, number | null>): { key: NutrientKey; message: string }[] {
  const out: { key: NutrientKey; message: string }[] = [];
  const sum = (keys: NutrientKey[]) => keys.reduce((s, k) => s + (n[k] ?? 0), 0);
  const over = (total: number, limit: number) => total > limit + COMPOSITION_TOLERANCE_G;
  const g = (x: number) => `${Math.round(x * 100) / 100} g`;
  // Carbohydrate may be "by difference" (fibre inside it), so fibre is left out of the sum.
  const macro = sum(['waterG', 'proteinG', 'fatG', 'carbohydrateG', 'organicAcidsG']);
  if (over(macro, 100)) out.push({ key: 'waterG', message: `Water, protein, fat, carbohydrate and organic acids add up to ${g(macro)}, more than 100 g per 100 g.` });
  if (n.saturatesG != null && n.fatG != null && over(n.saturatesG, n.fatG)) out.push({ key: 'saturatesG', message: 'Saturates are part of the fat: they cannot be more than the fat.' });
  if (n.sugarsG != null && n.carbohydrateG != null && over(n.sugarsG, n.carbohydrateG)) out.push({ key: 'sugarsG', message: 'Sugars are part of the carbohydrate: they cannot be more than the carbohydrate.' });
  const single = sum(['sucroseG', 'glucoseG', 'fructoseG']);
  if (n.sugarsG != null && over(single, n.sugarsG)) out.push({ key: 'sucroseG', message: `Sucrose, glucose and fructose add up to ${g(single)}, more than the sugars.` });
  return out;
}

export const ingredientInputSchema = z
  .object({
    name: name('Give the ingredient a name.'),
    kind: z.enum(INGREDIENT_KINDS, { error: 'Choose a kind.' }),
    solidsPct: noTinyAmount(z.number({ error: 'Soluble solids must be a number.' }).min(0, 'Soluble solids cannot be negative.').max(100, 'Soluble solids cannot exceed 100 %.'), 'Soluble solids', ' %'),
    phMin: optionalNumber(0, 14, 'pH'),
    phMax: optionalNumber(0, 14, 'pH'),
    acidPct: optionalNumber(0, 100, 'Acid content', ' %'),
    pectinLevel: z.enum(PECTIN_LEVELS).nullable().optional(),
    euFruitGroup: z.enum(EU_FRUIT_GROUPS).nullable().optional(),
    usFruitGroup: z.enum(US_FRUIT_GROUPS).nullable().optional(),
    pectinType: z.enum(PECTIN_TYPES).nullable().optional(),
    pectinGrade: optionalNumber(1, 500, 'Pectin grade'),
    sweetenerType: z.enum(SWEETENER_TYPES).nullable().optional(),
    acidType: z.enum(ACID_TYPES).nullable().optional(),
    calciumSource: z.boolean().optional(),
    notes: longText(1000).nullable().optional(),
    /** Left out: the stored label data stays as it is (a create starts with everything unknown). */
    labelData: labelDataSchema.optional(),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.phMin != null && v.phMax != null && v.phMin > v.phMax) {
      ctx.addIssue({ code: 'custom', path: ['phMax'], message: 'The upper pH must not be below the lower pH.' });
    }
    if (v.kind === 'pectin' && !v.pectinType) {
      ctx.addIssue({ code: 'custom', path: ['pectinType'], message: 'Say which type of pectin this is.' });
    }
    if (v.kind === 'sweetener' && !v.sweetenerType) {
      ctx.addIssue({ code: 'custom', path: ['sweetenerType'], message: 'Say which sweetener this is (it sets the water-activity model).' });
    }
  });

export type IngredientInput = z.infer<typeof ingredientInputSchema>;

/** typical = handbook value as shipped; edited = a typical value the workspace changed; custom = added by the workspace. */
export type IngredientOrigin = 'typical' | 'edited' | 'custom';

export interface IngredientView extends IngredientComposition {
  id: string;
  origin: IngredientOrigin;
  /** Where a typical value comes from; null for the workspace's own values. */
  source: string | null;
  notes: string | null;
  labelData: IngredientLabelFields;
  archived: boolean;
  updatedAt: string;
  updatedByName: string | null;
}

/**
 * An ingredient as the formula editor receives it: what the chemistry, the label and the picker
 * read. The provenance texts and the edit history stay on the ingredient pages; they were half of
 * what every editor load sent for the library.
 */
export type EditorIngredient = Omit<IngredientView, 'origin' | 'source' | 'notes' | 'updatedAt' | 'updatedByName' | 'labelData'> & {
  labelData: Omit<IngredientLabelFields, 'source'>;
};

export function editorIngredientOf(view: IngredientView): EditorIngredient {
  const { origin: _origin, source: _source, notes: _notes, updatedAt: _updatedAt, updatedByName: _updatedByName, labelData, ...composition } = view;
  const { source: _labelSource, ...label } = labelData;
  void [_origin, _source, _notes, _updatedAt, _updatedByName, _labelSource];
  return { ...composition, labelData: label };
}

/** One column of an ingredient an import row would change, as the CSV writes it ('' is blank). */
export interface IngredientFieldChange {
  column: string;
  before: string;
  after: string;
}

/** What an ingredient import did, or (imported: false) would do once its updates are confirmed. */
export interface IngredientImportResult {
  imported: boolean;
  created: number;
  updated: number;
  unchanged: number;
  /** The rows that change an ingredient already in the library. */
  updates: Array<{ row: number; ingredientId: string; name: string; changes: IngredientFieldChange[] }>;
}

export const ingredientListQuerySchema = z.object({
  q: searchText.optional(),
  kind: z.enum(INGREDIENT_KINDS).optional(),
  sort: z.enum(['name', 'kind', 'solidsPct', 'origin', 'updatedAt']).optional(),
  dir: z.enum(['asc', 'desc']).optional(),
  archived: z.enum(['include', 'only']).optional(),
});
export type IngredientListQuery = z.infer<typeof ingredientListQuerySchema>;
