/**
 * The demo's prices, in pounds sterling (GBP): invented figures of our own, dated over the past
 * year, for every starter ingredient and the packaging of one 340 g jar, which every seeded formula
 * and production version is costed in. Sugar changes price twice, so "a price change of sugar"
 * moves every dependent figure; one raspberry price was typed wrong and is withdrawn.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { Formula, Ingredient, ProductVersion } from '@/entities';
import type { Actor } from '@/lib/permissions';
import { isoDate } from '@/lib/format/dates';
import {
  addIngredientPrice, addPackagingPrice, createPackagingItem, createPackFormat, saveCostSettings, setFormulaPackFormat, setRefuse,
  setVersionPackFormat, withdrawIngredientPrice,
} from '@/lib/pricing/mutations';

export const DEMO_CURRENCY = 'GBP';

type PricePlan = { key: string; supplier: string; packSize: number; packUnit: 'g' | 'kg'; refusePct?: number; points: Array<[daysAgo: number, packPrice: string]> };

/** Our own figures (not market quotations): pack price in GBP, pack size, days before today each price began. */
const INGREDIENT_PRICES: PricePlan[] = [
  { key: 'strawberry', supplier: 'Fernlea Growers', packSize: 10, packUnit: 'kg', refusePct: 4, points: [[350, '31.00'], [120, '34.50']] },
  { key: 'raspberry', supplier: 'Fernlea Growers', packSize: 10, packUnit: 'kg', refusePct: 1, points: [[340, '52.00']] },
  { key: 'apricot', supplier: 'Southgate Fruit Imports', packSize: 12, packUnit: 'kg', refusePct: 9, points: [[330, '33.60'], [90, '36.00']] },
  { key: 'blackcurrant', supplier: 'Fernlea Growers', packSize: 10, packUnit: 'kg', refusePct: 2, points: [[320, '38.00']] },
  { key: 'redcurrant', supplier: 'Fernlea Growers', packSize: 10, packUnit: 'kg', refusePct: 6, points: [[320, '44.00']] },
  { key: 'apple_tart', supplier: 'Orchard Lane Co-op', packSize: 18, packUnit: 'kg', refusePct: 22, points: [[300, '19.80']] },
  { key: 'quince', supplier: 'Orchard Lane Co-op', packSize: 10, packUnit: 'kg', refusePct: 25, points: [[280, '27.50']] },
  { key: 'plum', supplier: 'Orchard Lane Co-op', packSize: 12, packUnit: 'kg', refusePct: 8, points: [[300, '21.60']] },
  { key: 'blackberry', supplier: 'Fernlea Growers', packSize: 10, packUnit: 'kg', points: [[310, '41.00']] },
  { key: 'bitter_orange', supplier: 'Southgate Fruit Imports', packSize: 15, packUnit: 'kg', refusePct: 3, points: [[360, '26.25'], [20, '28.50']] },
  { key: 'lemon_juice', supplier: 'Southgate Fruit Imports', packSize: 5, packUnit: 'kg', points: [[300, '11.40']] },
  // Sugar: the price that moves.
  { key: 'sucrose', supplier: 'Millbrook Sugar', packSize: 25, packUnit: 'kg', points: [[355, '21.75'], [160, '23.50'], [30, '26.25']] },
  { key: 'glucose_syrup_de42', supplier: 'Millbrook Sugar', packSize: 25, packUnit: 'kg', points: [[340, '24.00']] },
  { key: 'invert_syrup', supplier: 'Millbrook Sugar', packSize: 25, packUnit: 'kg', points: [[340, '31.25']] },
  { key: 'honey', supplier: 'Heathside Apiaries', packSize: 6, packUnit: 'kg', points: [[250, '39.00']] },
  { key: 'pectin_hm_rapid_150', supplier: 'Calder Ingredients', packSize: 1, packUnit: 'kg', points: [[345, '18.90']] },
  { key: 'pectin_lm_amidated', supplier: 'Calder Ingredients', packSize: 1, packUnit: 'kg', points: [[345, '22.40']] },
  { key: 'citric_acid_anhydrous', supplier: 'Calder Ingredients', packSize: 1, packUnit: 'kg', points: [[345, '4.60']] },
  { key: 'calcium_citrate', supplier: 'Calder Ingredients', packSize: 500, packUnit: 'g', points: [[345, '6.80']] },
  { key: 'potassium_sorbate', supplier: 'Calder Ingredients', packSize: 1, packUnit: 'kg', points: [[200, '12.40']] },
  { key: 'water', supplier: 'Mains supply', packSize: 1000, packUnit: 'kg', points: [[365, '2.10']] },
];

const PACKAGING: Array<{ name: string; kind: 'jar' | 'lid' | 'label' | 'case'; supplier: string; piecesPerPack: number; points: Array<[number, string]>; perJars: number }> = [
  { name: 'Round jar 340 g, clear glass', kind: 'jar', supplier: 'Kestrel Glassworks', piecesPerPack: 1200, points: [[350, '336.00'], [60, '354.00']], perJars: 1 },
  { name: 'Twist-off lid 63 mm, gold', kind: 'lid', supplier: 'Kestrel Glassworks', piecesPerPack: 1000, points: [[350, '61.00']], perJars: 1 },
  { name: 'Front label, printed', kind: 'label', supplier: 'Inkwell Print', piecesPerPack: 1000, points: [[330, '37.50']], perJars: 1 },
  { name: 'Shipping case for 12 jars', kind: 'case', supplier: 'Boxford Cartons', piecesPerPack: 100, points: [[330, '48.00']], perJars: 12 },
];

function daysAgo(n: number, today = new Date()): string {
  return isoDate(new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), today.getUTCDate() - n)));
}

export async function seedDemoPrices(em: EntityManager, people: { admin: Actor; production: Actor; developer: Actor }): Promise<void> {
  const { admin, production, developer } = people;
  await saveCostSettings(admin, { currency: DEMO_CURRENCY, overfillPct: 1.5, costWarningPct: 5 });
  const ingredients = await em.find(Ingredient, { workspace: admin.workspaceId, typicalKey: { $ne: null } });
  const byKey = new Map(ingredients.map((i) => [i.typicalKey as string, i.id]));
  for (const plan of INGREDIENT_PRICES) {
    const ingredientId = byKey.get(plan.key);
    if (!ingredientId) continue;
    for (const [ago, packPrice] of plan.points) {
      await addIngredientPrice(production, { ingredientId, packPrice, packSize: plan.packSize, packUnit: plan.packUnit, supplier: plan.supplier, validFrom: daysAgo(ago) });
    }
    if (plan.refusePct) await setRefuse(production, ingredientId, plan.refusePct);
  }
  // A slip kept on record: the price of a pallet typed as the price of a tray, withdrawn with the reason.
  const raspberry = byKey.get('raspberry');
  if (raspberry) {
    const { priceId } = await addIngredientPrice(production, { ingredientId: raspberry, packPrice: '520.00', packSize: 10, packUnit: 'kg', supplier: 'Fernlea Growers', validFrom: daysAgo(200) });
    await withdrawIngredientPrice(production, priceId, 'Typed the price of a pallet of ten trays; the tray price did not change.');
  }

  const items = [];
  for (const p of PACKAGING) {
    const { packagingItemId } = await createPackagingItem(production, { name: p.name, kind: p.kind });
    for (const [ago, packPrice] of p.points) {
      await addPackagingPrice(production, { packagingItemId, packPrice, piecesPerPack: p.piecesPerPack, supplier: p.supplier, validFrom: daysAgo(ago) });
    }
    items.push({ packagingItemId, pieces: 1, perJars: p.perJars });
  }
  const { packFormatId } = await createPackFormat(production, { name: '340 g jar, case of 12', netFillG: 340, items });

  for (const f of await em.find(Formula, { workspace: admin.workspaceId })) await setFormulaPackFormat(developer, f.id, packFormatId);
  for (const v of await em.find(ProductVersion, { workspace: admin.workspaceId })) await setVersionPackFormat(production, v.id, packFormatId);
}
