/**
 * Demo formulas for Hollowmere Preserves: invented recipes in our own scenario. They are
 * chosen so a newcomer sees, at first sign-in, a formula that passes, one that fails the
 * EU fruit minimum raised in June 2026, and one that raises food-safety cautions.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { Ingredient } from '@/entities';
import { createFormula, reviseFormula } from '@/lib/formulas/mutations';
import { updateIngredient } from '@/lib/ingredients/mutations';
import { STARTER_LABEL_DATA } from '@/lib/ingredients/starter-composition';
import type { IngredientLabelFields } from '@/lib/ingredients/label-data';
import type { IngredientInput } from '@/lib/ingredients/schema';
import { findTypicalIngredient } from '@/lib/chemistry';
import type { CreateFormulaInput } from '@/lib/formulas/schema';
import type { Actor } from '@/lib/permissions';

type Line = [key: string, grams: number];

function linesOf(ids: Record<string, string>, lines: Line[]): CreateFormulaInput['lines'] {
  return lines.map(([key, grams]) => ({ ingredientId: ids[key], quantity: grams, unit: 'g' as const }));
}

function input(ids: Record<string, string>, name: string, settings: CreateFormulaInput['settings'], lines: Line[], note: string, description?: string): CreateFormulaInput {
  return { name, description, settings, lines: linesOf(ids, lines), note };
}

/**
 * The demo kitchen's own values where the food table has gaps (SR28 gives no sugars for pectin, no
 * sugars or fibre for blackcurrants), so every ingredient of a seeded formula has a complete
 * composition. Invented supplier sheets and kitchen analyses, plausible for the products.
 */
const DEMO_OWN_VALUES: Record<string, { nutrients: Partial<IngredientLabelFields['nutrients']>; source: string }> = {
  pectin_hm_rapid_150: {
    nutrients: { waterG: 9, energyKj: 790, energyKcal: 195, proteinG: 0.5, fatG: 0.2, saturatesG: 0.05, carbohydrateG: 88, sugarsG: 2, sucroseG: 2, glucoseG: 0, fructoseG: 0, fibreG: 80, sodiumMg: 280 },
    source: 'Supplier specification sheet, Tarnbeck Ingredients, HM 150 rapid set (demo)',
  },
  pectin_lm_amidated: {
    nutrients: { waterG: 10, energyKj: 760, energyKcal: 188, proteinG: 0.6, fatG: 0.2, saturatesG: 0.05, carbohydrateG: 86, sugarsG: 1.5, sucroseG: 1.5, glucoseG: 0, fructoseG: 0, fibreG: 79, sodiumMg: 150 },
    source: 'Supplier specification sheet, Tarnbeck Ingredients, LM amidated (demo)',
  },
  blackcurrant: {
    nutrients: { sugarsG: 8.1, sucroseG: 0.6, glucoseG: 3.4, fructoseG: 4.1, fibreG: 4.6 },
    source: 'Hollowmere kitchen laboratory, lot BC-2026-07 (demo); other values USDA SR28 NDB 09083',
  },
};

async function completeDemoComposition(developer: Actor, ids: Record<string, string>): Promise<void> {
  for (const [key, own] of Object.entries(DEMO_OWN_VALUES)) {
    const typical = findTypicalIngredient(key);
    if (!typical) continue;
    const { key: _key, source: _source, ...composition } = typical;
    void _key; void _source;
    const starter = STARTER_LABEL_DATA[key];
    const labelData: IngredientLabelFields = { ...starter, nutrients: { ...starter.nutrients, ...own.nutrients }, source: own.source };
    await updateIngredient(developer, ids[key], { ...composition, notes: null, labelData } as IngredientInput);
  }
}

export async function seedDemoFormulas(em: EntityManager, developer: Actor): Promise<number> {
  const rows = await em.find(Ingredient, { workspace: developer.workspaceId, typicalKey: { $ne: null } });
  const ids = Object.fromEntries(rows.map((r) => [r.typicalKey!, r.id]));
  const today = '2026-11-20';
  await completeDemoComposition(developer, ids);
  // The story's days: the formulas are written up in February, one a day, before the first trial of
  // the apricot spread's history (lib/seed/model-history.ts, from March). One a day keeps the list's
  // newest-first order free of ties.
  let day = 16;
  const written = () => ({ at: new Date(Date.UTC(2026, 1, day++, 9)) });

  const strawberry = await createFormula(
    developer,
    input(ids, 'Hedgerow strawberry jam', { productClass: 'jam', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 65, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.2 }, [
      ['strawberry', 1000], ['sucrose', 1000], ['pectin_hm_rapid_150', 7], ['citric_acid_anhydrous', 5],
    ], 'First kitchen batch, one-to-one fruit and sugar', 'House strawberry jam for the farm shop; soft set.'),
    written(),
  );
  await reviseFormula(developer, strawberry.formulaId, {
    baseRevision: 1,
    settings: { productClass: 'jam', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 65, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.1 },
    lines: linesOf(ids, [['strawberry', 1000], ['sucrose', 850], ['pectin_hm_rapid_150', 8], ['citric_acid_anhydrous', 6], ['lemon_juice', 30]]),
    note: 'Less sugar, a little more pectin and lemon for a brighter set',
  }, written());

  await createFormula(
    developer,
    input(ids, 'Raspberry jam, economy trial', { productClass: 'jam', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 65, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.1 }, [
      ['raspberry', 600], ['sucrose', 1000], ['pectin_hm_rapid_150', 6], ['citric_acid_anhydrous', 4],
    ], 'Cost-down idea: less fruit', 'Checks how far fruit can drop. Under the rules in force since 14 June 2026 it is too little fruit to be called jam.'),
    written(),
  );

  await createFormula(
    developer,
    input(ids, 'Apricot spread, reduced sugar', { productClass: 'reduced_sugar_spread', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 45, jarNetFillG: 250, altitudeM: 120, plannedPh: 3.7 }, [
      ['apricot', 1000], ['sucrose', 420], ['pectin_lm_amidated', 10], ['calcium_citrate', 1], ['lemon_juice', 40],
    ], 'Low-methoxyl set at 45 % solids', 'Reduced-sugar line for the deli. Needs refrigeration after opening and a preservation step; see the cautions.'),
    written(),
  );

  await createFormula(
    developer,
    input(ids, 'Blackcurrant jam', { productClass: 'jam', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 67, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.0 }, [
      ['blackcurrant', 900], ['sucrose', 1100], ['water', 250], ['pectin_hm_rapid_150', 3],
    ], 'Blackcurrant sets on its own pectin; a little added for safety'),
    written(),
  );

  await createFormula(
    developer,
    input(ids, 'Bitter orange marmalade', { productClass: 'marmalade', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 67, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.0 }, [
      ['bitter_orange', 800], ['sucrose', 1200], ['water', 900], ['lemon_juice', 60],
    ], 'Thick-cut, long boil'),
    written(),
  );

  // Potassium sorbate: 1.5 g gives about 0.91 g sorbic acid per kg of the about 1.23 kg made, near but under
  // the 1,000 mg/kg (as free acid) that Regulation (EC) 1333/2008 Annex II allows low-sugar jams (memory);
  // less sugar means less product, and the same dose then crosses the limit.
  await createFormula(
    developer,
    input(ids, 'Strawberry spread, less sugar', { productClass: 'reduced_sugar_spread', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 42, jarNetFillG: 250, altitudeM: 120, plannedPh: 3.3, preservation: 'preservative' }, [
      ['strawberry', 1000], ['sucrose', 420], ['pectin_lm_amidated', 12], ['calcium_citrate', 1.5], ['citric_acid_anhydrous', 3], ['potassium_sorbate', 1.5],
    ], 'Low-methoxyl set at 42 % solids, kept with sorbate', 'Deli line with about a third less sugar than the house strawberry jam; the sorbate dose sits close to its limit.'),
    written(),
  );
  return 6;
}
