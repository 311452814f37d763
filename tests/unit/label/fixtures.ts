import { computeMassBalance, type FormulaSettings, type IngredientComposition } from '@/lib/chemistry';
import type { IngredientLabelData, LabelInput, LabelLine, NutrientValues } from '@/lib/label/types';

/** Every nutrient unknown; a row of the table fills in what its source gives. */
export const NO_FIGURES: NutrientValues = {
  waterG: null, energyKcal: null, energyKj: null, proteinG: null, fatG: null, saturatesG: null,
  carbohydrateG: null, sugarsG: null, sucroseG: null, glucoseG: null, fructoseG: null, fibreG: null,
  polyolsG: null, organicAcidsG: null, sodiumMg: null, cholesterolMg: null,
};

// Source: docs/nutrition-check-values.md, table (USDA SR28 per 100 g edible portion). Cholesterol
// (SR28 nutrient 601) is 0 mg for all of these: from memory of SR28, not in that table.
export const SR28 = {
  strawberry: { ...NO_FIGURES, waterG: 90.95, energyKcal: 32, energyKj: 136, proteinG: 0.67, fatG: 0.30, saturatesG: 0.015, carbohydrateG: 7.68, fibreG: 2.0, sugarsG: 4.89, sodiumMg: 1, cholesterolMg: 0, sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 },
  apricot: { ...NO_FIGURES, waterG: 86.35, energyKcal: 48, energyKj: 201, proteinG: 1.40, fatG: 0.39, saturatesG: 0.027, carbohydrateG: 11.12, fibreG: 2.0, sugarsG: 9.24, sodiumMg: 1, cholesterolMg: 0, sucroseG: 5.87, glucoseG: 2.37, fructoseG: 0.94 },
  sugar: { ...NO_FIGURES, waterG: 0.02, energyKcal: 387, energyKj: 1618, proteinG: 0, fatG: 0, saturatesG: 0, carbohydrateG: 99.98, fibreG: 0, sugarsG: 99.80, sodiumMg: 1, cholesterolMg: 0, sucroseG: 99.80, glucoseG: 0, fructoseG: 0 },
  honey: { ...NO_FIGURES, waterG: 17.10, energyKcal: 304, energyKj: 1272, proteinG: 0.30, fatG: 0, saturatesG: 0, carbohydrateG: 82.40, fibreG: 0.2, sugarsG: 82.12, sodiumMg: 4, cholesterolMg: 0, sucroseG: 0.89, glucoseG: 35.75, fructoseG: 40.94 },
  // SR28 19310 gives no sugars for pectin: it stays unknown here.
  pectin: { ...NO_FIGURES, waterG: 8.70, energyKcal: 325, energyKj: 1360, proteinG: 0.30, fatG: 0.30, saturatesG: 0.050, carbohydrateG: 90.40, fibreG: 8.6, sodiumMg: 200, cholesterolMg: 0 },
  jamsAndPreserves19297: { ...NO_FIGURES, waterG: 30.47, energyKcal: 278, energyKj: 1163, proteinG: 0.37, fatG: 0.07, saturatesG: 0.010, carbohydrateG: 68.86, fibreG: 1.1, sugarsG: 48.50, sodiumMg: 32, cholesterolMg: 0 },
} satisfies Record<string, NutrientValues>;

/**
 * Citric acid is not in SR28; the reference counts it as anhydrous solids that add nothing to any
 * table nutrient (Source: docs/nutrition-check-values.md, "Check values", assumptions).
 */
export const CITRIC_ACID_NOTHING: NutrientValues = {
  ...NO_FIGURES, waterG: 0, energyKcal: 0, energyKj: 0, proteinG: 0, fatG: 0, saturatesG: 0, carbohydrateG: 0,
  sugarsG: 0, sucroseG: 0, glucoseG: 0, fructoseG: 0, fibreG: 0, polyolsG: 0, organicAcidsG: 0, sodiumMg: 0, cholesterolMg: 0,
};

export function labelData(labelName: string, kind: IngredientLabelData['kind'], nutrients: NutrientValues): IngredientLabelData {
  return { labelName, kind, nutrients, euAllergens: [], usAllergens: [], sulphiteMgPerKg: null, additive: null, source: null };
}

/** The chemistry side of each ingredient: only soluble solids drive the mass balance. */
const COMPOSITION: Record<IngredientLabelData['kind'], IngredientComposition> = {
  fruit: { kind: 'fruit', name: 'Fruit', solidsPct: 9 },
  sweetener: { kind: 'sweetener', name: 'Sweetener', solidsPct: 100, sweetenerType: 'sucrose' },
  pectin: { kind: 'pectin', name: 'Pectin', solidsPct: 100, pectinType: 'hm_rapid_set' },
  acid: { kind: 'acid', name: 'Citric acid', solidsPct: 100, acidType: 'citric' },
  water: { kind: 'water', name: 'Water', solidsPct: 0 },
  other: { kind: 'other', name: 'Other', solidsPct: 0 },
};

export function formulaSettings(overrides: Partial<FormulaSettings> = {}): FormulaSettings {
  return { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-01-15', targetSolidsPct: 65, jarNetFillG: 340, ...overrides };
}

/**
 * A label input whose mass balance comes from the real chemistry module (computeMassBalance).
 * `finishedMassG` picks the target solids that yield that mass, as the worked examples state the
 * finished mass rather than the Brix.
 */
export function labelInput(lines: LabelLine[], options: { finishedMassG?: number; targetSolidsPct?: number; jarNetFillG?: number } = {}): LabelInput {
  const formulaLines = lines.map((line) => ({ ingredient: COMPOSITION[line.ingredient.kind], quantity: line.grams, unit: 'g' as const }));
  let settings = formulaSettings({ targetSolidsPct: options.targetSolidsPct ?? 65, jarNetFillG: options.jarNetFillG ?? 340 });
  if (options.finishedMassG !== undefined) {
    const solids = computeMassBalance(formulaLines, settings).solubleSolidsInG;
    settings = { ...settings, targetSolidsPct: (solids / options.finishedMassG) * 100 };
  }
  return { lines, settings, massBalance: computeMassBalance(formulaLines, settings) };
}

export const line = (grams: number, ingredient: IngredientLabelData, fruitName?: string): LabelLine => ({ grams, ingredient, ...(fruitName ? { fruitName } : {}) });

/** Example (a): 1000 g strawberry + 1000 g sugar + 10 g pectin + 5 g citric acid → 1600 g. */
export function strawberryJam(citric: NutrientValues = CITRIC_ACID_NOTHING, jarNetFillG = 340): LabelInput {
  return labelInput([
    line(1000, labelData('strawberries', 'fruit', SR28.strawberry), 'strawberries'),
    line(1000, labelData('sugar', 'sweetener', SR28.sugar)),
    line(10, labelData('pectin', 'pectin', SR28.pectin)),
    line(5, labelData('citric acid', 'acid', citric)),
  ], { finishedMassG: 1600, jarNetFillG });
}

/** Example (b): 1500 g apricot + 1500 g sugar → 2450 g. */
export function apricotJam(): LabelInput {
  return labelInput([
    line(1500, labelData('apricots', 'fruit', SR28.apricot), 'apricots'),
    line(1500, labelData('sugar', 'sweetener', SR28.sugar)),
  ], { finishedMassG: 2450 });
}
