import { apiRoute } from '@/lib/api/route';
import { csvResponse } from '@/lib/csv';
import { todayIso } from '@/lib/format/dates';
import { familyDataset } from '@/lib/modelling/queries';
import { datasetCsv, exportName } from '@/lib/modelling/export';
import { exportQuery, familyParam } from '@/lib/modelling/respond';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ family: string }>('models.read', async ({ req, actor, params }) => {
  const family = familyParam(params.family);
  const dataset = await familyDataset(actor, family, exportQuery(req).trials);
  return csvResponse(datasetCsv(dataset), exportName(dataset.family, 'data-set', todayIso()));
});
