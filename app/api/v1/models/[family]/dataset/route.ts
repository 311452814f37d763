import { apiRoute, json } from '@/lib/api/route';
import { familyDataset } from '@/lib/modelling/queries';
import { exportQuery, familyParam } from '@/lib/modelling/respond';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ family: string }>('models.read', async ({ req, actor, params }) => {
  const family = familyParam(params.family);
  return json(await familyDataset(actor, family, exportQuery(req).trials));
});
