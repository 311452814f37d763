import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { batchCost } from '@/lib/costs/queries';

export const dynamic = 'force-dynamic';

/** A batch's cost: its version on the batch's day, and per good jar from its charge and jars. */
export const GET = apiRoute<{ batchId: string }>('prices.read', async ({ actor, params }) =>
  json({ cost: await batchCost(actor, uuidParam(params.batchId, 'batch')) }));
