/** The demo seed prices every starter ingredient and the packaging of one jar, and costs every formula and version in it. */
import { describe, it, expect, beforeAll } from 'vitest';
import { getEm } from '@/lib/db';
import { seedDemo } from '@/lib/seed/demo';
import { DEMO_CURRENCY } from '@/lib/seed/prices';
import { todayIso } from '@/lib/format/dates';
import { Formula, Ingredient, PackagingItem, ProductVersion } from '@/entities';
import { costSettings, packagingPricesAsOf, packFormatOfFormulas, packFormatOfVersions, packFormatsByIds, priceHistory, pricesAsOf } from '@/lib/pricing/queries';

let workspaceId: string;
const today = todayIso();

beforeAll(async () => {
  workspaceId = (await seedDemo((await getEm()).fork())).workspaceId;
}, 600_000);

describe('demo prices', () => {
  it('states the currency and prices every starter ingredient and packaging item today', async () => {
    expect((await costSettings(workspaceId)).currency).toBe(DEMO_CURRENCY);
    const em = await getEm();
    const ingredients = await em.find(Ingredient, { workspace: workspaceId });
    const prices = await pricesAsOf(workspaceId, ingredients.map((i) => i.id), today);
    expect(ingredients.filter((i) => !prices.has(i.id)).map((i) => i.name)).toEqual([]);
    const items = await em.find(PackagingItem, { workspace: workspaceId });
    expect(items.length).toBe(4);
    expect((await packagingPricesAsOf(workspaceId, items.map((i) => i.id), today)).size).toBe(4);
  });

  it('has sugar change price during the past year', async () => {
    const em = await getEm();
    const sugar = await em.findOneOrFail(Ingredient, { workspace: workspaceId, typicalKey: 'sucrose' });
    const history = await priceHistory(workspaceId, [sugar.id]);
    expect(history.length).toBeGreaterThanOrEqual(2);
    expect(new Set(history.map((p) => p.packPriceMinor)).size).toBe(history.length);
  });

  it('costs every seeded formula and production version in the 340 g jar with a case of 12', async () => {
    const em = await getEm();
    const formulas = await em.find(Formula, { workspace: workspaceId });
    const versions = await em.find(ProductVersion, { workspace: workspaceId });
    expect(formulas.length).toBeGreaterThan(0);
    expect(versions.length).toBeGreaterThan(0);
    const chosen = new Set([...(await packFormatOfFormulas(workspaceId, formulas.map((f) => f.id))).values(), ...(await packFormatOfVersions(workspaceId, versions.map((v) => v.id))).values()]);
    expect(chosen.size).toBe(1);
    const [formatId] = [...chosen];
    const format = (await packFormatsByIds(workspaceId, [formatId!])).get(formatId!)!;
    expect(format.netFillG).toBe(340);
    expect(format.items.map((i) => i.perJar).sort()).toEqual([1 / 12, 1, 1, 1].sort());
  });
});
