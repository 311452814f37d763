import type { FormulaLineInput, FormulaSettings, IngredientComposition } from '@/lib/chemistry';

/** Invented demo fruit; only its solids matter in the worked examples. */
export function fruit(solidsPct: number, extra: Partial<IngredientComposition> = {}): IngredientComposition {
  return { kind: 'fruit', name: 'Test fruit', solidsPct, ...extra };
}

export const SUGAR: IngredientComposition = { kind: 'sweetener', name: 'Sugar', solidsPct: 100, sweetenerType: 'sucrose' };
export const HM_PECTIN_200: IngredientComposition = { kind: 'pectin', name: 'HM pectin grade 200', solidsPct: 100, pectinType: 'hm_rapid_set', pectinGrade: 200 };
export const CITRIC: IngredientComposition = { kind: 'acid', name: 'Citric acid', solidsPct: 100, acidType: 'citric' };

/** Practical Action technical brief "Jams, jellies and marmalade": the worked batch. */
export const PRACTICAL_ACTION_LINES: FormulaLineInput[] = [
  { ingredient: fruit(10), quantity: 10, unit: 'kg' },
  { ingredient: SUGAR, quantity: 10, unit: 'kg' },
  { ingredient: HM_PECTIN_200, quantity: 0.06, unit: 'kg' },
  { ingredient: CITRIC, quantity: 0.055, unit: 'kg' },
];

export function settings(overrides: Partial<FormulaSettings> = {}): FormulaSettings {
  return {
    productClass: 'jam',
    ruleSet: 'eu',
    ruleDate: '2026-01-15',
    targetSolidsPct: 68,
    jarNetFillG: 340,
    ...overrides,
  };
}
