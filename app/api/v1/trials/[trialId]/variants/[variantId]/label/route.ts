import { apiRoute, uuidParam } from '@/lib/api/route';
import { variantLabel } from '@/lib/label/queries';
import { labelQuerySchema } from '@/lib/label/schema';
import { labelResponse } from '@/lib/label/respond';

export const dynamic = 'force-dynamic';

/** ?reference=typical|<formula id> &format=csv|json */
export const GET = apiRoute<{ trialId: string; variantId: string }>('trials.read', async ({ actor, params, req }) => {
  const query = labelQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return labelResponse(await variantLabel(actor, uuidParam(params.trialId, 'trial'), uuidParam(params.variantId, 'variant'), query), query.format);
});
