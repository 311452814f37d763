import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { loadTrial } from '@/lib/trials/access';
import { listPanelSessions } from '@/lib/panels/queries';
import { createPanelSession } from '@/lib/panels/mutations';
import { createPanelSchema } from '@/lib/panels/schema';

export const dynamic = 'force-dynamic';

type Params = { trialId: string };

export const GET = apiRoute<Params>('panels.read', async ({ actor, params }) => {
  const trial = await loadTrial(actor, uuidParam(params.trialId, 'trial'));
  return json({ sessions: await listPanelSessions(actor, trial.id) });
});

export const POST = apiRoute<Params>('panels.run', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  return json(await createPanelSession(actor, id, await body(createPanelSchema)), 201);
});
