import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { listVariants } from '@/lib/trials/queries';
import { loadTrial } from '@/lib/trials/access';
import { recordCook } from '@/lib/trials/mutations';
import { cookSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

type Params = { trialId: string };

/** Every cook of the trial, each with its predicted-against-measured comparison. */
export const GET = apiRoute<Params>('trials.read', async ({ actor, params }) => {
  const trial = await loadTrial(actor, uuidParam(params.trialId, 'trial'));
  const variants = await listVariants(actor, trial.id);
  return json({ cooks: variants.flatMap((v) => v.cooks.map((m) => ({ ...m, variantLabel: v.label }))) });
});

export const POST = apiRoute<Params>('trials.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  return json(await recordCook(actor, id, await body(cookSchema)), 201);
});
