import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { listVariants } from '@/lib/trials/queries';
import { loadTrial } from '@/lib/trials/access';
import { addVariant } from '@/lib/trials/mutations';
import { manualVariantSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

type Params = { trialId: string };

export const GET = apiRoute<Params>('trials.read', async ({ actor, params }) => {
  const trial = await loadTrial(actor, uuidParam(params.trialId, 'trial'));
  return json({ variants: await listVariants(actor, trial.id) });
});

export const POST = apiRoute<Params>('trials.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  return json(await addVariant(actor, id, await body(manualVariantSchema)), 201);
});
