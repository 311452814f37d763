import { apiRoute, uuidParam } from '@/lib/api/route';
import { exportTrialCsv } from '@/lib/trials/csv';
import { csvResponse } from '@/lib/csv';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ trialId: string }>('trials.read', async ({ actor, params }) => {
  const { filename, csv } = await exportTrialCsv(actor, uuidParam(params.trialId, 'trial'));
  return csvResponse(csv, filename);
});
