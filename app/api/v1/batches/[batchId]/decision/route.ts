import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { decideBatch } from '@/lib/production/mutations';
import { batchDecisionSchema } from '@/lib/production/schema';

export const dynamic = 'force-dynamic';

/** Release (only when the latest checks pass) or reject a held batch; 409 when it is not on hold. */
export const POST = apiRoute<{ batchId: string }>('batches.record', async ({ actor, params, body }) => {
  const id = uuidParam(params.batchId, 'batch');
  return json(await decideBatch(actor, id, await body(batchDecisionSchema)), 201);
});
