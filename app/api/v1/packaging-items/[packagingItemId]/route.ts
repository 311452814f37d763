import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { costSettings, packagingItemDetail } from '@/lib/pricing/queries';
import { updatePackagingItem } from '@/lib/pricing/mutations';
import { packagingItemSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ packagingItemId: string }>('prices.read', async ({ actor, params }) => {
  const detail = await packagingItemDetail(actor, uuidParam(params.packagingItemId, 'packaging item'));
  return json({ currency: (await costSettings(actor.workspaceId)).currency, ...detail });
});

export const PUT = apiRoute<{ packagingItemId: string }>('prices.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.packagingItemId, 'packaging item');
  return json(await updatePackagingItem(actor, id, await body(packagingItemSchema)));
});
