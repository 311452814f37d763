/**
 * A formula's model factors, worked by hand from the mass balance. Ingredient solids and acidity
 * are lib/chemistry's typical values (apricot 11.7 °Brix, lemon juice 4.5 °Brix and about 5 % acid
 * as citric, powders counted as wholly soluble). The factor definitions are ours (common practice,
 * no published source): sugar ratio as weighed over fruit, pectin and acid over the finished mass.
 */
import { describe, it, expect } from 'vitest';
import { findTypicalIngredient, type IngredientComposition } from '@/lib/chemistry';
import { formulaFeatures, type FeatureLine } from '@/lib/modelling/features';
import { familySlugSchema, optimiseRequestSchema, responseKeySchema } from '@/lib/modelling/schema';
import { computeFormula } from '@/lib/formulas/compute';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';

const APRICOT_ID = '6f1c2b1e-0c55-4a8e-9d33-2a7f0f6b9a01';

function composition(key: string): IngredientComposition {
  const typical = findTypicalIngredient(key)!;
  const { key: _key, source: _source, ...rest } = typical;
  void _key; void _source;
  return rest;
}

function line(key: string, grams: number, ingredientId = `00000000-0000-4000-8000-${String(key.length).padStart(12, '0')}`): FeatureLine {
  return { ingredientId, ingredient: composition(key), quantity: grams, unit: 'g' };
}

const spread: FormulaSettingsInput = {
  productClass: 'reduced_sugar_spread', ruleSet: 'eu', ruleDate: '2026-11-20', targetSolidsPct: 46, jarNetFillG: 250,
  altitudeM: null, measuredWaterBoilingC: null, plannedPh: null, preservation: null,
};

const centre = [line('apricot', 1000, APRICOT_ID), line('sucrose', 400), line('pectin_lm_amidated', 10), line('calcium_citrate', 1), line('lemon_juice', 40)];

describe('formulaFeatures', () => {
  it('computes the factors of the demo centre point by hand', () => {
    // Soluble solids in: 117 (apricot) + 400 + 10 + 1 + 1.8 (40 g lemon × 4.5 %) = 529.8 g;
    // finished mass 529.8 / 0.46 = 1151.739 g.
    const outcome = formulaFeatures(spread, centre);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    const { factors, pectinFamily, family } = outcome.features;
    const finished = 529.8 / 0.46;
    expect(factors.sugarRatio).toBeCloseTo(0.4, 12);
    expect(factors.targetSolidsPct).toBe(46);
    expect(factors.pectinPct).toBeCloseTo((10 / finished) * 100, 9); // 0.8683 %
    expect(factors.acidPct).toBeCloseTo((2 / finished) * 100, 9); // 40 g × 5 % = 2 g citric: 0.1737 %
    expect(factors.fruitPer1000g).toBeCloseTo((1000 / finished) * 1000, 6); // 868.25 g
    expect(pectinFamily).toBe('lm');
    expect(family).toMatchObject({ productClass: 'reduced_sugar_spread', fruitIngredientId: APRICOT_ID, name: 'Apricot reduced-sugar spread', fruitName: 'Apricot' });
    expect(family!.slug).toBe(`reduced_sugar_spread.${APRICOT_ID}`);
  });

  it('gives the same answer from the computation the editor already has', () => {
    const computed = computeFormula(spread, centre);
    if (!computed.ok) throw new Error(computed.message);
    expect(formulaFeatures(spread, centre, computed.computation)).toEqual(formulaFeatures(spread, centre));
  });

  it('counts a dry acid whole, and names the pectin family', () => {
    const jam = { ...spread, productClass: 'jam' as const, targetSolidsPct: 65 };
    const lines = [line('apricot', 1000, APRICOT_ID), line('sucrose', 1000), line('pectin_hm_rapid_150', 5), line('citric_acid_anhydrous', 4)];
    const outcome = formulaFeatures(jam, lines);
    if (!outcome.ok) throw new Error(outcome.message);
    // Solids in: 117 + 1000 + 5 + 4 = 1126 g; finished 1126 / 0.65 = 1732.3 g; acid 4 g → 0.2309 %.
    expect(outcome.features.factors.acidPct).toBeCloseTo((4 / (1126 / 0.65)) * 100, 9);
    expect(outcome.features.factors.sugarRatio).toBe(1);
    expect(outcome.features.pectinFamily).toBe('hm');
    const mixed = formulaFeatures(jam, [...lines, line('pectin_lm_amidated', 2)]);
    expect(mixed.ok && mixed.features.pectinFamily).toBe('mixed');
    const none = formulaFeatures(jam, lines.filter((l) => l.ingredient.kind !== 'pectin'));
    expect(none.ok && none.features.pectinFamily).toBe('none');
  });

  it('picks the heaviest fruit as the main fruit', () => {
    const outcome = formulaFeatures(spread, [line('strawberry', 300), ...centre]);
    expect(outcome.ok && outcome.features.family?.fruitIngredientId).toBe(APRICOT_ID);
  });

  it('refuses a formula the chemistry cannot compute, with its reason', () => {
    const outcome = formulaFeatures(spread, [line('sucrose', 400)]);
    expect(outcome.ok).toBe(false);
  });
});

describe('the modelling request shapes', () => {
  it('reads a family slug and refuses anything else', () => {
    expect(familySlugSchema.parse(`jam.${APRICOT_ID.toUpperCase()}`)).toEqual({ productClass: 'jam', fruitIngredientId: APRICOT_ID });
    for (const bad of ['jam', `toffee.${APRICOT_ID}`, 'jam.not-a-uuid', `__proto__.${APRICOT_ID}`, `jam.${APRICOT_ID}\u0000`]) {
      expect(familySlugSchema.safeParse(bad).success).toBe(false);
    }
  });

  it('accepts lab and attribute responses only', () => {
    expect(responseKeySchema.safeParse('lab:measuredPh').success).toBe(true);
    expect(responseKeySchema.safeParse(`attribute:${APRICOT_ID}`).success).toBe(true);
    for (const bad of ['lab:colour', 'attribute:1', 'constructor', `attribute:${APRICOT_ID}x`]) expect(responseKeySchema.safeParse(bad).success).toBe(false);
  });

  it('validates an optimise request: goals, bounds, unknown keys, sizes', () => {
    const valid = {
      family: `reduced_sugar_spread.${APRICOT_ID}`,
      factors: [{ name: 'sugarRatio', low: 0.3, high: 0.36 }, { name: 'pectinPct', low: 0.5, high: 1.2 }],
      goals: [{ response: `attribute:${APRICOT_ID}`, goal: { kind: 'maximise', low: 5, high: 8 } }],
      constraints: { fruitMinimumPer1000g: 450, ph: { low: 3.3, high: 3.7 } },
    };
    expect(optimiseRequestSchema.safeParse(valid).success).toBe(true);
    expect(optimiseRequestSchema.safeParse({ ...valid, extra: 1 }).success).toBe(false);
    expect(optimiseRequestSchema.safeParse({ ...valid, factors: [{ name: 'sugarRatio', low: 0.4, high: 0.3 }] }).success).toBe(false);
    expect(optimiseRequestSchema.safeParse({ ...valid, factors: [...valid.factors, valid.factors[0]] }).success).toBe(false);
    expect(optimiseRequestSchema.safeParse({ ...valid, goals: Array.from({ length: 9 }, () => valid.goals[0]) }).success).toBe(false);
    expect(optimiseRequestSchema.safeParse({ ...valid, goals: [{ ...valid.goals[0], goal: { kind: 'maximise', low: 5, high: 2 ** 60 } }] }).success).toBe(false);
    expect(optimiseRequestSchema.safeParse({ ...valid, proposals: 2 ** 31 }).success).toBe(false);
  });
});
