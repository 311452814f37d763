import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { loadTrial } from '@/lib/trials/access';
import { listTrialTastings } from '@/lib/tastings/queries';
import { createTasting } from '@/lib/tastings/mutations';
import { createTastingSchema } from '@/lib/tastings/schema';

export const dynamic = 'force-dynamic';

type Params = { trialId: string };

export const GET = apiRoute<Params>('tastings.read', async ({ actor, params }) => {
  const trial = await loadTrial(actor, uuidParam(params.trialId, 'trial'));
  return json({ sessions: await listTrialTastings(actor, trial.id) });
});

export const POST = apiRoute<Params>('tastings.run', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  return json(await createTasting(actor, id, await body(createTastingSchema)), 201);
});
