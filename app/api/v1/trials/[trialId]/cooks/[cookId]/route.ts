import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { correctCook } from '@/lib/trials/mutations';
import { correctCookSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

/** Corrects a cook (the fields sent replace the stored ones; the old values are kept with the reason). */
export const PATCH = apiRoute<{ trialId: string; cookId: string }>('trials.write', async ({ actor, params, body }) => {
  const trialId = uuidParam(params.trialId, 'trial');
  const cookId = uuidParam(params.cookId, 'cook');
  await correctCook(actor, trialId, cookId, await body(correctCookSchema));
  return json({ ok: true });
});
