import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getTrialComparison } from '@/lib/results/trial-comparison';

export const dynamic = 'force-dynamic';

/** Variants side by side: factor levels, predicted chemistry, lab values, tasting verdicts, factor effects, correlations. */
export const GET = apiRoute<{ trialId: string }>('tastings.read', async ({ actor, params }) =>
  json({ comparison: await getTrialComparison(actor, uuidParam(params.trialId, 'trial')) }),
);
