/** Costs from dated prices: as of a day, frozen at approval against today, the threshold warning, a batch's actual cost, and who may see them. */
import { describe, it, expect, beforeAll, vi } from 'vitest';
import { Pool } from 'pg';
import { createWorkspace, callRoute, actorOf, type WorkspaceFixture } from './harness';
import { createFixtureFormula, starterIds } from './fixtures';
import { promotionInput, freshProductCode } from './production-fixtures';
import * as basisRoute from '@/app/api/v1/costs/basis/route';
import * as trialCostsRoute from '@/app/api/v1/trials/[trialId]/costs/route';
import * as productCostsRoute from '@/app/api/v1/products/[productId]/costs/route';
import * as batchCostRoute from '@/app/api/v1/batches/[batchId]/cost/route';
import { getEm } from '@/lib/db';
import { Ingredient, ProductVersion } from '@/entities';
import { createTrial } from '@/lib/trials/mutations';
import { listVariants } from '@/lib/trials/queries';
import { decideBatch, decidePromotion, recordBatch, requestPromotion } from '@/lib/production/mutations';
import { getProductionVersion } from '@/lib/production/queries';
import { lotCodeFor } from '@/lib/production/vocabulary';
import { addIngredientPrice, addPackagingPrice, createPackagingItem, createPackFormat, saveCostSettings, setFormulaPackFormat, setPackagingArchived } from '@/lib/pricing/mutations';
import { batchCost, editorCostBasis, productCosts, trialCosts } from '@/lib/costs/queries';
import { packagingPricesAsOf, packFormatList, pricesAsOf, refuseShares } from '@/lib/pricing/queries';
import { todayIso } from '@/lib/format/dates';
import type { Role } from '@/lib/permissions';

let a: WorkspaceFixture;
let ids: Record<string, string>;
let trialId: string;
let productId: string;
let versionId: string;
let jarFormatId: string;

const dev = () => actorOf(a, 'developer');
/** Every ingredient of the workspace: the editor's prices cover them all. */
const allIngredientIds = async () => (await (await getEm()).find(Ingredient, { workspace: a.workspaceId }, { fields: ['id'] })).map((i) => i.id);
async function price(ingredient: string, validFrom: string, packPrice: string, packSize: number, packUnit: 'g' | 'kg' = 'kg') {
  await addIngredientPrice(dev(), { ingredientId: ids[ingredient], packPrice, packSize, packUnit, supplier: null, validFrom });
}

beforeAll(async () => {
  a = await createWorkspace('Costs');
  ids = await starterIds(a);
  await saveCostSettings(actorOf(a, 'admin'), { currency: 'GBP', overfillPct: 2, costWarningPct: 5 });
  // Invented prices (pence): strawberry 300 p/kg, sugar 100 p/kg then 200 p/kg from 1 Feb, pectin 2,400 p/kg; citric acid unpriced for now.
  await price('strawberry', '2026-01-01', '30.00', 10);
  await price('sucrose', '2026-01-01', '25.00', 25);
  await price('sucrose', '2026-02-01', '50.00', 25);
  await price('pectin_hm_rapid_150', '2026-01-01', '24.00', 1);
  const jar = (await createPackagingItem(dev(), { name: 'Jar 340 g', kind: 'jar' })).packagingItemId;
  const lid = (await createPackagingItem(dev(), { name: 'Lid 63 mm', kind: 'lid' })).packagingItemId;
  await addPackagingPrice(dev(), { packagingItemId: jar, packPrice: '30.00', piecesPerPack: 100, supplier: null, validFrom: '2026-01-01' });
  await addPackagingPrice(dev(), { packagingItemId: lid, packPrice: '8.00', piecesPerPack: 100, supplier: null, validFrom: '2026-01-01' });
  const { packFormatId } = await createPackFormat(dev(), { name: '340 g jar', netFillG: 340, items: [{ packagingItemId: jar, pieces: 1, perJars: 1 }, { packagingItemId: lid, pieces: 1, perJars: 1 }] });
  const formulaId = await createFixtureFormula(a);
  await setFormulaPackFormat(dev(), formulaId, packFormatId);
  jarFormatId = packFormatId;
  ({ trialId } = await createTrial(dev(), { title: 'Cost trial', question: 'What does a jar cost?', formulaId }));
});

describe('the formula editor\'s prices of a day', () => {
  it('come in one statement, so the editor waits for one round trip for them', async () => {
    const query = vi.spyOn(Pool.prototype, 'query');
    try {
      const basis = await editorCostBasis(dev(), '2026-02-01');
      expect(basis.packFormats.length).toBeGreaterThan(0);
      expect(query).toHaveBeenCalledTimes(1);
    } finally {
      query.mockRestore();
    }
  });

  it('hold each ingredient\'s and packaging item\'s point in force that day, every refuse share and the pack formats not archived', async () => {
    const other = await createPackFormat(dev(), { name: 'Archived 200 g', netFillG: 200, items: [] });
    await setPackagingArchived(dev(), 'format', other.packFormatId, true);
    for (const day of ['2025-12-31', '2026-01-31', '2026-02-01']) {
      const basis = await editorCostBasis(dev(), day);
      expect(basis.asOf).toBe(day);
      expect(basis.currency).toBe('GBP');
      expect(basis.overfillPct).toBe(2);
      const allIngredients = await allIngredientIds();
      const inForce = await pricesAsOf(a.workspaceId, allIngredients, day);
      expect(new Map(basis.ingredientPrices.map((p) => [p.ingredientId, p]))).toEqual(inForce);
      const formats = (await packFormatList(dev())).filter((f) => !f.archived);
      expect(basis.packFormats.map((f) => f.name)).toEqual(formats.map((f) => f.name));
      expect(basis.packFormats.map((f) => f.name)).not.toContain('Archived 200 g');
      const itemIds = formats.flatMap((f) => f.items.map((i) => i.packagingItemId));
      expect(new Map(basis.packagingPrices.map((p) => [p.packagingItemId, p]))).toEqual(await packagingPricesAsOf(a.workspaceId, itemIds, day));
      expect(new Map(basis.refuse)).toEqual(await refuseShares(a.workspaceId, allIngredients));
    }
    // Sugar: 25.00 per 25 kg until 31 January, 50.00 from 1 February.
    expect((await editorCostBasis(dev(), '2026-01-31')).ingredientPrices.find((p) => p.ingredientId === ids.sucrose)?.packPriceMinor).toBe(2500);
    expect((await editorCostBasis(dev(), '2026-02-01')).ingredientPrices.find((p) => p.ingredientId === ids.sucrose)?.packPriceMinor).toBe(5000);
    expect((await editorCostBasis(dev(), '2025-12-31')).ingredientPrices).toEqual([]);
  });
});

describe('a trial costed as of a day', () => {
  it('uses the price in force on that day and names what has no price', async () => {
    const jan = await trialCosts(dev(), trialId, '2026-01-15');
    const feb = await trialCosts(dev(), trialId, '2026-02-15');
    const [janA] = jan.variants;
    const [febA] = feb.variants;
    if (!janA.result.ok || !febA.result.ok) throw new Error('not costed');
    expect(jan.currency).toBe('GBP');
    expect(jan.packFormat?.name).toBe('340 g jar');
    // Citric acid has no price: the line is unknown and the totals say incomplete.
    expect(janA.result.cost.complete).toBe(false);
    expect(janA.result.cost.missing).toHaveLength(1);
    expect(janA.result.cost.perJar?.complete).toBe(false);
    // 1,000 g of sugar: 100 p/kg → 100 p in January, 200 p/kg → 200 p in February.
    const sugarJan = janA.result.cost.ingredients.find((l) => l.ingredientId === ids.sucrose)!;
    const sugarFeb = febA.result.cost.ingredients.find((l) => l.ingredientId === ids.sucrose)!;
    expect(sugarJan.batchMinor).toBeCloseTo(100, 9);
    expect(sugarFeb.batchMinor).toBeCloseTo(200, 9);
    expect(febA.result.cost.batch.minor - janA.result.cost.batch.minor).toBeCloseTo(100, 9);
    // Per jar moves by 100 p × filled mass ÷ finished mass (340 g × 1.02 = 346.8 g per jar).
    const c = febA.result.cost;
    expect(c.perJar!.minor - janA.result.cost.perJar!.minor).toBeCloseTo((100 * 346.8) / c.finishedMassG, 9);
    // Packaging: jar 30 p + lid 8 p.
    expect(c.packaging.map((p) => p.perJarMinor)).toEqual([30, 8]);
  });

  it('keeps the base formula\'s pack format after it is archived, and reads its prices by id', async () => {
    const before = await trialCosts(dev(), trialId, '2026-02-15');
    await setPackagingArchived(dev(), 'format', jarFormatId, true);
    try {
      const after = await trialCosts(dev(), trialId, '2026-02-15');
      expect(after.packFormat?.name).toBe('340 g jar');
      const [v] = after.variants;
      if (!v.result.ok) throw new Error('not costed');
      expect(v.result.cost.packaging.map((p) => p.perJarMinor)).toEqual([30, 8]);
      expect(after).toEqual(before);
    } finally {
      await setPackagingArchived(dev(), 'format', jarFormatId, false);
    }
  });

  it('is complete once every line has a price', async () => {
    await price('citric_acid_anhydrous', '2026-01-01', '50.00', 25);
    const [v] = (await trialCosts(dev(), trialId, '2026-02-15')).variants;
    expect(v.result.ok && v.result.cost.complete).toBe(true);
    expect(v.result.ok && v.result.cost.missing).toEqual([]);
  });
});

describe('a production version: frozen at approval, today, and the warning', () => {
  beforeAll(async () => {
    const [base] = await listVariants(dev(), trialId);
    const input = await promotionInput(a, trialId, base.id, { code: freshProductCode() });
    const { requestId } = await requestPromotion(dev(), input);
    ({ productVersionId: versionId } = (await decidePromotion(actorOf(a, 'head_of_product'), requestId, { decision: 'approve', comment: '' })) as { productVersionId: string });
    productId = (await getProductionVersion(actorOf(a, 'production'), versionId)).product.id;
  });

  it('takes its formula’s pack format and freezes the cost of the approval day with the version', async () => {
    const row = await (await getEm()).findOneOrFail(ProductVersion, { id: versionId });
    expect((row.packFormat as unknown as { id: string }).id).toBe((await trialCosts(dev(), trialId)).packFormat!.id);
    const today = await trialCosts(dev(), trialId, todayIso());
    const [v] = today.variants;
    if (!v.result.ok) throw new Error('not costed');
    expect(row.costAtApproval).toMatchObject({ asOf: todayIso(), currency: 'GBP', packFormatName: '340 g jar', complete: true });
    expect(row.costAtApproval!.perJarMinor).toBeCloseTo(v.result.cost.perJar!.minor, 9);
  });

  it('keeps the frozen cost when prices change, shows today’s beside it and warns past the threshold', async () => {
    const before = await productCosts(dev(), productId);
    expect(before.versions[0].warn).toBe(false);
    expect(before.versions[0].movedPct).toBeCloseTo(0, 9);
    const frozen = before.versions[0].atApproval!.perJarMinor!;
    // Sugar doubles from today (200 → 400 p/kg): +200 p per batch of 1,000 g sugar.
    await price('sucrose', todayIso(), '100.00', 25);
    const after = await productCosts(dev(), productId);
    const v = after.versions[0];
    if (!v.today.ok) throw new Error('not costed');
    expect(v.atApproval!.perJarMinor).toBe(frozen);
    const expectedToday = frozen + (200 * 346.8) / v.today.cost.finishedMassG;
    expect(v.today.cost.perJar!.minor).toBeCloseTo(expectedToday, 9);
    expect(v.movedPct).toBeCloseTo(((expectedToday - frozen) / frozen) * 100, 9);
    expect(v.movedPct!).toBeGreaterThan(5);
    expect(v.warn).toBe(true);
    // Under a looser threshold the same move is no warning.
    await saveCostSettings(actorOf(a, 'admin'), { currency: 'GBP', overfillPct: 2, costWarningPct: Math.ceil(v.movedPct!) + 1 });
    expect((await productCosts(dev(), productId)).versions[0].warn).toBe(false);
    await saveCostSettings(actorOf(a, 'admin'), { currency: 'GBP', overfillPct: 2, costWarningPct: 5 });
  });

  it('gives a batch its actual cost per good jar from its charge and jars', async () => {
    const version = await getProductionVersion(actorOf(a, 'production'), versionId);
    // Made today: a batch cannot be dated before its version's approval (today, above).
    const date = todayIso();
    const { batchId } = await recordBatch(actorOf(a, 'production'), versionId, {
      lotCode: lotCodeFor(version.product.code, date, 1), batchDate: date, batchSizeG: 20_000, brixReading: 65, brixSampleTempC: 20, ph: 3.1, fillTempC: 88, jarsFilled: 50, jarsRejected: 2,
    });
    const cost = await batchCost(actorOf(a, 'production'), batchId);
    if (!cost.planned.ok) throw new Error('not costed');
    const planned = cost.planned.cost;
    // Today sugar is 400 p/kg (doubled in the test above). Charge 20,000 g over the formula's charge → raw
    // materials scaled; packaging 38 p for each of the 50 jars filled; divided by the 48 good jars.
    expect(planned.asOf).toBe(date);
    expect(planned.ingredients.find((l) => l.ingredientId === ids.sucrose)!.batchMinor).toBeCloseTo(400, 9);
    const expected = (planned.batch.minor * (20_000 / planned.chargeG) + 38 * 50) / 48;
    expect(cost.actualPerJar?.minor).toBeCloseTo(expected, 9);
    expect(cost.actualPerJar?.complete).toBe(true);
    expect(cost.goodJars).toBe(48);
  });

  it('a rejected batch has no good jars and no cost per good jar', async () => {
    // The walk: a rejected batch still showed "Actual, over 105 good jars" and a cost per jar.
    const version = await getProductionVersion(actorOf(a, 'production'), versionId);
    const date = todayIso();
    const production = actorOf(a, 'production');
    const { batchId } = await recordBatch(production, versionId, {
      lotCode: lotCodeFor(version.product.code, date, 2), batchDate: date, batchSizeG: 20_000, brixReading: 65, brixSampleTempC: 20, ph: 3.1, fillTempC: 70, jarsFilled: 50, jarsRejected: 0,
      disposition: 'hold', dispositionComment: 'Filled cold; holding for a decision.',
    });
    expect((await batchCost(production, batchId)).goodJars).toBe(50);
    await decideBatch(production, batchId, { decision: 'reject', comment: 'Filled cold; the lot is destroyed.' });
    const cost = await batchCost(production, batchId);
    expect(cost.goodJars).toBe(0);
    expect(cost.actualPerJar).toBeNull();
    const batch = (await getProductionVersion(production, versionId)).batches.find((b) => b.id === batchId)!;
    expect(batch.status).toBe('rejected');
    expect(batch.goodJars).toBe(0);
  });
});

describe('who sees costs', () => {
  const call = (handler: typeof basisRoute.GET, role: Role, params: Record<string, string> = {}, path = '') =>
    callRoute(handler as never, { method: 'GET', path, caller: { kind: 'session', person: a.people[role] }, params });

  it('tasters get 403 from every cost read; staff get figures', async () => {
    const batchId = (await getProductionVersion(actorOf(a, 'production'), versionId)).batches[0].id;
    const reads: Array<[typeof basisRoute.GET, Record<string, string>]> = [
      [basisRoute.GET, {}],
      [trialCostsRoute.GET as never, { trialId }],
      [productCostsRoute.GET as never, { productId }],
      [batchCostRoute.GET as never, { batchId }],
    ];
    for (const [handler, params] of reads) {
      const res = await call(handler, 'taster', params);
      expect(res.status).toBe(403);
      expect(JSON.stringify(res.body)).not.toMatch(/minor|GBP/);
    }
    const basis = await call(basisRoute.GET, 'production');
    expect(basis.status).toBe(200);
    expect((basis.body as { basis: { currency: string } }).basis.currency).toBe('GBP');
    // Production reads prices but not trials.
    expect((await call(trialCostsRoute.GET as never, 'production', { trialId })).status).toBe(403);
    expect((await call(trialCostsRoute.GET as never, 'head_of_product', { trialId })).status).toBe(200);
  });

  it('refuses an impossible as-of day with 422', async () => {
    const res = await callRoute(basisRoute.GET as never, { method: 'GET', path: '/api/v1/costs/basis?asOf=2026-02-30', caller: { kind: 'session', person: a.people.developer } });
    expect(res.status).toBe(422);
  });
});
