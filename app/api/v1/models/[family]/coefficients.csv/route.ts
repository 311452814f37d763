import { apiRoute } from '@/lib/api/route';
import { csvResponse } from '@/lib/csv';
import { todayIso } from '@/lib/format/dates';
import { responseFits } from '@/lib/modelling/queries';
import { coefficientsCsv, exportName } from '@/lib/modelling/export';
import { exportQuery, familyParam } from '@/lib/modelling/respond';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ family: string }>('models.read', async ({ req, actor, params }) => {
  const family = familyParam(params.family);
  const query = exportQuery(req);
  const { dataset, models } = await responseFits(actor, family, { response: query.response, kind: query.kind, trialIds: query.trials });
  return csvResponse(coefficientsCsv(models), exportName(dataset.family, 'coefficients', todayIso()));
});
