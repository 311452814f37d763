import { apiRoute, json } from '@/lib/api/route';
import { costSettings, packagingItemList } from '@/lib/pricing/queries';
import { createPackagingItem } from '@/lib/pricing/mutations';
import { packagingItemSchema, priceListQuerySchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('prices.read', async ({ actor, req }) => {
  const query = priceListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  const { currency } = await costSettings(actor.workspaceId);
  return json({ currency, items: await packagingItemList(actor, query.asOf) });
});

export const POST = apiRoute('prices.write', async ({ actor, body }) => json(await createPackagingItem(actor, await body(packagingItemSchema)), 201));
