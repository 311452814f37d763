/** Ingredient library: the zod schemas shared by forms and the API, and the plain types pages receive. */
import { z } from 'zod';
import type { IngredientComposition } from '@/lib/chemistry';
import { longText, name, searchText } from '@/lib/input';

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

const optionalNumber = (min: number, max: number, what: string) =>
  z.number({ error: `${what} must be a number.` }).min(min, `${what} must be at least ${min}.`).max(max, `${what} must be at most ${max}.`).nullable().optional();

export const ingredientInputSchema = z
  .object({
    name: name('Give the ingredient a name.'),
    kind: z.enum(INGREDIENT_KINDS, { error: 'Choose a kind.' }),
    solidsPct: z.number({ error: 'Soluble solids must be a number.' }).min(0, 'Soluble solids cannot be negative.').max(100, 'Soluble solids cannot exceed 100 %.'),
    phMin: optionalNumber(0, 14, 'pH'),
    phMax: optionalNumber(0, 14, 'pH'),
    acidPct: optionalNumber(0, 100, 'Acid content'),
    pectinLevel: z.enum(PECTIN_LEVELS).nullable().optional(),
    euFruitGroup: z.enum(EU_FRUIT_GROUPS).nullable().optional(),
    usFruitGroup: z.enum(US_FRUIT_GROUPS).nullable().optional(),
    pectinType: z.enum(PECTIN_TYPES).nullable().optional(),
    pectinGrade: optionalNumber(1, 500, 'Pectin grade'),
    sweetenerType: z.enum(SWEETENER_TYPES).nullable().optional(),
    acidType: z.enum(ACID_TYPES).nullable().optional(),
    calciumSource: z.boolean().optional(),
    notes: longText(1000).nullable().optional(),
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
  archived: boolean;
  updatedAt: string;
  updatedByName: string | null;
}

export const ingredientListQuerySchema = z.object({
  q: searchText.optional(),
  kind: z.enum(INGREDIENT_KINDS).optional(),
  sort: z.enum(['name', 'kind', 'solidsPct', 'origin', 'updatedAt']).optional(),
  dir: z.enum(['asc', 'desc']).optional(),
  archived: z.enum(['include', 'only']).optional(),
});
export type IngredientListQuery = z.infer<typeof ingredientListQuerySchema>;
