import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getProductionVersion, listBatches } from '@/lib/production/queries';
import { recordBatch } from '@/lib/production/mutations';
import { batchRecordSchema } from '@/lib/production/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ versionId: string }>('production.read', async ({ actor, params }) => {
  const version = await getProductionVersion(actor, uuidParam(params.versionId, 'production version'));
  return json({ batches: await listBatches(actor, { versionId: version.id }) });
});

/** Each reading is checked against the version's spec; a failed batch needs a disposition (422 without one). */
export const POST = apiRoute<{ versionId: string }>('batches.record', async ({ actor, params, body }) => {
  const id = uuidParam(params.versionId, 'production version');
  return json(await recordBatch(actor, id, await body(batchRecordSchema)), 201);
});
