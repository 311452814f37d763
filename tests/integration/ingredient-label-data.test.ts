/** The ingredient library's label data through the real API, server action, CSV and migration. */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, asCaller, type WorkspaceFixture } from './harness';
import { starterIds } from './fixtures';
import * as ingredientsRoute from '@/app/api/v1/ingredients/route';
import * as ingredientRoute from '@/app/api/v1/ingredients/[ingredientId]/route';
import * as exportRoute from '@/app/api/v1/ingredients/export/route';
import * as importRoute from '@/app/api/v1/ingredients/import/route';
import { saveIngredientAction } from '@/lib/ingredients/actions';
import { getEm, getOrm } from '@/lib/db';
import { STARTER_LABEL_DATA } from '@/lib/ingredients/starter-composition';
import type { Migration } from '@mikro-orm/migrations';
import { Migration20261203140000 } from '@/migrations/Migration20261203140000';
import { Migration20261204190000 } from '@/migrations/Migration20261204190000';

let a: WorkspaceFixture;
const dev = () => ({ kind: 'session' as const, person: a.people.developer });

beforeAll(async () => {
  a = await createWorkspace('Label data');
});

async function libraryChecksum(workspaceId: string): Promise<string> {
  const em = await getEm();
  const rows = await em.getConnection().execute(`select md5(string_agg(t::text, '|' order by t.id)) as sum, count(*) as n from ingredients t where workspace_id = ?`, [workspaceId]);
  return `${rows[0].n}:${rows[0].sum}`;
}

async function getOne(id: string) {
  const res = await callRoute(ingredientRoute.GET, { method: 'GET', path: `/api/v1/ingredients/${id}`, caller: dev(), params: { ingredientId: id } });
  return res.body.ingredient;
}

const RHUBARB = {
  name: 'Forced rhubarb', kind: 'fruit', solidsPct: 4.5,
  labelData: {
    labelName: 'rhubarb',
    nutrients: { waterG: 93.61, energyKcal: 21, energyKj: 88, proteinG: 0.9, fatG: 0.2, saturatesG: 0.053, carbohydrateG: 4.54, sugarsG: 1.1, fibreG: 1.8, sodiumMg: 4 },
    euAllergens: ['sulphites'], usAllergens: [], sulphiteMgPerKg: 12, additive: null, isAddedWater: false, source: 'Grower’s sheet, lot 4',
  },
};

describe('label data through the API', () => {
  it('stores what is sent, leaves the rest unknown (null) and keeps it when a later PATCH leaves labelData out', async () => {
    const created = await callRoute(ingredientsRoute.POST, { method: 'POST', path: '/api/v1/ingredients', caller: dev(), body: RHUBARB });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const id = created.body.ingredientId;
    const one = await getOne(id);
    expect(one.labelData).toMatchObject({ labelName: 'rhubarb', euAllergens: ['sulphites'], sulphiteMgPerKg: 12, source: 'Grower’s sheet, lot 4' });
    expect(one.labelData.nutrients.waterG).toBe(93.61);
    expect(one.labelData.nutrients.polyolsG).toBeNull();
    expect(one.labelData.nutrients.sucroseG).toBeNull();

    const patched = await callRoute(ingredientRoute.PATCH, { method: 'PATCH', path: `/api/v1/ingredients/${id}`, caller: dev(), params: { ingredientId: id }, body: { name: 'Forced rhubarb', kind: 'fruit', solidsPct: 5 } });
    expect(patched.status).toBe(200);
    const after = await getOne(id);
    expect(after.solidsPct).toBe(5);
    expect(after.labelData).toEqual(one.labelData);
  });

  it.each([
    ['a NUL in the label name', { labelName: 'rhu\u0000barb' }, 'labelData.labelName'],
    ['a bidi override in the source', { source: 'sheet \u202E4' }, 'labelData.source'],
    ['a prototype-named allergen', { euAllergens: ['__proto__'] }, 'labelData.euAllergens.0'],
    ['an unknown allergen', { usAllergens: ['celery'] }, 'labelData.usAllergens.0'],
    ['a bad E-number', { additive: { eNumber: 'E44a', functionalClass: 'gelling_agent' } }, 'labelData.additive.eNumber'],
    ['a number past 2^53', { nutrients: { sodiumMg: 2 ** 53 + 2 } }, 'labelData.nutrients.sodiumMg'],
    ['parts over their whole', { nutrients: { waterG: 95, carbohydrateG: 9 } }, 'labelData.nutrients.waterG'],
    ['an unknown nutrient', { nutrients: { vitaminC: 3 } }, 'labelData.nutrients'],
  ])('refuses %s with 422 and changes nothing', async (_what, change, field) => {
    const id = (await starterIds(a)).apricot;
    const before = await libraryChecksum(a.workspaceId);
    const body = { ...RHUBARB, labelData: { ...RHUBARB.labelData, ...change } };
    const res = await callRoute(ingredientRoute.PATCH, { method: 'PATCH', path: `/api/v1/ingredients/${id}`, caller: dev(), params: { ingredientId: id }, body });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain(field);
    const post = await callRoute(ingredientsRoute.POST, { method: 'POST', path: '/api/v1/ingredients', caller: dev(), body });
    expect(post.status).toBe(422);
    expect(await libraryChecksum(a.workspaceId)).toBe(before);
  });

  it('the server action refuses bad label data as a 4xx result and writes nothing', async () => {
    const before = await libraryChecksum(a.workspaceId);
    const result = await asCaller(dev(), () => saveIngredientAction(null, { ...RHUBARB, labelData: { euAllergens: ['constructor'] } }));
    expect(result.ok).toBe(false);
    expect((result as { status: number }).status).toBeGreaterThanOrEqual(400);
    expect((result as { status: number }).status).toBeLessThan(500);
    expect(await libraryChecksum(a.workspaceId)).toBe(before);
  });
});

describe('CSV', () => {
  async function exportCsv(): Promise<string> {
    const res = await exportRoute.GET(new Request('http://127.0.0.1/api/v1/ingredients/export?archived=include', { headers: { cookie: a.people.developer.sessionCookie } }));
    return res.text();
  }
  const importCsv = (csv: string, confirmUpdates?: boolean) => callRoute(importRoute.POST, { method: 'POST', path: '/api/v1/ingredients/import', caller: dev(), body: { csv, ...(confirmUpdates === undefined ? {} : { confirmUpdates }) } });

  it('exports the label columns, and the export imports back changing nothing', async () => {
    const csv = await exportCsv();
    const header = csv.split('\n')[0];
    for (const col of ['label_name', 'water_g', 'energy_kj', 'sugars_g', 'sucrose_g', 'sodium_mg', 'cholesterol_mg', 'eu_allergens', 'us_allergens', 'sulphite_mg_per_kg', 'e_number', 'additive_class', 'added_water', 'composition_source']) {
      expect(header.split(',')).toContain(col);
    }
    expect(csv).toContain('E440,gelling_agent');
    const before = await libraryChecksum(a.workspaceId);
    const res = await importCsv(csv);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.created).toBe(0);
    expect(res.body.updated).toBe(0);
    expect(res.body.unchanged).toBeGreaterThan(20);
    expect(await libraryChecksum(a.workspaceId)).toBe(before);
  });

  it('adds new rows and replaces named ones in one go', async () => {
    const csv = 'name,kind,soluble_solids_pct,label_name,water_g,sugars_g,eu_allergens,e_number,additive_class\n'
      + 'Greengage purée,fruit,16,greengages,82.5,,,,\n'
      + 'forced RHUBARB,fruit,5,rhubarb,93.6,1.1,sulphites;celery,,\n'
      + 'Agar powder,other,100,agar,10,0,,E406,gelling_agent\n';
    // A row that changes an ingredient already there: nothing lands, and the answer lists each change.
    const before = await libraryChecksum(a.workspaceId);
    const asked = await importCsv(csv);
    expect(asked.status, JSON.stringify(asked.body)).toBe(409);
    expect(asked.body.error.code).toBe('confirm_updates');
    expect(asked.body.error.fields).toEqual({
      'row 3, Forced rhubarb': ['name: Forced rhubarb → forced RHUBARB', 'water_g: 93.61 → 93.6', 'eu_allergens: sulphites → sulphites;celery'],
    });
    expect(await libraryChecksum(a.workspaceId)).toBe(before);
    expect((await importCsv(csv, false)).status).toBe(409);
    expect(await libraryChecksum(a.workspaceId)).toBe(before);
    const res = await importCsv(csv, true);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ imported: true, created: 2, updated: 1 });
    const list = (await callRoute(ingredientsRoute.GET, { method: 'GET', path: '/api/v1/ingredients?q=agar', caller: dev() })).body.ingredients;
    expect(list[0].labelData.additive).toEqual({ eNumber: 'E406', functionalClass: 'gelling_agent' });
    const rhubarb = (await callRoute(ingredientsRoute.GET, { method: 'GET', path: '/api/v1/ingredients?q=forced', caller: dev() })).body.ingredients[0];
    expect(rhubarb.labelData.euAllergens).toEqual(['sulphites', 'celery']);
    expect(rhubarb.labelData.nutrients.waterG).toBe(93.6);
    // A column the file leaves out keeps the stored value; a column it has replaces it.
    expect(rhubarb.labelData.nutrients.fibreG).toBe(1.8);
    expect(rhubarb.labelData.sulphiteMgPerKg).toBe(12);
    expect(rhubarb.solidsPct).toBe(5);
  });

  it('imports nothing when one cell is bad, naming every row and column', async () => {
    const before = await libraryChecksum(a.workspaceId);
    const csv = 'name,kind,soluble_solids_pct,fat_g,eu_allergens,e_number,additive_class,label_name\n'
      + 'Good plum,fruit,14,0.3,,,,plums\n'
      + 'Bad fat,fruit,14,lots,,,,\n'
      + 'Bad allergen,fruit,14,0.2,__proto__,,,\n'
      + 'Bad additive,other,100,0,,E12,preservative,\n'
      + 'Bad name,fruit,14,0.2,,,,"plums\u202E"\n'
      + 'good PLUM,fruit,14,0.3,,,,\n';
    const res = await importCsv(csv);
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['row 3, fat_g', 'row 4, eu_allergens', 'row 5, e_number', 'row 6, label_name', 'row 7, name'].sort());
    expect(await libraryChecksum(a.workspaceId)).toBe(before);
    const stranger = await importCsv('id,name,kind,soluble_solids_pct\n00000000-0000-4000-8000-000000000000,X,fruit,1\n');
    expect(Object.keys(stranger.body.error.fields)).toEqual(['row 2, id']);
    // The reader's own wording ("Quoted field unterminated", "Too few fields: …") never reaches the user.
    const unclosed = await importCsv('name,kind,soluble_solids_pct\nGood plum,fruit,14\n"Bad plum,fruit,14\n');
    expect(unclosed.status).toBe(422);
    expect(unclosed.body.error.fields).toEqual({ 'row 3': ['A cell opens with a double quote (") that is never closed, so the rest of the file reads as one cell. Close the quote, or remove it.'] });
    const short = await importCsv('name,kind,soluble_solids_pct\nGood plum,fruit\n');
    expect(short.body.error.fields).toEqual({ 'row 2': ['This row has 2 cells, fewer than the 3 columns of the header row. Check for a missing comma or a line break inside a cell.'] });
    const long = await importCsv('name,kind,soluble_solids_pct\nGood plum,fruit,14,3\n');
    expect(long.body.error.fields['row 2'][0]).toMatch(/^This row has 4 cells, more than the 3 columns/);
    expect(await libraryChecksum(a.workspaceId)).toBe(before);
    const unknown = await importCsv('name,kind,soluble_solids_pct,__proto__\nX,fruit,1,2\n');
    expect(unknown.status).toBe(422);
    expect(Object.keys(unknown.body.error.fields)).toEqual(['row 1, __proto__']);
  });
});

/** One step of a migration: its own statements, as the migrator runs them (in one transaction). */
async function runStep(migration: Migration, step: 'up' | 'down'): Promise<void> {
  migration.reset();
  await migration[step]();
  const em = await getEm();
  await em.transactional(async (tx) => {
    for (const q of migration.getQueries()) await tx.execute(q as string);
  });
}

/** A new workspace with its starter library and one entry of its own, for a migration to run over. */
async function workspaceWithOwnEntry(name: string, own: { name: string; kind: string; solidsPct: number }) {
  const fx = await createWorkspace(name);
  const ids = await starterIds(fx);
  const created = await callRoute(ingredientsRoute.POST, { method: 'POST', path: '/api/v1/ingredients', caller: { kind: 'session', person: fx.people.developer }, body: own });
  expect(created.status).toBe(201);
  const orm = await getOrm();
  return { fx, ids, ownId: created.body.ingredientId as string, em: await getEm(), migrationArgs: [orm.em.getDriver(), orm.config] as const };
}

describe('migration Migration20261203140000', () => {
  it('backfills the starter entries of an existing workspace by their key and adds potassium sorbate', async () => {
    const { fx, ids, ownId, em, migrationArgs } = await workspaceWithOwnEntry('Before label data', { name: 'Own quince', kind: 'fruit', solidsPct: 13 });
    const migration = new Migration20261203140000(...migrationArgs);
    await runStep(migration, 'down');
    try {
      // Rolling back keeps the label columns, their data and the sorbate entry: formulas and price
      // lists may use them (no data is lost).
      const kept = await em.getConnection().execute(`select count(*) as n from ingredients where workspace_id = ? and typical_key = 'potassium_sorbate' and e_number = 'E202'`, [fx.workspaceId]);
      expect(Number(kept[0].n)).toBe(1);
      const columns = await em.getConnection().execute(`select count(*) as n from information_schema.columns where table_name = 'ingredients' and column_name = 'water_g'`);
      expect(Number(columns[0].n)).toBe(1);
      // This workspace now looks like one from before the migration: no label data, no sorbate entry.
      await em.getConnection().execute(`delete from ingredients where workspace_id = ? and typical_key = 'potassium_sorbate'`, [fx.workspaceId]);
      await em.getConnection().execute(`update ingredients set water_g = null, sugars_g = null, sucrose_g = null, e_number = null, additive_class = null, composition_source = null where workspace_id = ?`, [fx.workspaceId]);
    } finally {
      await runStep(migration, 'up');
    }
    const rows = await em.getConnection().execute(`select id, typical_key, origin, water_g, sugars_g, sucrose_g, e_number, additive_class, composition_source, is_added_water from ingredients where workspace_id = ?`, [fx.workspaceId]);
    const byKey = new Map(rows.map((r: Record<string, unknown>) => [r.typical_key, r]));
    // Source: USDA SR28 NDB 09316 (strawberries, raw): water 90.95 g, sugars 4.89 g, sucrose 0.47 g.
    expect(byKey.get('strawberry')).toMatchObject({ id: ids.strawberry, water_g: 90.95, sugars_g: 4.89, sucrose_g: 0.47, e_number: null });
    expect(byKey.get('strawberry')?.composition_source).toContain('NDB 09316');
    // Source: USDA SR28 NDB 09083 gives no sugars for blackcurrants: stays null.
    expect(byKey.get('blackcurrant')).toMatchObject({ water_g: 81.96, sugars_g: null });
    expect(byKey.get('pectin_hm_rapid_150')).toMatchObject({ e_number: 'E440', additive_class: 'gelling_agent' });
    expect(byKey.get('water')).toMatchObject({ is_added_water: true, water_g: 100 });
    expect(byKey.get('potassium_sorbate')).toMatchObject({ origin: 'typical', e_number: 'E202', additive_class: 'preservative' });
    expect(rows.filter((r: Record<string, unknown>) => r.typical_key === 'potassium_sorbate')).toHaveLength(1);
    const own = rows.find((r: Record<string, unknown>) => r.id === ownId);
    expect(own).toMatchObject({ water_g: null, composition_source: null, is_added_water: false });
    expect(Object.keys(STARTER_LABEL_DATA).every((k) => byKey.has(k))).toBe(true);
  });
});

describe('migration Migration20261204190000', () => {
  it('gives the starter foods of an existing workspace 0 mg cholesterol and leaves every other figure as it was', async () => {
    const { fx, ids, ownId, em, migrationArgs } = await workspaceWithOwnEntry('Before cholesterol', { name: 'Butter for the foam', kind: 'other', solidsPct: 84 });
    const sql = (text: string, values: unknown[] = []) => em.getConnection().execute(text, values);
    // This workspace now looks like one from before the migration: no cholesterol anywhere, except a
    // figure someone entered on an edited starter entry (kept) and one on their own entry (kept).
    await sql(`update ingredients set cholesterol_mg = null where workspace_id = ?`, [fx.workspaceId]);
    await sql(`update ingredients set origin = 'edited', cholesterol_mg = 3 where id = ?`, [ids.apricot]);
    await sql(`update ingredients set cholesterol_mg = 215 where id = ?`, [ownId]);
    const migration = new Migration20261204190000(...migrationArgs);
    for (const step of ['down', 'up', 'up'] as const) await runStep(migration, step);
    const rows = await sql(`select id, typical_key, cholesterol_mg from ingredients where workspace_id = ?`, [fx.workspaceId]);
    const byKey = new Map(rows.map((r: Record<string, unknown>) => [r.typical_key, r.cholesterol_mg]));
    expect(byKey.get('strawberry')).toBe(0);
    expect(byKey.get('sucrose')).toBe(0);
    expect(byKey.get('water')).toBe(0);
    expect(byKey.get('invert_syrup')).toBeNull();
    expect(byKey.get('apricot')).toBe(3);
    expect(rows.find((r: Record<string, unknown>) => r.id === ownId)?.cholesterol_mg).toBe(215);
  });
});
