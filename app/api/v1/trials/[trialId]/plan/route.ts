import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { planVariants } from '@/lib/trials/mutations';
import { planSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ trialId: string }>('trials.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  return json(await planVariants(actor, id, await body(planSchema)), 201);
});
