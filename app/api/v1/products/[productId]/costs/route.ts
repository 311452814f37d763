import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { productCosts } from '@/lib/costs/queries';

export const dynamic = 'force-dynamic';

/** Every version's cost frozen at approval and today's, with the move against the workspace threshold. */
export const GET = apiRoute<{ productId: string }>('prices.read', async ({ actor, params }) =>
  json({ costs: await productCosts(actor, uuidParam(params.productId, 'product')) }));
