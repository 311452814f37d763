/** Formulas and the ingredient library through the real API handlers and database. */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, type WorkspaceFixture } from './harness';
import { starterIds, strawberryJamInput } from './fixtures';
import * as formulasRoute from '@/app/api/v1/formulas/route';
import * as formulaRoute from '@/app/api/v1/formulas/[formulaId]/route';
import * as revisionsRoute from '@/app/api/v1/formulas/[formulaId]/revisions/route';
import * as calcRoute from '@/app/api/v1/calc/batch/route';
import * as ingredientsRoute from '@/app/api/v1/ingredients/route';
import * as ingredientRoute from '@/app/api/v1/ingredients/[ingredientId]/route';
import * as exportRoute from '@/app/api/v1/ingredients/export/route';
import { getEm } from '@/lib/db';
import { Formula, FormulaRevision, Ingredient } from '@/entities';
import { GRAMS_PER_POUND } from '@/lib/chemistry';

let a: WorkspaceFixture;
let b: WorkspaceFixture;
const dev = () => ({ kind: 'session' as const, person: a.people.developer });

beforeAll(async () => {
  a = await createWorkspace('Formulas A');
  b = await createWorkspace('Formulas B');
});

async function counts() {
  const em = await getEm();
  return { formulas: await em.count(Formula, { workspace: a.workspaceId }), revisions: await em.count(FormulaRevision, { workspace: a.workspaceId }) };
}

describe('creating a formula', () => {
  it('stores revision 1 with a snapshot of each ingredient and lines in grams', async () => {
    const input = await strawberryJamInput(a);
    input.lines[0] = { ...input.lines[0], quantity: 2.2, unit: 'lb' };
    const res = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.revision).toBe(1);
    const detail = await callRoute(formulaRoute.GET, { method: 'GET', path: `/api/v1/formulas/${res.body.formulaId}`, caller: dev(), params: { formulaId: res.body.formulaId } });
    const line = detail.body.formula.current.lines[0];
    expect(line.unit).toBe('g');
    // Source: 1 lb = 453.59237 g exactly (international yard and pound agreement, 1959).
    expect(line.quantity).toBeCloseTo(2.2 * 453.59237, 9);
    expect(line.quantity).toBeCloseTo(2.2 * GRAMS_PER_POUND, 9);
    expect(line.ingredient).toMatchObject({ name: 'Strawberry', kind: 'fruit' });
    expect(detail.body.formula.computation.massBalance.totalChargeG).toBeCloseTo(2.2 * 453.59237 + 1000 + 6 + 5.5, 6);
  });

  it.each([
    ['a negative mass', (i: any) => { i.lines[1].quantity = -5; }, 'lines.1.quantity'],
    ['zero target solids', (i: any) => { i.settings.targetSolidsPct = 0; }, 'settings.targetSolidsPct'],
    ['an unknown ingredient', (i: any) => { i.lines[0].ingredientId = '00000000-0000-4000-8000-000000000000'; }, 'lines.0.ingredientId'],
    ['a non-number quantity', (i: any) => { i.lines[2].quantity = '12'; }, 'lines.2.quantity'],
    ['an unknown unit', (i: any) => { i.lines[2].unit = 'cup'; }, 'lines.2.unit'],
    ['no lines', (i: any) => { i.lines = []; }, 'lines'],
    ['an unknown field', (i: any) => { i.secret = true; }, '_'],
  ])('refuses %s with 422 naming the field, and writes nothing', async (_what, mutate, field) => {
    const before = await counts();
    const input = structuredClone(await strawberryJamInput(a)) as any;
    mutate(input);
    const res = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toHaveProperty([field]);
    expect(await counts()).toEqual(before);
  });

  it("refuses another workspace's ingredient exactly like an unknown one", async () => {
    const before = await counts();
    const input = await strawberryJamInput(a);
    input.lines[0].ingredientId = (await starterIds(b)).strawberry;
    const res = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    expect(res.status).toBe(422);
    expect(res.body.error.fields['lines.0.ingredientId'][0]).toBe('Choose an ingredient from this workspace’s library.');
    expect(await counts()).toEqual(before);
  });

  it('refuses a % of fruit line when the formula has no fruit (the chemistry cannot compute it)', async () => {
    const ids = await starterIds(a);
    const input = await strawberryJamInput(a, {
      lines: [
        { ingredientId: ids.sucrose, quantity: 1000, unit: 'g' },
        { ingredientId: ids.citric_acid_anhydrous, quantity: 0.5, unit: 'pct_fruit' },
      ],
    });
    const res = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)[0]).toMatch(/^lines/);
  });
});

describe('revisions', () => {
  it('every save is a new revision; a stale base gets 409 and force keeps both', async () => {
    const input = await strawberryJamInput(a);
    const created = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    const formulaId = created.body.formulaId;
    const path = `/api/v1/formulas/${formulaId}/revisions`;
    const params = { formulaId };
    const lessSugar = input.lines.map((l, i) => (i === 1 ? { ...l, quantity: 850 } : l));

    const first = await callRoute(revisionsRoute.POST, { method: 'POST', path, caller: dev(), params, body: { baseRevision: 1, settings: input.settings, lines: lessSugar, note: 'less sugar' } });
    expect(first.status).toBe(201);
    expect(first.body.revision).toBe(2);

    // A colleague still looking at revision 1 saves: refused, nothing written.
    const admin = { kind: 'session' as const, person: a.people.admin };
    const stale = await callRoute(revisionsRoute.POST, { method: 'POST', path, caller: admin, params, body: { baseRevision: 1, settings: input.settings, lines: input.lines, note: 'mine' } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/saved revision 2 after you opened revision 1/);

    const forced = await callRoute(revisionsRoute.POST, { method: 'POST', path, caller: admin, params, body: { baseRevision: 1, force: true, settings: input.settings, lines: input.lines, note: 'mine' } });
    expect(forced.body.revision).toBe(3);

    const history = await callRoute(revisionsRoute.GET, { method: 'GET', path, caller: dev(), params });
    expect(history.body.revisions.map((r: any) => [r.number, r.note])).toEqual([[3, 'mine'], [2, 'less sugar'], [1, 'First version']]);
    expect(history.body.revisions[1].lines[1].quantity).toBe(850);
  });

  it('a base revision that was never saved is a 422 naming baseRevision, with force too, and writes nothing (it was a 409 blaming a colleague)', async () => {
    const input = await strawberryJamInput(a);
    const created = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    const formulaId = created.body.formulaId;
    const path = `/api/v1/formulas/${formulaId}/revisions`;
    const params = { formulaId };
    for (const force of [false, true]) {
      const res = await callRoute(revisionsRoute.POST, { method: 'POST', path, caller: dev(), params, body: { baseRevision: 99, force, settings: input.settings, lines: input.lines } });
      expect(res.status).toBe(422);
      expect(res.body.error.fields.baseRevision).toEqual(['This formula has no revision 99; its latest is revision 1.']);
    }
    const history = await callRoute(revisionsRoute.GET, { method: 'GET', path, caller: dev(), params });
    expect(history.body.revisions.map((r: any) => r.number)).toEqual([1]);
  });

  it('a revision keeps the ingredient values it was saved with, even after the library changes', async () => {
    const ids = await starterIds(a);
    const input = await strawberryJamInput(a);
    const created = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    const edited = await callRoute(ingredientRoute.PATCH, {
      method: 'PATCH', path: `/api/v1/ingredients/${ids.strawberry}`, caller: dev(), params: { ingredientId: ids.strawberry },
      body: { name: 'Strawberry', kind: 'fruit', solidsPct: 9.5, pectinLevel: 'low', euFruitGroup: 'general', usFruitGroup: '1' },
    });
    expect(edited.status).toBe(200);
    const detail = await callRoute(formulaRoute.GET, { method: 'GET', path: '', caller: dev(), params: { formulaId: created.body.formulaId } });
    expect(detail.body.formula.current.lines[0].ingredient.solidsPct).toBe(8);
  });

  it('the database refuses to change a stored revision', async () => {
    const em = await getEm();
    await expect(em.getConnection().execute(`update formula_revisions set note = 'tampered' where workspace_id = ?`, [a.workspaceId])).rejects.toThrow(/immutable/);
  });
});

describe('the ingredient library', () => {
  it('starts with handbook values marked typical with a source; an edit makes them the workspace’s own', async () => {
    const list = await callRoute(ingredientsRoute.GET, { method: 'GET', path: '/api/v1/ingredients?kind=pectin', caller: dev() });
    expect(list.body.ingredients.length).toBeGreaterThan(0);
    for (const i of list.body.ingredients) {
      expect(i.kind).toBe('pectin');
      expect(i.origin).toBe('typical');
      expect(i.source.length).toBeGreaterThan(10);
    }
    const ids = await starterIds(a);
    const em = await getEm();
    expect((await em.findOneOrFail(Ingredient, { id: ids.strawberry })).origin).toBe('edited');
  });

  it('search and sort come from the query string', async () => {
    const res = await callRoute(ingredientsRoute.GET, { method: 'GET', path: '/api/v1/ingredients?q=rasp&sort=solidsPct&dir=desc', caller: dev() });
    expect(res.body.ingredients.map((i: any) => i.name)).toEqual(['Raspberry (red)']);
    const sorted = await callRoute(ingredientsRoute.GET, { method: 'GET', path: '/api/v1/ingredients?sort=solidsPct&dir=desc', caller: dev() });
    const solids = sorted.body.ingredients.map((i: any) => i.solidsPct);
    expect(solids).toEqual([...solids].sort((x: number, y: number) => y - x));
    const bad = await callRoute(ingredientsRoute.GET, { method: 'GET', path: '/api/v1/ingredients?sort=password', caller: dev() });
    expect(bad.status).toBe(422);
  });

  it('exports CSV with a header row and defuses spreadsheet formulas', async () => {
    await callRoute(ingredientsRoute.POST, { method: 'POST', path: '/api/v1/ingredients', caller: dev(), body: { name: '=HYPERLINK("x")', kind: 'other', solidsPct: 0 } });
    const req = new Request('http://127.0.0.1/api/v1/ingredients/export', { headers: { cookie: a.people.developer.sessionCookie } });
    const res = await exportRoute.GET(req);
    expect(res.headers.get('content-type')).toContain('text/csv');
    const text = await res.text();
    expect(text.split('\n')[0]).toMatch(/^name,kind,soluble_solids_pct/);
    expect(text).toContain(`"'=HYPERLINK(""x"")"`);
  });

  it('validates ingredient values', async () => {
    const res = await callRoute(ingredientsRoute.POST, { method: 'POST', path: '/api/v1/ingredients', caller: dev(), body: { name: '', kind: 'pectin', solidsPct: 120, phMin: 4, phMax: 3 } });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['name', 'pectinType', 'phMax', 'solidsPct']);
  });

  it('an archived ingredient cannot go into a new line', async () => {
    const ids = await starterIds(a);
    const del = await callRoute(ingredientRoute.DELETE, { method: 'DELETE', path: '', caller: dev(), params: { ingredientId: ids.glucose_syrup_de42 } });
    expect(del.status).toBe(200);
    const input = await strawberryJamInput(a);
    input.lines.push({ ingredientId: ids.glucose_syrup_de42, quantity: 100, unit: 'g' });
    const res = await callRoute(formulasRoute.POST, { method: 'POST', path: '/api/v1/formulas', caller: dev(), body: input });
    expect(res.status).toBe(422);
    expect(res.body.error.fields['lines.4.ingredientId'][0]).toMatch(/archived/);
  });
});

describe('the stateless calculator', () => {
  it('reproduces the Practical Action worked batch', async () => {
    // Source: Practical Action technical brief "Jams, jellies and marmalade": 10 kg fruit at 10 % solids
    // + 10 kg sugar + 0.06 kg pectin + 0.055 kg citric acid = 11.115 kg solids; at 68 % → 16.35 kg of jam.
    const res = await callRoute(calcRoute.POST, {
      method: 'POST', path: '/api/v1/calc/batch', caller: dev(),
      body: {
        settings: { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-01-10', targetSolidsPct: 68, jarNetFillG: 454 },
        lines: [
          { ingredient: { name: 'Fruit', kind: 'fruit', solidsPct: 10, euFruitGroup: 'general' }, quantity: 10, unit: 'kg' },
          { ingredient: { name: 'Sugar', kind: 'sweetener', solidsPct: 100, sweetenerType: 'sucrose' }, quantity: 10, unit: 'kg' },
          { ingredient: { name: 'Pectin', kind: 'pectin', solidsPct: 100, pectinType: 'hm_rapid_set', pectinGrade: 200 }, quantity: 60, unit: 'g' },
          { ingredient: { name: 'Citric acid', kind: 'acid', solidsPct: 100, acidType: 'citric' }, quantity: 55, unit: 'g' },
        ],
      },
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const mb = res.body.computation.massBalance;
    expect(mb.solubleSolidsInG).toBeCloseTo(11115, 6);
    expect(mb.finishedMassG / 1000).toBeCloseTo(16.35, 2);
  });

  it('resolves library ids only within the workspace', async () => {
    const input = await strawberryJamInput(b);
    const res = await callRoute(calcRoute.POST, { method: 'POST', path: '/api/v1/calc/batch', caller: dev(), body: { settings: input.settings, lines: input.lines } });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['lines.0.ingredientId', 'lines.1.ingredientId', 'lines.2.ingredientId', 'lines.3.ingredientId']);
  });
});
