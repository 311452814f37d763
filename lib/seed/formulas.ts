/**
 * Demo formulas for Hollowmere Preserves: invented recipes in our own scenario. They are
 * chosen so a newcomer sees, at first sign-in, a formula that passes, one that fails the
 * EU fruit minimum raised in June 2026, and one that raises food-safety cautions.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { Ingredient } from '@/entities';
import { createFormula, reviseFormula } from '@/lib/formulas/mutations';
import type { CreateFormulaInput } from '@/lib/formulas/schema';
import type { Actor } from '@/lib/permissions';

type Line = [key: string, grams: number];

function linesOf(ids: Record<string, string>, lines: Line[]): CreateFormulaInput['lines'] {
  return lines.map(([key, grams]) => ({ ingredientId: ids[key], quantity: grams, unit: 'g' as const }));
}

function input(ids: Record<string, string>, name: string, settings: CreateFormulaInput['settings'], lines: Line[], note: string, description?: string): CreateFormulaInput {
  return { name, description, settings, lines: linesOf(ids, lines), note };
}

export async function seedDemoFormulas(em: EntityManager, developer: Actor): Promise<number> {
  const rows = await em.find(Ingredient, { workspace: developer.workspaceId, typicalKey: { $ne: null } });
  const ids = Object.fromEntries(rows.map((r) => [r.typicalKey!, r.id]));
  const today = '2026-11-20';

  const strawberry = await createFormula(
    developer,
    input(ids, 'Hedgerow strawberry jam', { productClass: 'jam', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 65, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.2 }, [
      ['strawberry', 1000], ['sucrose', 1000], ['pectin_hm_rapid_150', 7], ['citric_acid_anhydrous', 5],
    ], 'First kitchen batch, one-to-one fruit and sugar', 'House strawberry jam for the farm shop; soft set.'),
  );
  await reviseFormula(developer, strawberry.formulaId, {
    baseRevision: 1,
    settings: { productClass: 'jam', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 65, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.1 },
    lines: linesOf(ids, [['strawberry', 1000], ['sucrose', 850], ['pectin_hm_rapid_150', 8], ['citric_acid_anhydrous', 6], ['lemon_juice', 30]]),
    note: 'Less sugar, a little more pectin and lemon for a brighter set',
  });

  await createFormula(
    developer,
    input(ids, 'Raspberry jam, economy trial', { productClass: 'jam', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 65, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.1 }, [
      ['raspberry', 600], ['sucrose', 1000], ['pectin_hm_rapid_150', 6], ['citric_acid_anhydrous', 4],
    ], 'Cost-down idea: less fruit', 'Checks how far fruit can drop. Under the rules in force since 14 June 2026 it is too little fruit to be called jam.'),
  );

  await createFormula(
    developer,
    input(ids, 'Apricot spread, reduced sugar', { productClass: 'reduced_sugar_spread', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 45, jarNetFillG: 250, altitudeM: 120, plannedPh: 3.7 }, [
      ['apricot', 1000], ['sucrose', 420], ['pectin_lm_amidated', 10], ['calcium_citrate', 1], ['lemon_juice', 40],
    ], 'Low-methoxyl set at 45 % solids', 'Reduced-sugar line for the deli. Needs refrigeration after opening and a preservation step; see the cautions.'),
  );

  await createFormula(
    developer,
    input(ids, 'Blackcurrant jam', { productClass: 'jam', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 67, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.0 }, [
      ['blackcurrant', 900], ['sucrose', 1100], ['water', 250], ['pectin_hm_rapid_150', 3],
    ], 'Blackcurrant sets on its own pectin; a little added for safety'),
  );

  await createFormula(
    developer,
    input(ids, 'Bitter orange marmalade', { productClass: 'marmalade', ruleSet: 'eu', ruleDate: today, targetSolidsPct: 67, jarNetFillG: 340, altitudeM: 120, plannedPh: 3.0 }, [
      ['bitter_orange', 800], ['sucrose', 1200], ['water', 900], ['lemon_juice', 60],
    ], 'Thick-cut, long boil'),
  );
  return 5;
}
