import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { recommendVariant } from '@/lib/results/mutations';
import { recommendationSchema } from '@/lib/results/schema';

export const dynamic = 'force-dynamic';

export const PUT = apiRoute<{ trialId: string }>('trials.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  await recommendVariant(actor, id, await body(recommendationSchema));
  return json({ ok: true });
});
