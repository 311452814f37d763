import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getProduct } from '@/lib/production/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ productId: string }>('production.read', async ({ actor, params }) =>
  json(await getProduct(actor, uuidParam(params.productId, 'product'))));
