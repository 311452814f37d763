/** Authorisation-table rows for promotion, production versions, batch records and the audit trail (merged into access-table.ts). */
import type { ActionCase, RouteCase } from './access-table';
import type { Person, WorkspaceFixture } from './harness';
import { actorOf } from './harness';
import type { Role } from '@/lib/permissions';
import { recordBatch, requestPromotion } from '@/lib/production/mutations';
import { getProductionVersion } from '@/lib/production/queries';
import { lotCodeFor } from '@/lib/production/vocabulary';
import { createApprovedVersion, createPromotableTrial, freshProductCode, promotionInput } from './production-fixtures';

const REVIEW: Role[] = ['admin', 'developer', 'head_of_product'];
const REQUEST: Role[] = ['admin', 'developer'];
const STAFF: Role[] = ['admin', 'developer', 'head_of_product', 'production'];

async function freshRequestInput(a: WorkspaceFixture) {
  const { trialId, variantId } = await createPromotableTrial(a);
  return promotionInput(a, trialId, variantId, { code: freshProductCode() });
}

/** A pending request made by `by` (the developer unless the caller may request: then their own, so they may withdraw it). */
async function pendingRequest(a: WorkspaceFixture, by: Person | null): Promise<string> {
  const role: Role = by && REQUEST.includes(by.role) ? by.role : 'developer';
  return (await requestPromotion(actorOf(a, role), await freshRequestInput(a))).requestId;
}

const versions = new Map<string, { versionId: string; productId: string; code: string }>();
async function currentVersion(a: WorkspaceFixture) {
  let v = versions.get(a.workspaceId);
  if (!v) {
    const created = await createApprovedVersion(a);
    const view = await getProductionVersion(actorOf(a, 'production'), created.versionId);
    v = { versionId: created.versionId, productId: view.product.id, code: created.productCode };
    versions.set(a.workspaceId, v);
  }
  return v;
}

let batchDay = 0;
/** Each allowed call records a new lot: one per day, counting forward from 1 January 2026. */
function nextBatch(code: string) {
  batchDay += 1;
  const date = new Date(Date.UTC(2026, 0, batchDay)).toISOString().slice(0, 10);
  return { lotCode: lotCodeFor(code, date, 1), batchDate: date, batchSizeG: 30_000, brixReading: 65, brixSampleTempC: 20, ph: 3.1, fillTempC: 88, jarsFilled: 80, jarsRejected: 0 };
}

/** A fresh held batch: nextBatch() weighs no jars and has no set test, so it is recorded incomplete (on hold). */
async function heldBatch(a: WorkspaceFixture): Promise<string> {
  const v = await currentVersion(a);
  const { batchId, outcome } = await recordBatch(actorOf(a, 'production'), v.versionId, nextBatch(v.code));
  if (outcome !== 'incomplete') throw new Error(`expected an incomplete batch, got ${outcome}`);
  return batchId;
}

const versionParams = async (a: WorkspaceFixture) => ({ params: { versionId: (await currentVersion(a)).versionId } });

export const PRODUCTION_ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/v1/promotions', allowed: REVIEW, otherWorkspace: 'own-data' },
  {
    route: 'POST /api/v1/promotions',
    allowed: REQUEST,
    // The body names workspace A's trial: elsewhere it is not found.
    otherWorkspace: 404,
    prepare: async (a) => ({ body: await freshRequestInput(a) }),
  },
  { route: 'GET /api/v1/promotions/[requestId]', allowed: REVIEW, otherWorkspace: 404, prepare: async (a) => ({ params: { requestId: await pendingRequest(a, null) } }) },
  {
    route: 'POST /api/v1/promotions/[requestId]/decision',
    allowed: ['head_of_product'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'head_of_product',
    prepare: async (a) => ({ params: { requestId: await pendingRequest(a, null) }, body: { decision: 'send_back', comment: 'Matrix: send back.' } }),
  },
  {
    route: 'POST /api/v1/promotions/[requestId]/withdraw',
    allowed: REQUEST,
    otherWorkspace: 404,
    prepare: async (a, caller) => ({ params: { requestId: await pendingRequest(a, caller) }, body: {} }),
  },
  { route: 'GET /api/v1/products', allowed: STAFF, otherWorkspace: 'own-data' },
  { route: 'GET /api/v1/products/[productId]', allowed: STAFF, otherWorkspace: 404, prepare: async (a) => ({ params: { productId: (await currentVersion(a)).productId } }) },
  { route: 'GET /api/v1/products/[productId]/batches.csv', allowed: STAFF, otherWorkspace: 404, prepare: async (a) => ({ params: { productId: (await currentVersion(a)).productId } }) },
  { route: 'GET /api/v1/production-versions/[versionId]', allowed: STAFF, otherWorkspace: 404, prepare: versionParams },
  { route: 'PATCH /api/v1/production-versions/[versionId]', allowed: STAFF, allowedStatus: 409, otherWorkspace: 404, prepare: async (a) => ({ ...(await versionParams(a)), body: { spec: {} } }) },
  { route: 'PUT /api/v1/production-versions/[versionId]', allowed: STAFF, allowedStatus: 409, otherWorkspace: 404, prepare: async (a) => ({ ...(await versionParams(a)), body: {} }) },
  { route: 'DELETE /api/v1/production-versions/[versionId]', allowed: STAFF, allowedStatus: 409, otherWorkspace: 404, prepare: versionParams },
  { route: 'GET /api/v1/production-versions/[versionId]/batch-sheet', allowed: STAFF, otherWorkspace: 404, prepare: versionParams },
  { route: 'GET /api/v1/production-versions/[versionId]/label', allowed: STAFF, otherWorkspace: 404, prepare: versionParams },
  { route: 'GET /api/v1/production-versions/[versionId]/batches', allowed: STAFF, otherWorkspace: 404, prepare: versionParams },
  {
    route: 'POST /api/v1/production-versions/[versionId]/batches',
    allowed: ['production'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'production',
    prepare: async (a) => {
      const v = await currentVersion(a);
      return { params: { versionId: v.versionId }, body: nextBatch(v.code) };
    },
  },
  { route: 'GET /api/v1/batches/[batchId]', allowed: STAFF, otherWorkspace: 404, prepare: async (a) => ({ params: { batchId: await heldBatch(a) } }) },
  {
    route: 'POST /api/v1/batches/[batchId]/retests',
    allowed: ['production'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'production',
    prepare: async (a) => ({ params: { batchId: await heldBatch(a) }, body: { setTestScore: 4, netFillMeanG: 342, netFillMinG: 336, comment: 'Matrix: re-test.' } }),
  },
  {
    route: 'POST /api/v1/batches/[batchId]/decision',
    allowed: ['production'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'production',
    prepare: async (a) => ({ params: { batchId: await heldBatch(a) }, body: { decision: 'reject', comment: 'Matrix: reject.' } }),
  },
  { route: 'GET /api/v1/audit', allowed: ['admin', 'head_of_product'], otherWorkspace: 'own-data' },
];

export const PRODUCTION_ACTION_CASES: ActionCase[] = [
  { action: 'lib/production/actions.ts#requestPromotionAction', allowed: REQUEST, otherWorkspace: 404, argsAsync: async (a) => [await freshRequestInput(a)] },
  {
    action: 'lib/production/actions.ts#decidePromotionAction',
    allowed: ['head_of_product'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'head_of_product',
    argsAsync: async (a) => [await pendingRequest(a, null), { decision: 'send_back', comment: 'Matrix: send back.' }],
  },
  {
    action: 'lib/production/actions.ts#withdrawPromotionAction',
    allowed: ['developer'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'developer',
    // Made by the developer: only they may withdraw it (an admin gets 403 from the requester rule).
    argsAsync: async (a) => [await pendingRequest(a, null), { comment: '' }],
  },
  {
    action: 'lib/production/actions.ts#recordBatchAction',
    allowed: ['production'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'production',
    argsAsync: async (a) => {
      const v = await currentVersion(a);
      return [v.versionId, nextBatch(v.code)];
    },
  },
  {
    action: 'lib/production/actions.ts#retestBatchAction',
    allowed: ['production'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'production',
    argsAsync: async (a) => [await heldBatch(a), { setTestScore: 4, comment: 'Matrix: re-test.' }],
  },
  {
    action: 'lib/production/actions.ts#decideBatchAction',
    allowed: ['production'],
    otherWorkspace: 404,
    otherWorkspaceRole: 'production',
    argsAsync: async (a) => [await heldBatch(a), { decision: 'reject', comment: 'Matrix: reject.' }],
  },
];
