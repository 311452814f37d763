import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { withdrawCook } from '@/lib/trials/mutations';
import { withdrawCookSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

/** Withdraws a cook with a reason: it stays on record, out of every comparison and the promotion evidence. */
export const POST = apiRoute<{ trialId: string; cookId: string }>('trials.write', async ({ actor, params, body }) => {
  const trialId = uuidParam(params.trialId, 'trial');
  const cookId = uuidParam(params.cookId, 'cook');
  await withdrawCook(actor, trialId, cookId, (await body(withdrawCookSchema)).reason);
  return json({ ok: true });
});
