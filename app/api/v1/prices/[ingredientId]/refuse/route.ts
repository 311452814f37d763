import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { setRefuse } from '@/lib/pricing/mutations';
import { refuseBodySchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

/** The share of the bought mass trimmed away (stones, peel), 0–95 %: bought mass = weighed mass ÷ (1 − share). */
export const PUT = apiRoute<{ ingredientId: string }>('prices.write', async ({ actor, params, body }) => {
  const ingredientId = uuidParam(params.ingredientId, 'ingredient');
  await setRefuse(actor, ingredientId, (await body(refuseBodySchema)).refusePct);
  return json({ ok: true });
});
