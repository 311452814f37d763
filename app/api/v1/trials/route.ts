import { apiRoute, json } from '@/lib/api/route';
import { listTrials } from '@/lib/trials/queries';
import { createTrial } from '@/lib/trials/mutations';
import { createTrialSchema, trialListQuerySchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('trials.read', async ({ actor, req }) => {
  const query = trialListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return json({ trials: await listTrials(actor, query) });
});

export const POST = apiRoute('trials.write', async ({ actor, body }) => json(await createTrial(actor, await body(createTrialSchema)), 201));
