import type { IngredientView } from '@/lib/ingredients/schema';
import type { IngredientComposition } from '@/lib/chemistry';
import { emptyLabelFields } from '@/lib/ingredients/label-data';

/** Invented library entries; only the compositions matter to the checks. */
function view(id: string, composition: IngredientComposition): IngredientView {
  return { id, origin: 'custom', source: null, notes: null, labelData: emptyLabelFields(), archived: false, updatedAt: '2026-01-10T09:00:00.000Z', updatedByName: 'Demo Maker', ...composition };
}

export const IDS = {
  fruit: '0b1e6a52-3f0c-4c1a-9a53-5d1a3c9e0001',
  sugar: '0b1e6a52-3f0c-4c1a-9a53-5d1a3c9e0002',
  pectin: '0b1e6a52-3f0c-4c1a-9a53-5d1a3c9e0003',
  citric: '0b1e6a52-3f0c-4c1a-9a53-5d1a3c9e0004',
} as const;

export const FORMULA_ID = '7d4c2b10-8e9f-4a21-b3c4-d5e6f7a80001';

/** The four ingredients of the Practical Action technical brief "Jams, jellies and marmalade" worked batch. */
export const LIBRARY: IngredientView[] = [
  view(IDS.fruit, { kind: 'fruit', name: 'Hedgerow plum pulp', solidsPct: 10, euFruitGroup: 'general' }),
  view(IDS.sugar, { kind: 'sweetener', name: 'White sugar', solidsPct: 100, sweetenerType: 'sucrose' }),
  view(IDS.pectin, { kind: 'pectin', name: 'Pectin grade 200', solidsPct: 100, pectinType: 'hm_rapid_set', pectinGrade: 200 }),
  view(IDS.citric, { kind: 'acid', name: 'Citric acid powder', solidsPct: 100, acidType: 'citric' }),
];

export const BASE_SETTINGS = {
  productClass: 'jam',
  ruleSet: 'eu',
  ruleDate: '2026-01-15',
  targetSolidsPct: 68,
  jarNetFillG: 340,
  altitudeM: null,
  measuredWaterBoilingC: null,
  plannedPh: null,
} as const;

/** The Practical Action batch in grams, as stored lines. */
export const PRACTICAL_ACTION_STORED_LINES = [
  { ingredientId: IDS.fruit, quantity: 10000, unit: 'g' as const },
  { ingredientId: IDS.sugar, quantity: 10000, unit: 'g' as const },
  { ingredientId: IDS.pectin, quantity: 60, unit: 'g' as const },
  { ingredientId: IDS.citric, quantity: 55, unit: 'g' as const },
];
