import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { withdrawPackagingPrice } from '@/lib/pricing/mutations';
import { withdrawSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

/** Withdraws a mistaken packaging price with a reason; 409 when already withdrawn. */
export const POST = apiRoute<{ priceId: string }>('prices.write', async ({ actor, params, body }) => {
  const priceId = uuidParam(params.priceId, 'price');
  await withdrawPackagingPrice(actor, priceId, (await body(withdrawSchema)).reason);
  return json({ ok: true });
});
