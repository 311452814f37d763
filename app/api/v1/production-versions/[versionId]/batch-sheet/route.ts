import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getBatchSheet } from '@/lib/production/queries';
import { batchSheetQuerySchema } from '@/lib/production/schema';

export const dynamic = 'force-dynamic';

/** ?target=total_charge|finished_mass|jar_count&amount=50&unit=kg&step=5&stepUnit=g&altitudeM=350 */
export const GET = apiRoute<{ versionId: string }>('production.read', async ({ actor, params, req }) => {
  const id = uuidParam(params.versionId, 'production version');
  const query = batchSheetQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return json({ sheet: (await getBatchSheet(actor, id, query)).sheet });
});
