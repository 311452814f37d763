/** Prices and packaging: dated points read "as of" a day, kept for ever, imported all or nothing, seen only by staff. */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, actorOf, type WorkspaceFixture } from './harness';
import { starterIds } from './fixtures';
import { createApprovedVersion } from './production-fixtures';
import * as pricesRoute from '@/app/api/v1/prices/route';
import * as importRoute from '@/app/api/v1/prices/import/route';
import * as exportRoute from '@/app/api/v1/prices/export/route';
import * as historyRoute from '@/app/api/v1/prices/[ingredientId]/route';
import * as withdrawRoute from '@/app/api/v1/price-points/[priceId]/withdraw/route';
import * as settingsRoute from '@/app/api/v1/cost-settings/route';
import * as packFormatsRoute from '@/app/api/v1/pack-formats/route';
import * as versionPackRoute from '@/app/api/v1/production-versions/[versionId]/pack-format/route';
import { getEm } from '@/lib/db';
import { AuditEvent, Ingredient, IngredientPrice, ProductVersion } from '@/entities';
import {
  costingData, costSettings, packagingPriceHistory, packagingPricesAsOf, packagingPricesAsOfDates, packFormatsByIds, priceHistory, pricesAsOf, pricesAsOfDates, refuseShares,
} from '@/lib/pricing/queries';
import { historiesBy, priceOn } from '@/lib/costing';
import { createIngredient } from '@/lib/ingredients/mutations';
import { addIngredientPrice, addPackagingPrice, createPackagingItem, createPackFormat, saveCostSettings, withdrawIngredientPrice } from '@/lib/pricing/mutations';

let a: WorkspaceFixture;
let ids: Record<string, string>;
const admin = () => ({ kind: 'session' as const, person: a.people.admin });
const count = async () => (await getEm()).count(IngredientPrice, { workspace: a.workspaceId });

async function price(ingredient: string, validFrom: string, packPrice: string, packSize = 25, packUnit: 'g' | 'kg' | 'lb' = 'kg') {
  return (await addIngredientPrice(actorOf(a, 'developer'), { ingredientId: ids[ingredient], packPrice, packSize, packUnit, supplier: 'Test mill', validFrom })).priceId;
}

beforeAll(async () => {
  a = await createWorkspace('Prices');
  ids = await starterIds(a);
  await saveCostSettings(actorOf(a, 'admin'), { currency: 'EUR', overfillPct: 2, costWarningPct: 5 });
  // Sugar: three points, and a correction on the second day.
  await price('sucrose', '2026-01-10', '25.00');
  await price('sucrose', '2026-03-01', '27.00');
  await price('sucrose', '2026-03-01', '26.50');
  await price('sucrose', '2026-06-15', '30.00');
});

describe('the price in force on a day', () => {
  it('is unknown before the first point, the latest point on or before the day after it, and the later entry of a corrected day', async () => {
    const before = await pricesAsOf(a.workspaceId, [ids.sucrose], '2026-01-09');
    expect(before.has(ids.sucrose)).toBe(false);
    expect((await pricesAsOf(a.workspaceId, [ids.sucrose], '2026-01-10')).get(ids.sucrose)).toMatchObject({ validFrom: '2026-01-10', packPriceMinor: 2500, packSizeG: 25_000 });
    // Between points: the earlier one still holds.
    expect((await pricesAsOf(a.workspaceId, [ids.sucrose], '2026-02-28')).get(ids.sucrose)?.packPriceMinor).toBe(2500);
    // Two points on 1 March: the one entered later is the correction.
    expect((await pricesAsOf(a.workspaceId, [ids.sucrose], '2026-03-01')).get(ids.sucrose)?.packPriceMinor).toBe(2650);
    expect((await pricesAsOf(a.workspaceId, [ids.sucrose], '2027-01-01')).get(ids.sucrose)?.packPriceMinor).toBe(3000);
  });

  it('answers many days and ingredients in one call, leaving unknown ones out', async () => {
    const days = ['2026-01-01', '2026-02-01', '2026-07-01'];
    const byDay = await pricesAsOfDates(a.workspaceId, [ids.sucrose, ids.strawberry], days);
    expect([...byDay.keys()]).toEqual(days);
    expect(byDay.get('2026-01-01')?.size).toBe(0);
    expect(byDay.get('2026-02-01')?.get(ids.sucrose)?.packPriceMinor).toBe(2500);
    expect(byDay.get('2026-07-01')?.get(ids.sucrose)?.packPriceMinor).toBe(3000);
    expect(byDay.get('2026-07-01')?.has(ids.strawberry)).toBe(false);
  });

  it('gives the history of a range with the point already in force at its start, one point per day', async () => {
    const history = await priceHistory(a.workspaceId, [ids.sucrose], { from: '2026-02-01', to: '2026-06-30' });
    expect(history.map((p) => [p.validFrom, p.packPriceMinor])).toEqual([['2026-01-10', 2500], ['2026-03-01', 2650], ['2026-06-15', 3000]]);
  });

  it('answers a costing in one statement with what the separate reads answer, day by day', async () => {
    const dev = actorOf(a, 'developer');
    const lid = (await createPackagingItem(dev, { name: 'One-statement lid', kind: 'lid' })).packagingItemId;
    const jar = (await createPackagingItem(dev, { name: 'One-statement jar', kind: 'jar' })).packagingItemId;
    await addPackagingPrice(dev, { packagingItemId: lid, packPrice: '60.00', piecesPerPack: 1000, supplier: null, validFrom: '2026-02-01' });
    await addPackagingPrice(dev, { packagingItemId: lid, packPrice: '66.00', piecesPerPack: 1000, supplier: null, validFrom: '2026-04-01' });
    await addPackagingPrice(dev, { packagingItemId: jar, packPrice: '300.00', piecesPerPack: 1200, supplier: null, validFrom: '2026-03-15' });
    const { packFormatId } = await createPackFormat(dev, { name: 'One-statement 340 g', netFillG: 340, items: [{ packagingItemId: jar, pieces: 1, perJars: 1 }, { packagingItemId: lid, pieces: 1, perJars: 1 }] });
    const range = { from: '2026-01-05', to: '2026-07-01' };
    const one = await costingData(a.workspaceId, { ingredientIds: [ids.sucrose, ids.strawberry, 'not-an-id'], packFormatIds: [packFormatId], ...range });
    expect(one.settings).toEqual(await costSettings(a.workspaceId));
    expect(one.refuse).toEqual(await refuseShares(a.workspaceId, [ids.sucrose, ids.strawberry]));
    expect(one.packFormats).toEqual(await packFormatsByIds(a.workspaceId, [packFormatId]));
    expect(one.ingredientPoints).toEqual(await priceHistory(a.workspaceId, [ids.sucrose, ids.strawberry], range));
    expect(one.packagingPoints).toEqual(await packagingPriceHistory(a.workspaceId, [jar, lid], range));
    // Every day of the range: the point the history gives equals the one the as-of statement finds.
    const sugar = historiesBy(one.ingredientPoints, (p) => p.ingredientId).get(ids.sucrose)!;
    const lids = historiesBy(one.packagingPoints, (p) => p.packagingItemId).get(lid)!;
    const days: string[] = [];
    for (let t = Date.parse(`${range.from}T00:00:00Z`); t <= Date.parse(`${range.to}T00:00:00Z`); t += 86_400_000) days.push(new Date(t).toISOString().slice(0, 10));
    const asOf = await pricesAsOfDates(a.workspaceId, [ids.sucrose], days);
    const lidAsOf = await packagingPricesAsOfDates(a.workspaceId, [lid], days);
    for (const day of days) {
      expect(priceOn(sugar, day), day).toEqual(asOf.get(day)!.get(ids.sucrose) ?? null);
      expect(priceOn(lids, day), day).toEqual(lidAsOf.get(day)!.get(lid) ?? null);
    }
    // The lid's first point is after the range starts: before it, unknown.
    expect(priceOn(lids, '2026-01-31')).toBeNull();
    expect(priceOn(lids, '2026-04-01')?.unitPriceMinor).toBe(6.6);
  });

  it('stores pounds as grams (1 lb = 453.59237 g)', async () => {
    // Source: International Yard and Pound Agreement (1959), 1 lb = 0.45359237 kg exactly.
    await price('lemon_juice', '2026-01-01', '9.99', 2, 'lb');
    expect((await pricesAsOf(a.workspaceId, [ids.lemon_juice], '2026-01-01')).get(ids.lemon_juice)?.packSizeG).toBeCloseTo(907.18474, 6);
  });
});

describe('prices are kept', () => {
  it('a withdrawn point stops counting but stays in the history with who and why, and the withdrawal is audited once', async () => {
    const mistaken = await price('strawberry', '2026-05-01', '450.00', 10);
    expect((await pricesAsOf(a.workspaceId, [ids.strawberry], '2026-05-02')).get(ids.strawberry)?.packPriceMinor).toBe(45000);
    const res = await callRoute(withdrawRoute.POST, { method: 'POST', path: '', caller: admin(), params: { priceId: mistaken }, body: { reason: 'Typed the price of a pallet.' } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect((await pricesAsOf(a.workspaceId, [ids.strawberry], '2026-05-02')).has(ids.strawberry)).toBe(false);
    const history = await callRoute(historyRoute.GET, { method: 'GET', path: '', caller: admin(), params: { ingredientId: ids.strawberry } });
    expect(history.body.points[0]).toMatchObject({ id: mistaken, withdrawReason: 'Typed the price of a pallet.' });
    expect(history.body.points[0].withdrawnAt).not.toBeNull();
    const again = await callRoute(withdrawRoute.POST, { method: 'POST', path: '', caller: admin(), params: { priceId: mistaken }, body: { reason: 'Twice.' } });
    expect(again.status).toBe(409);
    const em = await getEm();
    expect(await em.count(AuditEvent, { workspace: a.workspaceId, subjectId: mistaken, action: 'price.withdrawn' })).toBe(1);
  });

  it('the database refuses to change or delete a point', async () => {
    const id = await price('sucrose', '2025-01-01', '20.00');
    const em = await getEm();
    await expect(em.execute('update ingredient_prices set pack_price_minor = 1 where id = ?', [id])).rejects.toThrow(/never changed/);
    await expect(em.execute('delete from ingredient_prices where id = ?', [id])).rejects.toThrow(/never deleted/);
    await withdrawIngredientPrice(actorOf(a, 'admin'), id, 'Test point.');
  });

  it('the currency cannot change once prices exist (no conversion), while overfill and threshold can', async () => {
    const res = await callRoute(settingsRoute.PUT, { method: 'PUT', path: '', caller: admin(), body: { currency: 'GBP', overfillPct: 2, costWarningPct: 5 } });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/stays EUR/);
    const ok = await callRoute(settingsRoute.PUT, { method: 'PUT', path: '', caller: admin(), body: { currency: 'EUR', overfillPct: 1.5, costWarningPct: 8 } });
    expect(ok.status).toBe(200);
    expect(ok.body.settings).toEqual({ currency: 'EUR', overfillPct: 1.5, costWarningPct: 8 });
    const unknown = await callRoute(settingsRoute.PUT, { method: 'PUT', path: '', caller: admin(), body: { currency: 'XYZ', overfillPct: 1, costWarningPct: 5 } });
    expect(unknown.status).toBe(422);
  });

  it('a workspace without a currency takes no price', async () => {
    const b = await createWorkspace('No currency');
    const sugar = (await starterIds(b)).sucrose;
    const res = await callRoute(pricesRoute.POST, { method: 'POST', path: '', caller: { kind: 'session', person: b.people.admin }, body: { ingredientId: sugar, packPrice: '1.00', packSize: 1, packUnit: 'kg', validFrom: '2026-01-01' } });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/currency first/);
  });
});

describe('CSV import is all or nothing', () => {
  it('reports every bad row and column and stores nothing; a good file lands whole and reads back from the export', async () => {
    const before = await count();
    const bad = [
      'ingredient,valid_from,pack_price,pack_size,pack_unit,supplier,currency',
      'Sucrose (white sugar),2026-08-01,31.00,25,kg,Test mill,EUR', // good
      'No such fruit,2026-08-01,1.00,1,kg,,', // unknown ingredient
      'Sucrose (white sugar),2026-02-30,31.00,25,kg,,', // impossible date
      'Sucrose (white sugar),2026-08-02,-3.00,25,kg,,', // negative price
      'Sucrose (white sugar),2026-08-03,31.005,25,kg,,', // more decimals than EUR has
      'Sucrose (white sugar),2026-08-04,31.00,25,tonnes,,', // unknown unit
      'Sucrose (white sugar),2026-08-05,31.00,25,kg,,GBP', // another currency
    ].join('\n');
    const res = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: bad } });
    expect(res.status).toBe(422);
    const keys = Object.keys(res.body.error.fields);
    expect(keys).toEqual(expect.arrayContaining(['row 3, ingredient', 'row 4, valid_from', 'row 5, pack_price', 'row 6, pack_price', 'row 7, pack_unit', 'row 8, currency']));
    expect(keys.some((k) => k.startsWith('row 2'))).toBe(false);
    expect(await count()).toBe(before);

    const unknownColumn = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: 'ingredient,valid_from,pack_price,pack_size,pack_unit,__proto__\nSucrose (white sugar),2026-08-01,31.00,25,kg,x\n' } });
    expect(unknownColumn.status).toBe(422);
    expect(Object.keys(unknownColumn.body.error.fields)).toContain('row 1, __proto__');
    expect(await count()).toBe(before);

    for (const poison of ['\u0000', '\u202E', '\uD800']) {
      const poisoned = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: `ingredient,valid_from,pack_price,pack_size,pack_unit\nSucrose (white sugar),2026-08-01,31.00,25,kg\nSucrose (white sugar)${poison},2026-08-02,31.00,25,kg\n` } });
      expect(poisoned.status).toBe(422);
    }
    expect(await count()).toBe(before);

    const good = 'ingredient,valid_from,pack_price,pack_size,pack_unit\nsucrose (white sugar),2026-09-01,32.40,25,kg\nSucrose (white sugar),2026-10-01,33.00,50,lb\n';
    const ok = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: good } });
    expect(ok.status, JSON.stringify(ok.body)).toBe(201);
    expect(ok.body.imported).toBe(2);
    expect(await count()).toBe(before + 2);
    const exported = await callRoute(exportRoute.GET, { method: 'GET', path: '', caller: admin() });
    expect(exported.status).toBe(200);
    expect(exported.body).toContain('Sucrose (white sugar),2026-09-01,32.40,25000,g,,EUR');
  });
});

describe('CSV re-import adds nothing already on record', () => {
  it('counts the rows already present instead of adding them again, keeps new facts, and two imports of one file at once land it once', async () => {
    const em = await getEm();
    const raspberry = (await em.findOneOrFail(Ingredient, { id: ids.raspberry })).name;
    const points = () => em.fork().count(IngredientPrice, { workspace: a.workspaceId, ingredient: ids.raspberry });
    const file = [
      'ingredient,valid_from,pack_price,pack_size,pack_unit,supplier,currency',
      `${raspberry},2026-04-01,48.00,10,kg,Berry farm,EUR`,
      `${raspberry},2026-05-01,52.00,10,kg,Berry farm,EUR`,
      `${raspberry},2026-05-01,52.00,10,kg,Berry farm,EUR`, // the same row twice in one file
    ].join('\n');
    const first = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: file } });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body).toEqual({ imported: 2, alreadyPresent: 1 });
    expect(await points()).toBe(2);

    const again = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: file } });
    expect(again.status).toBe(201);
    expect(again.body).toEqual({ imported: 0, alreadyPresent: 3 });
    expect(await points()).toBe(2);

    // Same day and price written differently (kg vs g, case of the name) is the same point; another supplier,
    // another pack size or another price on that day is a new fact and lands.
    const mixed = [
      'ingredient,valid_from,pack_price,pack_size,pack_unit,supplier',
      `${raspberry.toUpperCase()},2026-04-01,48,10000,g,Berry farm`,
      `${raspberry},2026-04-01,48.00,10,kg,Other farm`,
      `${raspberry},2026-04-01,48.00,5,kg,Berry farm`,
      `${raspberry},2026-04-01,47.00,10,kg,Berry farm`,
    ].join('\n');
    const third = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: mixed } });
    expect(third.body).toEqual({ imported: 3, alreadyPresent: 1 });
    expect(await points()).toBe(5);

    // A withdrawn point no longer counts as present: importing it again records it anew.
    const [withdrawn] = await em.fork().find(IngredientPrice, { workspace: a.workspaceId, ingredient: ids.raspberry, validFrom: '2026-05-01' });
    await withdrawIngredientPrice(actorOf(a, 'admin'), withdrawn.id, 'Entered against the wrong lot');
    const afterWithdrawal = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: file } });
    expect(afterWithdrawal.body).toEqual({ imported: 1, alreadyPresent: 2 });
    expect(await points()).toBe(6);

    // The same new file sent twice at the same moment: the imports take turns, so it lands once.
    const fresh = `ingredient,valid_from,pack_price,pack_size,pack_unit\n${raspberry},2026-07-01,55.00,10,kg\n${raspberry},2026-08-01,56.00,10,kg\n`;
    const both = await Promise.all([0, 1].map(() => callRoute(importRoute.POST, { method: 'POST', path: '', caller: admin(), body: { csv: fresh } })));
    expect(both.map((r) => r.status)).toEqual([201, 201]);
    expect(both.map((r) => r.body.imported).sort()).toEqual([0, 2]);
    expect(both.map((r) => r.body.alreadyPresent).sort()).toEqual([0, 2]);
    expect(await points()).toBe(8);
  });
});

describe('CSV export imports back unchanged', () => {
  // User walk: a supplier "+…" came back as "'+…" (the export's formula guard, lib/csv.ts), so
  // re-importing the export added a duplicate point although the page promises it would not.
  it('names and suppliers starting with + = - @ lose only the export’s apostrophe, so a re-import adds nothing', async () => {
    const w = await createWorkspace('Prices round trip');
    await saveCostSettings(actorOf(w, 'admin'), { currency: 'EUR', overfillPct: 0, costWarningPct: 5 });
    const { ingredientId } = await createIngredient(actorOf(w, 'admin'), { name: '+WalkA plus', kind: 'fruit', solidsPct: 12 });
    for (const supplier of ['+Walk mill', '=Walk farm', '-Walk co-op', '@walk', null]) {
      await addIngredientPrice(actorOf(w, 'developer'), { ingredientId, packPrice: '10.00', packSize: 5, packUnit: 'kg', supplier, validFrom: '2026-05-01' });
    }
    const caller = { kind: 'session' as const, person: w.people.admin };
    const exported = await callRoute(exportRoute.GET, { method: 'GET', path: '', caller });
    expect(exported.body).toContain("'+WalkA plus,2026-05-01,10.00,5000,g,'+Walk mill,EUR");
    const again = await callRoute(importRoute.POST, { method: 'POST', path: '', caller, body: { csv: exported.body } });
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    expect(again.body).toEqual({ imported: 0, alreadyPresent: 5 });
    const suppliers = (await (await getEm()).fork().find(IngredientPrice, { workspace: w.workspaceId })).map((p) => p.supplier);
    expect(suppliers.sort()).toEqual(['+Walk mill', '-Walk co-op', '=Walk farm', '@walk', null].sort());
  });
});

describe('who sees prices', () => {
  it('a taster gets 403 and no figure from the list, a history or the CSV export; an outsider 401', async () => {
    const taster = { kind: 'session' as const, person: a.people.taster };
    for (const [handler, params] of [[pricesRoute.GET, {}], [exportRoute.GET, {}], [historyRoute.GET, { ingredientId: ids.sucrose }], [settingsRoute.GET, {}], [packFormatsRoute.GET, {}]] as const) {
      const res = await callRoute(handler, { method: 'GET', path: '', caller: taster, params });
      expect(res.status).toBe(403);
      expect(JSON.stringify(res.body)).not.toMatch(/2650|26\.50|EUR/);
      const outsider = await callRoute(handler, { method: 'GET', path: '', caller: { kind: 'outsider' }, params });
      expect(outsider.status).toBe(401);
    }
    const token = await callRoute(pricesRoute.GET, { method: 'GET', path: '', caller: { kind: 'token', person: a.people.taster } });
    expect(token.status).toBe(403);
  });

  it('the production lead reads prices with the currency stated', async () => {
    const res = await callRoute(pricesRoute.GET, { method: 'GET', path: '/api/v1/prices?asOf=2026-03-02', caller: { kind: 'session', person: a.people.production } });
    expect(res.status).toBe(200);
    expect(res.body.currency).toBe('EUR');
    expect(res.body.prices.find((p: { ingredientId: string }) => p.ingredientId === ids.sucrose).current.packPriceMinor).toBe(2650);
  });
});

describe('bad input gets a 4xx and changes nothing', () => {
  const valid = () => ({ ingredientId: ids.sucrose, packPrice: '12.00', packSize: 25, packUnit: 'kg', supplier: 'Test mill', validFrom: '2026-11-01' });
  const cases: Array<[string, (b: Record<string, unknown>) => unknown]> = [
    ['NUL in the supplier', (b) => ({ ...b, supplier: 'Mill\u0000' })],
    ['a control character', (b) => ({ ...b, supplier: 'Mill\u0007' })],
    ['a bidi override', (b) => ({ ...b, supplier: 'Mill\u202Eevil' })],
    ['a lone surrogate', (b) => ({ ...b, supplier: 'Mill\uD800' })],
    ['30 February', (b) => ({ ...b, validFrom: '2026-02-30' })],
    ['year 0000', (b) => ({ ...b, validFrom: '0000-01-01' })],
    ['a pack size past 2^53', (b) => ({ ...b, packSize: 2 ** 53 + 2 })],
    ['a price past 2^53', (b) => ({ ...b, packPrice: '9007199254740993' })],
    ['a price past 2^31 minor units', (b) => ({ ...b, packPrice: '30000000.00' })],
    ['a negative price', (b) => ({ ...b, packPrice: '-1.00' })],
    ['a price in exponent notation', (b) => ({ ...b, packPrice: '1e3' })],
    ['a zero pack size', (b) => ({ ...b, packSize: 0 })],
    ['an unknown unit', (b) => ({ ...b, packUnit: 'oz' })],
    ['a prototype-named key', (b) => JSON.parse(`{"__proto__":{"polluted":1},${JSON.stringify(b).slice(1)}`)],
    ['a constructor key', (b) => ({ ...b, constructor: 'x' })],
  ];
  it.each(cases)('%s', async (_name, mutate) => {
    const before = await count();
    const res = await callRoute(pricesRoute.POST, { method: 'POST', path: '', caller: admin(), body: mutate(valid()) });
    expect(res.status, JSON.stringify(res.body)).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(await count()).toBe(before);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('a valid body is accepted (the cases above differ from it in one field)', async () => {
    const res = await callRoute(pricesRoute.POST, { method: 'POST', path: '', caller: admin(), body: valid() });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  });
});

describe('pack formats', () => {
  it('a 340 g jar with lid, label and a case of 12: per-jar shares and unit prices from packs of pieces', async () => {
    const dev = actorOf(a, 'developer');
    const jar = (await createPackagingItem(dev, { name: 'Test jar 340 g', kind: 'jar' })).packagingItemId;
    const label = (await createPackagingItem(dev, { name: 'Test label', kind: 'label' })).packagingItemId;
    const caseOf12 = (await createPackagingItem(dev, { name: 'Test case of 12', kind: 'case' })).packagingItemId;
    await addPackagingPrice(dev, { packagingItemId: label, packPrice: '45.00', piecesPerPack: 1000, supplier: null, validFrom: '2026-01-01' });
    const { packFormatId } = await createPackFormat(dev, { name: 'Test 340 g', netFillG: 340, items: [{ packagingItemId: jar, pieces: 1, perJars: 1 }, { packagingItemId: label, pieces: 1, perJars: 1 }, { packagingItemId: caseOf12, pieces: 1, perJars: 12 }] });
    const format = (await packFormatsByIds(a.workspaceId, [packFormatId])).get(packFormatId)!;
    expect(format.netFillG).toBe(340);
    expect(format.items.map((i) => i.perJar)).toEqual([1, 1, 1 / 12]);
    const prices = await packagingPricesAsOf(a.workspaceId, [jar, label, caseOf12], '2026-02-01');
    expect(prices.get(label)?.unitPriceMinor).toBeCloseTo(4.5, 10); // 45.00 EUR per 1000 = 4.5 cents each
    expect(prices.has(jar)).toBe(false);

    const dup = await callRoute(packFormatsRoute.POST, { method: 'POST', path: '', caller: admin(), body: { name: 'Twice', netFillG: 340, items: [{ packagingItemId: jar, pieces: 1, perJars: 1 }, { packagingItemId: jar, pieces: 1, perJars: 1 }] } });
    expect(dup.status).toBe(422);
  });

  it('a production version takes a pack format (audited) and stays frozen otherwise', async () => {
    const { versionId } = await createApprovedVersion(a);
    const { packFormatId } = await createPackFormat(actorOf(a, 'admin'), { name: 'Test 450 g', netFillG: 450, items: [] });
    const res = await callRoute(versionPackRoute.PUT, { method: 'PUT', path: '', caller: { kind: 'session', person: a.people.production }, params: { versionId }, body: { packFormatId } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const em = await getEm();
    const v = await em.findOneOrFail(ProductVersion, { id: versionId });
    expect((v.packFormat as unknown as { id: string }).id).toBe(packFormatId);
    expect(await em.count(AuditEvent, { subjectId: versionId, action: 'version.pack_format' })).toBe(1);
    await expect(em.execute('update production_formulas set pack_format_id = null, version = version + 100 where id = ?', [versionId])).rejects.toThrow(/immutable/);
  });
});
