import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getPromotionRequest } from '@/lib/production/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ requestId: string }>('promotion.read', async ({ actor, params }) =>
  json({ promotion: await getPromotionRequest(actor, uuidParam(params.requestId, 'promotion request')) }));
