import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { retestBatch } from '@/lib/production/mutations';
import { batchRetestSchema } from '@/lib/production/schema';

export const dynamic = 'force-dynamic';

/** New readings of a held batch, checked against the same spec; 409 when the batch is not on hold. */
export const POST = apiRoute<{ batchId: string }>('batches.record', async ({ actor, params, body }) => {
  const id = uuidParam(params.batchId, 'batch');
  return json(await retestBatch(actor, id, await body(batchRetestSchema)), 201);
});
