import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { authorize } from '@/lib/permissions';
import { trialCosts } from '@/lib/costs/queries';
import { costQuerySchema } from '@/lib/costs/schema';

export const dynamic = 'force-dynamic';

/** Each variant's cost on a day (?asOf=YYYY-MM-DD, default today): trials and prices both. */
export const GET = apiRoute<{ trialId: string }>('prices.read', async ({ actor, req, params }) => {
  authorize(actor, 'trials.read');
  const query = costQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return json({ costs: await trialCosts(actor, uuidParam(params.trialId, 'trial'), query.asOf) });
});
