import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getPackFormat } from '@/lib/pricing/queries';
import { updatePackFormat } from '@/lib/pricing/mutations';
import { packFormatSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ packFormatId: string }>('prices.read', async ({ actor, params }) => json({ packFormat: await getPackFormat(actor, uuidParam(params.packFormatId, 'pack format')) }));

export const PUT = apiRoute<{ packFormatId: string }>('prices.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.packFormatId, 'pack format');
  return json(await updatePackFormat(actor, id, await body(packFormatSchema)));
});
