/**
 * A variant's or a formula's model factors, computed with lib/chemistry from the formula itself, so
 * variants of different trials of one product family pool into one data set. PURE: the formula
 * editor calls formulaFeatures() in the browser on every keystroke (pass it the computation the
 * editor already has, and nothing is computed twice).
 */
import type { BatchComputation, IngredientComposition, PectinType } from '@/lib/chemistry';
import { PRODUCT_CLASS_NAMES } from '@/lib/chemistry';
import { computeFormula } from '@/lib/formulas/compute';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import { familySlug, type FactorValues, type FamilyInfo, type PectinFamily } from './schema';

/** The formula shape the editor computes chemistry from, with each line's library ingredient. */
export interface FeatureLine {
  ingredientId: string;
  ingredient: IngredientComposition;
  quantity: number;
  unit: 'g' | 'pct_fruit';
}

export interface FormulaFeatures {
  factors: FactorValues;
  pectinFamily: PectinFamily;
  /** Null when the formula has no fruit line. */
  family: FamilyInfo | null;
}

export type FeatureOutcome = { ok: true; features: FormulaFeatures } | { ok: false; message: string };

const HIGH_METHOXYL: readonly PectinType[] = ['hm_rapid_set', 'hm_slow_set'];

function pectinFamilyOf(pectins: readonly IngredientComposition[]): PectinFamily {
  if (pectins.length === 0) return 'none';
  if (pectins.some((p) => p.pectinType === undefined)) return 'unstated';
  const kinds = new Set(pectins.map((p) => (HIGH_METHOXYL.includes(p.pectinType!) ? 'hm' : 'lm')));
  return kinds.size > 1 ? 'mixed' : kinds.has('hm') ? 'hm' : 'lm';
}

/**
 * Acid lines as citric acid: each line's mass × its titratable acidity (% as citric); an acid
 * without a stated acidity counts whole (a dry acid powder). The fruit's own acid is not added:
 * it does not change between variants of one fruit, and measured pH carries it.
 */
function citricEquivalentG(lines: BatchComputation['massBalance']['lines']): number {
  return lines
    .filter((l) => l.ingredient.kind === 'acid')
    .reduce((sum, l) => sum + (l.massG * (l.ingredient.acidPct ?? 100)) / 100, 0);
}

/** The main fruit: the fruit line with the largest mass (the first of equals). */
function mainFruit(lines: readonly FeatureLine[], computation: BatchComputation): { ingredientId: string; name: string } | null {
  let best: { ingredientId: string; name: string; massG: number } | null = null;
  for (const resolved of computation.massBalance.lines) {
    const line = lines[resolved.index];
    if (!line || resolved.ingredient.kind !== 'fruit') continue;
    if (!best || resolved.massG > best.massG) best = { ingredientId: line.ingredientId.toLowerCase(), name: resolved.ingredient.name, massG: resolved.massG };
  }
  return best && { ingredientId: best.ingredientId, name: best.name };
}

export function familyName(productClass: FamilyInfo['productClass'], fruitName: string): string {
  return `${fruitName} ${PRODUCT_CLASS_NAMES[productClass]}`;
}

/**
 * The factors of a formula. `computation` is the lines' own computeFormula result when the caller
 * has it (the editor does); otherwise it is computed here.
 */
export function formulaFeatures(settings: FormulaSettingsInput, lines: readonly FeatureLine[], computation?: BatchComputation): FeatureOutcome {
  let computed = computation;
  if (!computed) {
    const outcome = computeFormula(settings, [...lines]);
    if (!outcome.ok) return { ok: false, message: outcome.message };
    computed = outcome.computation;
  }
  const mb = computed.massBalance;
  if (!(mb.fruitMassG > 0)) return { ok: false, message: 'The formula has no fruit, so its sugar ratio and fruit content are undefined.' };
  if (!(mb.finishedMassG > 0)) return { ok: false, message: 'The formula has no finished mass.' };
  const factors: FactorValues = {
    sugarRatio: mb.sweetenerMassG / mb.fruitMassG,
    targetSolidsPct: mb.targetSolidsPct,
    pectinPct: mb.pectinPctOfFinished,
    acidPct: (citricEquivalentG(mb.lines) / mb.finishedMassG) * 100,
    fruitPer1000g: mb.fruitPer1000gFinishedG,
  };
  const fruit = mainFruit(lines, computed);
  const family: FamilyInfo | null = fruit
    ? {
        productClass: settings.productClass,
        fruitIngredientId: fruit.ingredientId,
        slug: familySlug({ productClass: settings.productClass, fruitIngredientId: fruit.ingredientId }),
        name: familyName(settings.productClass, fruit.name),
        fruitName: fruit.name,
      }
    : null;
  return {
    ok: true,
    features: { factors, pectinFamily: pectinFamilyOf(mb.lines.filter((l) => l.ingredient.kind === 'pectin').map((l) => l.ingredient)), family },
  };
}
