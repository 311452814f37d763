import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getTrialOverview } from '@/lib/trials/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ trialId: string }>('trials.read', async ({ actor, params }) =>
  json({ trial: await getTrialOverview(actor, uuidParam(params.trialId, 'trial')) }),
);
