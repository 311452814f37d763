import { STARTER_LABEL_DATA } from '@/lib/ingredients/starter-composition';
import type { IngredientComposition } from '@/lib/chemistry';
import { TYPICAL_INGREDIENTS } from '@/lib/chemistry';
import type { FormulaRevisionView, FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import type { IngredientView } from '@/lib/ingredients/schema';

/** Invented ids and names: demo data only. */
export const IDS = {
  fruit: '0b7f6c1e-3a8d-4f2b-9c1d-2e5f6a7b8c91',
  sugar: '1c8a7d2f-4b9e-4a3c-8d2e-3f6a7b8c9d02',
  pectin: '2d9b8e3a-5caf-4b4d-9e3f-4a7b8c9d0e13',
  citric: '3eac9f4b-6db0-4c5e-8f4a-5b8c9d0e1f24',
  lemon: '4fbd0a5c-7ec1-4d6f-9a5b-6c9d0e1f2a35',
} as const;

export const FRUIT_10: IngredientComposition = { kind: 'fruit', name: 'Orchard fruit pulp', solidsPct: 10, euFruitGroup: 'general' };
export const SUGAR: IngredientComposition = { kind: 'sweetener', name: 'White sugar', solidsPct: 100, sweetenerType: 'sucrose' };
export const PECTIN_200: IngredientComposition = { kind: 'pectin', name: 'HM pectin grade 200', solidsPct: 100, pectinType: 'hm_rapid_set', pectinGrade: 200 };
export const CITRIC: IngredientComposition = { kind: 'acid', name: 'Citric acid', solidsPct: 100, acidType: 'citric', acidPct: 100 };
export const LEMON: IngredientComposition = { kind: 'acid', name: 'Lemon juice', solidsPct: 4.5, acidType: 'lemon_juice' };

export function line(ingredientId: string, ingredient: IngredientComposition, quantity: number, unit: RevisionLine['unit'] = 'g'): RevisionLine {
  return { ingredientId, ingredient, quantity, unit };
}

/**
 * Practical Action technical brief "Jams, jellies and marmalade": 10 kg fruit at 10 % solids,
 * 10 kg sugar, 60 g grade-200 pectin and 55 g citric acid, boiled to 68 % → 16.35 kg of jam.
 */
export const PRACTICAL_ACTION_LINES: RevisionLine[] = [
  line(IDS.fruit, FRUIT_10, 10_000),
  line(IDS.sugar, SUGAR, 10_000),
  line(IDS.pectin, PECTIN_200, 60),
  line(IDS.citric, CITRIC, 55),
];

export function settings(overrides: Partial<FormulaSettingsInput> = {}): FormulaSettingsInput {
  return { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-01-15', targetSolidsPct: 68, jarNetFillG: 340, ...overrides };
}

export function revision(number: number, lines: RevisionLine[], overrides: Partial<FormulaRevisionView> = {}): FormulaRevisionView {
  return {
    formulaId: '9a1b2c3d-4e5f-4a6b-8c7d-8e9f0a1b2c3d',
    number,
    name: 'Orchard jam trial',
    settings: settings(),
    lines,
    note: null,
    createdAt: '2026-02-03T09:30:00.000Z',
    createdBy: { id: 'u-1', name: 'Test Maker' },
    ...overrides,
  };
}

/** A library row built from the shipped typical values, so the table shows real handbook sources. */
export function typicalRow(key: string, overrides: Partial<IngredientView> = {}): IngredientView {
  const typical = TYPICAL_INGREDIENTS.find((t) => t.key === key);
  if (!typical) throw new Error(`no typical ingredient "${key}"`);
  const { key: _key, source, ...composition } = typical;
  void _key;
  return {
    ...composition,
    id: `00000000-0000-4000-8000-${String(TYPICAL_INGREDIENTS.indexOf(typical)).padStart(12, '0')}`,
    origin: 'typical',
    source,
    notes: null,
    labelData: STARTER_LABEL_DATA[key],
    archived: false,
    updatedAt: '2026-01-10T08:00:00.000Z',
    updatedByName: null,
    ...overrides,
  };
}
