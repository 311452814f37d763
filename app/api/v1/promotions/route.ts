import { apiRoute, json } from '@/lib/api/route';
import { listPromotionRequests } from '@/lib/production/queries';
import { requestPromotion } from '@/lib/production/mutations';
import { promotionListQuerySchema, requestPromotionSchema } from '@/lib/production/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('promotion.read', async ({ actor, req }) => {
  const query = promotionListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return json({ promotions: await listPromotionRequests(actor, query) });
});

export const POST = apiRoute('promotion.request', async ({ actor, body }) => json(await requestPromotion(actor, await body(requestPromotionSchema)), 201));
