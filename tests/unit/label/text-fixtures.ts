import { computeMassBalance } from '@/lib/chemistry';
import type { FormulaSettings, IngredientComposition } from '@/lib/chemistry';
import { NUTRIENT_KEYS } from '@/lib/label/types';
import type { IngredientLabelData, LabelInput, NutrientValues } from '@/lib/label/types';

export function nutrients(values: Partial<NutrientValues> = {}): NutrientValues {
  const all = Object.fromEntries(NUTRIENT_KEYS.map((k) => [k, null])) as NutrientValues;
  return { ...all, ...values };
}

export function labelData(labelName: string, extra: Partial<IngredientLabelData> = {}): IngredientLabelData {
  return {
    labelName,
    kind: 'other',
    nutrients: nutrients(),
    euAllergens: [],
    usAllergens: [],
    sulphiteMgPerKg: 0,
    additive: null,
    source: null,
    ...extra,
  };
}

export interface TestLine {
  composition: IngredientComposition;
  label: IngredientLabelData;
  grams: number;
  fruitName?: string;
}

export function labelSettings(overrides: Partial<FormulaSettings> = {}): FormulaSettings {
  return { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-01-15', targetSolidsPct: 65, jarNetFillG: 340, ...overrides };
}

/** A label input whose finished mass comes from the real mass balance (water leaves by evaporation only). */
export function labelInputFrom(lines: TestLine[], settings: FormulaSettings = labelSettings()): LabelInput {
  const massBalance = computeMassBalance(
    lines.map((l) => ({ ingredient: l.composition, quantity: l.grams, unit: 'g' as const })),
    settings,
  );
  return {
    lines: lines.map((l) => ({ grams: l.grams, ingredient: l.label, fruitName: l.fruitName })),
    settings,
    massBalance,
  };
}

// Compositions: soluble solids (Brix) of the fruit as in lib/chemistry/typical-ingredients.ts.
export const STRAWBERRY: IngredientComposition = { kind: 'fruit', name: 'Strawberry', solidsPct: 8 };
export const RASPBERRY: IngredientComposition = { kind: 'fruit', name: 'Raspberry', solidsPct: 9.2 };
export const REDCURRANT: IngredientComposition = { kind: 'fruit', name: 'Redcurrant', solidsPct: 10.5 };
export const SUCROSE: IngredientComposition = { kind: 'sweetener', name: 'Sugar', solidsPct: 100, sweetenerType: 'sucrose' };
export const WATER: IngredientComposition = { kind: 'water', name: 'Water', solidsPct: 0 };
export const PECTIN: IngredientComposition = { kind: 'pectin', name: 'Pectin', solidsPct: 100 };
export const CITRIC: IngredientComposition = { kind: 'acid', name: 'Citric acid', solidsPct: 100, acidType: 'citric' };
export const SORBATE: IngredientComposition = { kind: 'other', name: 'Potassium sorbate', solidsPct: 100 };
export const BENZOATE: IngredientComposition = { kind: 'other', name: 'Sodium benzoate', solidsPct: 100 };

export const LABEL = {
  strawberry: labelData('strawberries', { kind: 'fruit' }),
  raspberry: labelData('raspberries', { kind: 'fruit' }),
  redcurrant: labelData('redcurrants', { kind: 'fruit' }),
  sugar: labelData('sugar', { kind: 'sweetener' }),
  water: labelData('water', { kind: 'water', isAddedWater: true }),
  pectin: labelData('gelling agent', { kind: 'pectin', additive: { eNumber: 'E440', className: 'gelling agent' } }),
  citric: labelData('citric acid', { kind: 'acid', additive: { eNumber: 'E330', className: 'acid' } }),
  sorbate: labelData('potassium sorbate', { additive: { eNumber: 'E202', className: 'preservative' } }),
  benzoate: labelData('sodium benzoate', { additive: { eNumber: 'E211', className: 'preservative' } }),
};
