import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { withdrawIngredientPrice } from '@/lib/pricing/mutations';
import { withdrawSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

/** Withdraws a mistaken ingredient price with a reason: it stays on record and no longer counts; 409 when already withdrawn. */
export const POST = apiRoute<{ priceId: string }>('prices.write', async ({ actor, params, body }) => {
  const priceId = uuidParam(params.priceId, 'price');
  await withdrawIngredientPrice(actor, priceId, (await body(withdrawSchema)).reason);
  return json({ ok: true });
});
