import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { decidePromotion } from '@/lib/production/mutations';
import { decisionSchema } from '@/lib/production/schema';

export const dynamic = 'force-dynamic';

/** Approve (creates the production version) or send back; 403 on one's own request, 409 once decided. */
export const POST = apiRoute<{ requestId: string }>('promotion.decide', async ({ actor, params, body }) => {
  const id = uuidParam(params.requestId, 'promotion request');
  return json(await decidePromotion(actor, id, await body(decisionSchema)));
});
