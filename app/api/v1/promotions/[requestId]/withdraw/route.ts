import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { withdrawPromotion } from '@/lib/production/mutations';
import { withdrawSchema } from '@/lib/production/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ requestId: string }>('promotion.request', async ({ actor, params, body }) => {
  const id = uuidParam(params.requestId, 'promotion request');
  await withdrawPromotion(actor, id, (await body(withdrawSchema)).comment);
  return json({ ok: true, status: 'withdrawn' });
});
