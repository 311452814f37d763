/**
 * Issue 15 part 7: the sugar profile of each ingredient (sucrose, glucose, fructose per 100 g) reaches
 * every stored or computed formula line — a saved revision, a variant made from it, the batch
 * calculator by library id and with an ingredient of its own — so the water activity is the
 * sugar-based estimate of lib/chemistry, not the one modelled from the ingredient kinds.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, actorOf, type WorkspaceFixture } from './harness';
import { starterIds, strawberryJamInput } from './fixtures';
import * as formulasRoute from '@/app/api/v1/formulas/route';
import * as formulaRoute from '@/app/api/v1/formulas/[formulaId]/route';
import * as calcRoute from '@/app/api/v1/calc/batch/route';
import { getEm } from '@/lib/db';
import { FormulaRevision } from '@/entities';
import { estimateWaterActivityFromSugars, type SugarProfile } from '@/lib/chemistry/water-activity';
import type { ResolvedLine } from '@/lib/chemistry/mass-balance';
import { createTrial } from '@/lib/trials/mutations';
import { listVariants } from '@/lib/trials/queries';

let a: WorkspaceFixture;
const dev = () => ({ kind: 'session' as const, person: a.people.developer });

// Source: USDA National Nutrient Database for Standard Reference, Legacy Release 28 — NDB 09316
// (Strawberries, raw): sucrose 0.47, glucose 1.99, fructose 2.44 g per 100 g; NDB 19335 (Sugars,
// granulated): sucrose 99.80, glucose 0, fructose 0 g per 100 g (../shared/nutrition-references.md).
const STRAWBERRY_SUGARS = { sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 };
const GRANULATED_SUGARS = { sucroseG: 99.8, glucoseG: 0, fructoseG: 0 };
// Anhydrous citric acid holds no sugar (pure substance, by definition); SR28 NDB 19310 gives pectin none.
const CITRIC_SUGARS = { sucroseG: 0, glucoseG: 0, fructoseG: 0 };
const LINE_SUGARS: Array<SugarProfile | null> = [STRAWBERRY_SUGARS, GRANULATED_SUGARS, null, CITRIC_SUGARS];

/** The pure module's estimate for the given mass balance with each line's full profile. */
function expectedAw(lines: ResolvedLine[], finishedMassG: number): number {
  return estimateWaterActivityFromSugars(lines.map((line, i) => ({ line, sugars: LINE_SUGARS[i] })), finishedMassG).aw;
}

beforeAll(async () => {
  a = await createWorkspace('Sugar profiles');
});

describe('a saved formula keeps each line\'s sugar profile', () => {
  it('stores sucrose, glucose and fructose with the line and computes water activity from them', async () => {
    const input = await strawberryJamInput(a);
    const created = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const formulaId: string = created.body.formulaId;

    const em = await getEm();
    const revision = await em.findOneOrFail(FormulaRevision, { formula: formulaId, number: 1 });
    expect(revision.lines.map((l) => l.ingredient.sugars ?? null)).toEqual([STRAWBERRY_SUGARS, GRANULATED_SUGARS, null, CITRIC_SUGARS]);

    const detail = await callRoute(formulaRoute.GET, { method: 'GET', path: `/api/v1/formulas/${formulaId}`, caller: dev(), params: { formulaId } });
    expect(detail.status).toBe(200);
    const { lines } = detail.body.formula.current;
    expect(lines[0].ingredient.sugars).toEqual(STRAWBERRY_SUGARS);
    const computation = detail.body.formula.computation;
    expect(computation.waterActivity.model).toMatch(/sugars from the ingredients' profiles where known/);
    expect(computation.waterActivity.linesFromProfile).toEqual([0, 1, 3]);
    expect(computation.waterActivity.aw).toBeCloseTo(expectedAw(computation.massBalance.lines, computation.massBalance.finishedMassG), 12);
  });

  it('passes the profile on to the variants of a trial on that formula', async () => {
    const { formulaId } = await (async () => {
      const res = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: await strawberryJamInput(a) });
      return res.body as { formulaId: string };
    })();
    const actor = actorOf(a, 'developer');
    const { trialId } = await createTrial(actor, { title: 'Sugar profile trial', question: 'Does the profile travel?', formulaId });
    const variants = await listVariants(actor, trialId);
    expect(variants[0].lines.map((l) => l.ingredient.sugars ?? null)).toEqual(LINE_SUGARS);
  });
});

describe('the batch calculator uses each ingredient\'s sugar profile', () => {
  it('by library id: the same estimate as the pure module with the full profile', async () => {
    const input = await strawberryJamInput(a);
    const res = await callRoute(calcRoute.POST, { method: 'POST', path: '/api/v1/calc/batch', caller: dev(), body: { settings: input.settings, lines: input.lines } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const c = res.body.computation;
    expect(c.waterActivity.linesFromProfile).toEqual([0, 1, 3]);
    expect(c.waterActivity.aw).toBeCloseTo(expectedAw(c.massBalance.lines, c.massBalance.finishedMassG), 12);
  });

  it('with an ingredient of the request\'s own: the sugars of its label data count', async () => {
    const ids = await starterIds(a);
    const input = await strawberryJamInput(a);
    const nutrients = { ...STRAWBERRY_SUGARS };
    const res = await callRoute(calcRoute.POST, {
      method: 'POST', path: '/api/v1/calc/batch', caller: dev(),
      body: {
        settings: input.settings,
        lines: [
          { ingredient: { name: 'Own strawberries', kind: 'fruit', solidsPct: 8, euFruitGroup: 'general', labelData: { nutrients } }, quantity: 1000, unit: 'g' },
          { ingredientId: ids.sucrose, quantity: 1000, unit: 'g' },
          { ingredientId: ids.pectin_hm_rapid_150, quantity: 6, unit: 'g' },
          { ingredientId: ids.citric_acid_anhydrous, quantity: 5.5, unit: 'g' },
        ],
      },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const c = res.body.computation;
    expect(c.waterActivity.linesFromProfile).toEqual([0, 1, 3]);
    expect(c.waterActivity.aw).toBeCloseTo(expectedAw(c.massBalance.lines, c.massBalance.finishedMassG), 12);
  });

  it('with only part of a profile, the line is modelled from its kind (an unknown sugar is never zero)', async () => {
    const ids = await starterIds(a);
    const input = await strawberryJamInput(a);
    const res = await callRoute(calcRoute.POST, {
      method: 'POST', path: '/api/v1/calc/batch', caller: dev(),
      body: {
        settings: input.settings,
        lines: [
          { ingredient: { name: 'Own strawberries', kind: 'fruit', solidsPct: 8, euFruitGroup: 'general', labelData: { nutrients: { glucoseG: 1.99, fructoseG: 2.44 } } }, quantity: 1000, unit: 'g' },
          { ingredientId: ids.sucrose, quantity: 1000, unit: 'g' },
        ],
      },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.computation.waterActivity.linesFromProfile).toEqual([1]);
    expect(res.body.computation.waterActivity.linesFromKind).toEqual([0]);
  });
});

describe('the share of sucrose inverted in the boil (a formula setting)', () => {
  it('is stored with the revision, read back, and used by the water-activity estimate; out of range is a 422 that stores nothing', async () => {
    const input = await strawberryJamInput(a);
    const created = await callRoute(formulasRoute.POST, {
      method: 'POST', path: '/api/v1/formulas', caller: dev(),
      body: { ...input, name: 'Strawberry, quarter inverted', settings: { ...input.settings, sucroseInversionPct: 25 } },
    });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const formulaId: string = created.body.formulaId;
    const detail = await callRoute(formulaRoute.GET, { method: 'GET', path: `/api/v1/formulas/${formulaId}`, caller: dev(), params: { formulaId } });
    expect(detail.body.formula.current.settings.sucroseInversionPct).toBe(25);
    const { waterActivity, massBalance } = detail.body.formula.computation;
    // Source: lib/chemistry/water-activity.ts estimateWaterActivityFromSugars (tested against the stoichiometry in tests/unit/chemistry).
    const expected = estimateWaterActivityFromSugars(massBalance.lines.map((line: ResolvedLine, i: number) => ({ line, sugars: LINE_SUGARS[i] })), massBalance.finishedMassG, { sucroseInversionFraction: 0.25 }).aw;
    expect(waterActivity.aw).toBeCloseTo(expected, 12);
    expect(waterActivity.aw).toBeLessThan(expectedAw(massBalance.lines, massBalance.finishedMassG));
    expect(waterActivity.model).toMatch(/25 % of the sucrose taken as inverted/);

    const em = (await getEm()).fork();
    const before = await em.count(FormulaRevision, { workspace: a.workspaceId });
    for (const bad of [-5, 100.01, '25', 1e308]) {
      const refused = await callRoute(formulasRoute.POST, {
        method: 'POST', path: '/api/v1/formulas', caller: dev(),
        body: { ...input, name: 'Strawberry, bad inversion', settings: { ...input.settings, sucroseInversionPct: bad } },
      });
      expect(refused.status).toBe(422);
      expect(JSON.stringify(refused.body)).toContain('sucroseInversionPct');
    }
    expect(await em.count(FormulaRevision, { workspace: a.workspaceId })).toBe(before);
  });
});
