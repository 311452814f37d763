/** Authorisation-table rows for the cost reads (merged into access-table.ts). Prices are for staff, never tasters. */
import type { RouteCase } from './access-table';
import type { WorkspaceFixture } from './harness';
import { actorOf } from './harness';
import type { Role } from '@/lib/permissions';
import { recordBatch } from '@/lib/production/mutations';
import { getProductionVersion } from '@/lib/production/queries';
import { lotCodeFor } from '@/lib/production/vocabulary';
import { createApprovedVersion } from './production-fixtures';
import { trialWithVariants } from './access-trials';

const PRICES: Role[] = ['admin', 'developer', 'head_of_product', 'production'];
/** Trial costs need trials.read as well as prices.read. */
const TRIAL_PRICES: Role[] = ['admin', 'developer', 'head_of_product'];

const versions = new Map<string, { versionId: string; productId: string; code: string }>();
async function version(a: WorkspaceFixture) {
  let v = versions.get(a.workspaceId);
  if (!v) {
    const created = await createApprovedVersion(a);
    const view = await getProductionVersion(actorOf(a, 'production'), created.versionId);
    v = { versionId: created.versionId, productId: view.product.id, code: created.productCode };
    versions.set(a.workspaceId, v);
  }
  return v;
}

const batches = new Map<string, string>();
/** One batch per workspace, dated in 2025 so no other row's lot code can collide with it. */
async function batch(a: WorkspaceFixture): Promise<string> {
  let id = batches.get(a.workspaceId);
  if (!id) {
    const v = await version(a);
    const date = '2025-03-03';
    ({ batchId: id } = await recordBatch(actorOf(a, 'production'), v.versionId, {
      lotCode: lotCodeFor(v.code, date, 1), batchDate: date, batchSizeG: 30_000, brixReading: 65, brixSampleTempC: 20, ph: 3.1, fillTempC: 88, jarsFilled: 80, jarsRejected: 0,
    }));
    batches.set(a.workspaceId, id);
  }
  return id;
}

export const COSTS_ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/v1/costs/basis', allowed: PRICES, otherWorkspace: 'own-data' },
  { route: 'GET /api/v1/trials/[trialId]/costs', allowed: TRIAL_PRICES, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId } }) },
  { route: 'GET /api/v1/products/[productId]/costs', allowed: PRICES, otherWorkspace: 404, prepare: async (a) => ({ params: { productId: (await version(a)).productId } }) },
  { route: 'GET /api/v1/batches/[batchId]/cost', allowed: PRICES, otherWorkspace: 404, prepare: async (a) => ({ params: { batchId: await batch(a) } }) },
];
