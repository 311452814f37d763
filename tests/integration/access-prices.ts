/** Authorisation-table rows for prices, packaging and pack formats (merged into access-table.ts). */
import type { ActionCase, RouteCase } from './access-table';
import { actorOf, type WorkspaceFixture } from './harness';
import type { Role } from '@/lib/permissions';
import { createFixtureFormula, starterIds } from './fixtures';
import { createApprovedVersion } from './production-fixtures';
import { costSettings } from '@/lib/pricing/queries';
import { createIngredient } from '@/lib/ingredients/mutations';
import { addIngredientPrice, addPackagingPrice, createPackagingItem, createPackFormat, saveCostSettings } from '@/lib/pricing/mutations';

const READ: Role[] = ['admin', 'developer', 'head_of_product', 'production'];
const WRITE: Role[] = ['admin', 'developer', 'production'];

/** Prices need the workspace currency: workspace A states EUR. */
export async function ensureCurrency(a: WorkspaceFixture): Promise<void> {
  if (!(await costSettings(a.workspaceId)).currency) await saveCostSettings(actorOf(a, 'admin'), { currency: 'EUR', overfillPct: 1, costWarningPct: 5 });
}

async function sugarId(a: WorkspaceFixture): Promise<string> {
  return (await starterIds(a)).sucrose;
}

async function freshPrice(a: WorkspaceFixture): Promise<string> {
  await ensureCurrency(a);
  return (await addIngredientPrice(actorOf(a, 'admin'), { ingredientId: await sugarId(a), packPrice: '27.50', packSize: 25, packUnit: 'kg', supplier: 'Matrix mill', validFrom: '2026-01-05' })).priceId;
}

async function freshItem(a: WorkspaceFixture): Promise<string> {
  return (await createPackagingItem(actorOf(a, 'admin'), { name: `Matrix lid ${Math.random().toString(36).slice(2, 8)}`, kind: 'lid' })).packagingItemId;
}

async function freshPackagingPrice(a: WorkspaceFixture): Promise<string> {
  await ensureCurrency(a);
  return (await addPackagingPrice(actorOf(a, 'admin'), { packagingItemId: await freshItem(a), packPrice: '40.00', piecesPerPack: 1000, supplier: null, validFrom: '2026-01-05' })).priceId;
}

async function freshFormat(a: WorkspaceFixture): Promise<string> {
  return (await createPackFormat(actorOf(a, 'admin'), { name: 'Matrix 340 g jar', netFillG: 340, items: [{ packagingItemId: await freshItem(a), pieces: 1, perJars: 1 }] })).packFormatId;
}

const versions = new Map<string, string>();
async function versionOf(a: WorkspaceFixture): Promise<string> {
  let v = versions.get(a.workspaceId);
  if (!v) {
    v = (await createApprovedVersion(a)).versionId;
    versions.set(a.workspaceId, v);
  }
  return v;
}

const priceBody = async (a: WorkspaceFixture) => {
  await ensureCurrency(a);
  return { ingredientId: await sugarId(a), packPrice: '28.10', packSize: 25, packUnit: 'kg', supplier: 'Matrix mill', validFrom: '2026-02-01' };
};
/** Names an ingredient only workspace A has: elsewhere the file matches nothing (or finds no currency) and is refused whole. */
const ownIngredient = new Map<string, string>();
const importBody = async (a: WorkspaceFixture) => {
  await ensureCurrency(a);
  let name = ownIngredient.get(a.workspaceId);
  if (!name) {
    name = `Matrix damson ${Math.random().toString(36).slice(2, 8)}`;
    await createIngredient(actorOf(a, 'admin'), { name, kind: 'fruit', solidsPct: 12 });
    ownIngredient.set(a.workspaceId, name);
  }
  return { csv: `ingredient,valid_from,pack_price,pack_size,pack_unit\n${name},2026-03-01,29.00,10,kg\n` };
};

export const PRICES_ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/v1/cost-settings', allowed: READ, otherWorkspace: 'own-data' },
  { route: 'PUT /api/v1/cost-settings', allowed: ['admin'], otherWorkspace: 'own-data', prepare: () => ({ body: { currency: 'EUR', overfillPct: 1, costWarningPct: 5 } }) },
  { route: 'GET /api/v1/prices', allowed: READ, otherWorkspace: 'own-data' },
  // The body names workspace A's ingredient: elsewhere it is not found.
  { route: 'POST /api/v1/prices', allowed: WRITE, otherWorkspace: 404, prepare: async (a) => ({ body: await priceBody(a) }) },
  { route: 'POST /api/v1/prices/import', allowed: WRITE, otherWorkspace: 422, prepare: async (a) => ({ body: await importBody(a) }) },
  { route: 'GET /api/v1/prices/export', allowed: READ, otherWorkspace: 'own-data' },
  { route: 'GET /api/v1/prices/[ingredientId]', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { ingredientId: await sugarId(a) } }) },
  { route: 'PUT /api/v1/prices/[ingredientId]/refuse', allowed: WRITE, otherWorkspace: 404, prepare: async (a) => ({ params: { ingredientId: await sugarId(a) }, body: { refusePct: 0 } }) },
  { route: 'POST /api/v1/price-points/[priceId]/withdraw', allowed: WRITE, otherWorkspace: 404, prepare: async (a) => ({ params: { priceId: await freshPrice(a) }, body: { reason: 'Matrix: typed twice.' } }) },
  { route: 'GET /api/v1/packaging-items', allowed: READ, otherWorkspace: 'own-data' },
  { route: 'POST /api/v1/packaging-items', allowed: WRITE, otherWorkspace: 'own-data', prepare: () => ({ body: { name: 'Matrix label', kind: 'label' } }) },
  { route: 'GET /api/v1/packaging-items/[packagingItemId]', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { packagingItemId: await freshItem(a) } }) },
  { route: 'PUT /api/v1/packaging-items/[packagingItemId]', allowed: WRITE, otherWorkspace: 404, prepare: async (a) => ({ params: { packagingItemId: await freshItem(a) }, body: { name: 'Matrix lid, renamed', kind: 'lid' } }) },
  {
    route: 'POST /api/v1/packaging-prices',
    allowed: WRITE,
    otherWorkspace: 404,
    prepare: async (a) => {
      await ensureCurrency(a);
      return { body: { packagingItemId: await freshItem(a), packPrice: '41.00', piecesPerPack: 1000, supplier: 'Matrix glass', validFrom: '2026-02-01' } };
    },
  },
  { route: 'POST /api/v1/packaging-prices/[priceId]/withdraw', allowed: WRITE, otherWorkspace: 404, prepare: async (a) => ({ params: { priceId: await freshPackagingPrice(a) }, body: { reason: 'Matrix: wrong supplier.' } }) },
  { route: 'GET /api/v1/pack-formats', allowed: READ, otherWorkspace: 'own-data' },
  // The body names workspace A's packaging: elsewhere it matches nothing (422).
  { route: 'POST /api/v1/pack-formats', allowed: WRITE, otherWorkspace: 422, prepare: async (a) => ({ body: { name: 'Matrix 212 ml jar', netFillG: 227, items: [{ packagingItemId: await freshItem(a), pieces: 1, perJars: 12 }] } }) },
  { route: 'GET /api/v1/pack-formats/[packFormatId]', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { packFormatId: await freshFormat(a) } }) },
  { route: 'PUT /api/v1/pack-formats/[packFormatId]', allowed: WRITE, otherWorkspace: 404, prepare: async (a) => ({ params: { packFormatId: await freshFormat(a) }, body: { name: 'Matrix jar, renamed', netFillG: 340, items: [] } }) },
  { route: 'PUT /api/v1/formulas/[formulaId]/pack-format', allowed: ['admin', 'developer'], otherWorkspace: 404, prepare: async (a) => ({ params: { formulaId: await createFixtureFormula(a) }, body: { packFormatId: await freshFormat(a) } }) },
  { route: 'PUT /api/v1/production-versions/[versionId]/pack-format', allowed: WRITE, otherWorkspace: 404, prepare: async (a) => ({ params: { versionId: await versionOf(a) }, body: { packFormatId: await freshFormat(a) } }) },
];

export const PRICES_ACTION_CASES: ActionCase[] = [
  { action: 'lib/pricing/actions.ts#saveCostSettingsAction', allowed: ['admin'], otherWorkspace: 'own-data', args: () => [{ currency: 'EUR', overfillPct: 1, costWarningPct: 5 }] },
  { action: 'lib/pricing/actions.ts#addIngredientPriceAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => [await priceBody(a)] },
  { action: 'lib/pricing/actions.ts#withdrawIngredientPriceAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => [await freshPrice(a), { reason: 'Matrix: typed twice.' }] },
  { action: 'lib/pricing/actions.ts#setRefuseAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => [{ ingredientId: await sugarId(a), refusePct: 0 }] },
  { action: 'lib/pricing/actions.ts#importPricesAction', allowed: WRITE, otherWorkspace: 422, argsAsync: async (a) => [await importBody(a)] },
  // A null id creates (the app's "add" form); a wrong shape in its place must be refused, never taken as "create".
  { action: 'lib/pricing/actions.ts#savePackagingItemAction', allowed: WRITE, otherWorkspace: 'own-data', args: () => [null, { name: 'Matrix label', kind: 'label' }] },
  {
    action: 'lib/pricing/actions.ts#addPackagingPriceAction',
    allowed: WRITE,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      await ensureCurrency(a);
      return [{ packagingItemId: await freshItem(a), packPrice: '41.00', piecesPerPack: 1000, supplier: null, validFrom: '2026-02-01' }];
    },
  },
  { action: 'lib/pricing/actions.ts#withdrawPackagingPriceAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => [await freshPackagingPrice(a), { reason: 'Matrix: wrong supplier.' }] },
  // Names workspace A's packaging: elsewhere it matches nothing (422).
  { action: 'lib/pricing/actions.ts#savePackFormatAction', allowed: WRITE, otherWorkspace: 422, argsAsync: async (a) => [null, { name: 'Matrix 212 ml jar', netFillG: 227, items: [{ packagingItemId: await freshItem(a), pieces: 1, perJars: 12 }] }] },
  { action: 'lib/pricing/actions.ts#archivePackagingAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => ['item', await freshItem(a), true] },
  { action: 'lib/pricing/actions.ts#setFormulaPackFormatAction', allowed: ['admin', 'developer'], otherWorkspace: 404, argsAsync: async (a) => [await createFixtureFormula(a), { packFormatId: await freshFormat(a) }] },
  { action: 'lib/pricing/actions.ts#setVersionPackFormatAction', allowed: WRITE, otherWorkspace: 404, argsAsync: async (a) => [await versionOf(a), { packFormatId: await freshFormat(a) }] },
];
