import { describe, expect, it } from 'vitest';
import {
  computeMassBalance, estimateBatchWaterActivity, estimateWaterActivityFromSugars, rossMixtureAw,
} from '@/lib/chemistry';
import type { IngredientComposition, SugarProfile } from '@/lib/chemistry';
import { settings } from './fixtures';

const STRAWBERRY: IngredientComposition = { kind: 'fruit', name: 'Strawberry', solidsPct: 8 };
const SUGAR: IngredientComposition = { kind: 'sweetener', name: 'Sugar', solidsPct: 100, sweetenerType: 'sucrose' };
// Source: USDA SR28 NDB 09316 (strawberries, raw) and 19335 (sugars, granulated), per docs/nutrition-check-values.md "Individual sugars".
const STRAWBERRY_SUGARS: SugarProfile = { sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 };
const SUGAR_SUGARS: SugarProfile = { sucroseG: 99.8, glucoseG: 0, fructoseG: 0 };

/** The 1:1 strawberry jam of docs/nutrition-check-values.md example (a), fruit and sugar only, at `brix`. */
function strawberryJam(brix: number, fruitProfile: SugarProfile | null = STRAWBERRY_SUGARS) {
  const mb = computeMassBalance([
    { ingredient: STRAWBERRY, quantity: 1000, unit: 'g' },
    { ingredient: SUGAR, quantity: 1000, unit: 'g' },
  ], settings({ targetSolidsPct: brix }));
  return { mb, lines: [{ line: mb.lines[0], sugars: fruitProfile }, { line: mb.lines[1], sugars: SUGAR_SUGARS }] };
}

describe('water activity from the sugars present', () => {
  it('agrees with the kind-based estimate when the sugars are those the kinds assume', () => {
    // Source: lib/chemistry/water-activity.ts (the kind-based method); both are Norrish binaries combined by Ross's rule
    const { mb, lines } = strawberryJam(65);
    const fromSugars = estimateWaterActivityFromSugars(lines, mb.finishedMassG);
    expect(fromSugars.aw).toBeCloseTo(estimateBatchWaterActivity(mb.lines, mb.finishedMassG).aw, 3);
    expect(fromSugars.linesFromProfile).toEqual([0, 1]);
    expect(fromSugars.model).toMatch(/profiles/);
  });

  it('counts full inversion as glucose + fructose with the water the hydrolysis takes', () => {
    // Source: stoichiometry of sucrose + water → glucose + fructose (342.3 + 18.015 g/mol → glucose + fructose, mass conserved)
    const mb = computeMassBalance([{ ingredient: SUGAR, quantity: 65, unit: 'g' }], settings({ targetSolidsPct: 65 }));
    const pure = [{ line: mb.lines[0], sugars: { sucroseG: 100, glucoseG: 0, fructoseG: 0 } }];
    const inverted = estimateWaterActivityFromSugars(pure, mb.finishedMassG, { sucroseInversionFraction: 1 });
    // 1 g sucrose + 0.0526 g water → 0.5263 g glucose + 0.5263 g fructose.
    const each = (65 * (1 + 18.015 / 342.3)) / 2;
    const water = 35 - 65 * (18.015 / 342.3);
    expect(inverted.aw).toBeCloseTo(rossMixtureAw([{ solute: 'glucose', massG: each }, { solute: 'fructose', massG: each }], water).aw, 10);
    expect(inverted.waterG).toBeCloseTo(water, 10);
    expect(inverted.model).toMatch(/100 % of the sucrose taken as inverted/);
  });

  it('lowers the estimate as more sucrose is inverted', () => {
    // Source: colligative principle (two monosaccharide molecules per sucrose); Norrish K for glucose and fructose below sucrose's
    const { mb, lines } = strawberryJam(65);
    const at = (f: number) => estimateWaterActivityFromSugars(lines, mb.finishedMassG, { sucroseInversionFraction: f }).aw;
    expect(at(0.25)).toBeLessThan(at(0));
    expect(at(0.5)).toBeLessThan(at(0.25));
  });

  it('places a 68 °Brix strawberry jam with a quarter of its sucrose inverted among the jams of the published tables, erring high', () => {
    // Source: New York State Department of Agriculture and Markets, "Water Activity" (principal groups of foods by aw):
    // jams and jellies in the group "below 0.85 to 0.60". The aw table of foods reproduced on laboratory and extension
    // pages (attributed to Beuchat 1981, memory) puts jam and marmalade in its 0.75–0.80 row.
    // Expected error: Norrish/Ross about 2 % of aw in sugar solutions (Sereno et al., J. Food Eng., 2001); this estimate
    // (0.831) is 0.03 above the top of the 0.75–0.80 row, so it errs on the safe (high) side by up to 0.05.
    const { mb, lines } = strawberryJam(68);
    const aw = estimateWaterActivityFromSugars(lines, mb.finishedMassG, { sucroseInversionFraction: 0.25 }).aw;
    expect(aw).toBeCloseTo(0.831, 3);
    expect(aw).toBeLessThan(0.85);
    expect(aw).toBeGreaterThanOrEqual(0.60);
    expect(aw - 0.80).toBeLessThan(0.05);
    expect(aw).toBeGreaterThan(0.75);
  });

  it('falls back to the kind-based model for a line without a full sugar profile', () => {
    // Source: issue 15 part 7 ("where known"); an unknown value is never taken as zero
    const { mb, lines } = strawberryJam(65, { sucroseG: 0.47, glucoseG: null, fructoseG: 2.44 });
    const estimate = estimateWaterActivityFromSugars(lines, mb.finishedMassG);
    expect(estimate.linesFromKind).toEqual([0]);
    expect(estimate.linesFromProfile).toEqual([1]);
    expect(estimate.model).toMatch(/where known/);
  });

  it('refuses an inverted share outside 0–1', () => {
    const { mb, lines } = strawberryJam(65);
    expect(() => estimateWaterActivityFromSugars(lines, mb.finishedMassG, { sucroseInversionFraction: 1.2 })).toThrow(/between 0 and 1/);
    expect(() => estimateWaterActivityFromSugars(lines, mb.finishedMassG, { sucroseInversionFraction: Number.NaN })).toThrow(/finite/);
  });
});

describe('the batch computation uses the ingredients’ sugars (issue 15, part 7)', () => {
  it('a formula whose library entries carry sugar profiles gets the sugar-mix estimate; one without keeps the kind-based one', async () => {
    const { computeBatch } = await import('@/lib/chemistry');
    // Source: USDA SR28 "Individual sugars" for 09316 and 19335 (docs/nutrition-check-values.md), as the library stores them.
    const withProfiles = computeBatch([
      { ingredient: { ...STRAWBERRY, sugars: { sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 } }, quantity: 1000, unit: 'g' },
      { ingredient: { ...SUGAR, sugars: { sucroseG: 99.8, glucoseG: 0, fructoseG: 0 } }, quantity: 1000, unit: 'g' },
    ], settings({ targetSolidsPct: 65 }));
    const { mb, lines } = strawberryJam(65);
    expect(withProfiles.waterActivity.aw).toBeCloseTo(estimateWaterActivityFromSugars(lines, mb.finishedMassG).aw, 12);
    expect(withProfiles.waterActivity.model).toMatch(/profiles/);

    const withoutProfiles = computeBatch([
      { ingredient: STRAWBERRY, quantity: 1000, unit: 'g' },
      { ingredient: SUGAR, quantity: 1000, unit: 'g' },
    ], settings({ targetSolidsPct: 65 }));
    expect(withoutProfiles.waterActivity.aw).toBeCloseTo(estimateBatchWaterActivity(mb.lines, mb.finishedMassG).aw, 12);
    expect(withoutProfiles.waterActivity.model).toMatch(/modelled from the ingredient kinds/);
  });

  it('takes the share of sucrose inverted in the boil from the formula’s settings, and refuses a share outside 0–100 %', async () => {
    const { computeBatch, ChemistryInputError } = await import('@/lib/chemistry');
    // Source: as above (USDA SR28 sugars); the inversion arithmetic is the stoichiometry tested in this file's second case.
    const lines = [
      { ingredient: { ...STRAWBERRY, sugars: { sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 } }, quantity: 1000, unit: 'g' as const },
      { ingredient: { ...SUGAR, sugars: { sucroseG: 99.8, glucoseG: 0, fructoseG: 0 } }, quantity: 1000, unit: 'g' as const },
    ];
    const none = computeBatch(lines, settings({ targetSolidsPct: 65 }));
    const quarter = computeBatch(lines, settings({ targetSolidsPct: 65, sucroseInversionPct: 25 }));
    const { mb, lines: profiled } = strawberryJam(65);
    expect(quarter.waterActivity.aw).toBeCloseTo(estimateWaterActivityFromSugars(profiled, mb.finishedMassG, { sucroseInversionFraction: 0.25 }).aw, 12);
    expect(quarter.waterActivity.aw).toBeLessThan(none.waterActivity.aw);
    expect(quarter.waterActivity.model).toMatch(/25 % of the sucrose taken as inverted/);
    expect(none.waterActivity.model).not.toMatch(/inverted/);
    for (const bad of [-1, 100.5, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => computeBatch(lines, settings({ targetSolidsPct: 65, sucroseInversionPct: bad }))).toThrow(ChemistryInputError);
    }
  });

  it('the settings schema takes the inverted share as an optional % and names the field when it is out of range', async () => {
    const { formulaSettingsSchema } = await import('@/lib/formulas/schema');
    const base = { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-12-01', targetSolidsPct: 65, jarNetFillG: 340 };
    expect(formulaSettingsSchema.safeParse(base).success).toBe(true);
    expect(formulaSettingsSchema.safeParse({ ...base, sucroseInversionPct: null }).success).toBe(true);
    expect(formulaSettingsSchema.safeParse({ ...base, sucroseInversionPct: 30 }).success).toBe(true);
    for (const bad of [-0.1, 101, 2 ** 53, '30']) {
      const parsed = formulaSettingsSchema.safeParse({ ...base, sucroseInversionPct: bad });
      expect(parsed.success).toBe(false);
      expect(parsed.error?.issues[0].path).toEqual(['sucroseInversionPct']);
    }
  });

  it('the library passes a profile on only when all three sugars are known', async () => {
    const { compositionOf } = await import('@/lib/ingredients/queries');
    const base = { kind: 'fruit' as const, name: 'Strawberry', solidsPct: 8 };
    expect(compositionOf(base, { sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 }).sugars).toEqual({ sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 });
    // Source: docs/nutrition-check-values.md — SR28 gives blackcurrant no sugars; unknown is never zero.
    expect(compositionOf(base, { sucroseG: null, glucoseG: 1.99, fructoseG: 2.44 }).sugars).toBeUndefined();
  });
});
