import { apiRoute, uuidParam } from '@/lib/api/route';
import { versionLabel } from '@/lib/label/queries';
import { labelQuerySchema } from '@/lib/label/schema';
import { labelResponse } from '@/lib/label/respond';

export const dynamic = 'force-dynamic';

/** The label frozen at approval (or computed now for older versions). ?format=csv|json */
export const GET = apiRoute<{ versionId: string }>('production.read', async ({ actor, params, req }) => {
  const query = labelQuerySchema.omit({ reference: true }).parse(Object.fromEntries(new URL(req.url).searchParams));
  return labelResponse(await versionLabel(actor, uuidParam(params.versionId, 'production version')), query.format);
});
