import { apiRoute, uuidParam } from '@/lib/api/route';
import { summaryCsv } from '@/lib/results/queries';
import { csvResponse } from '@/lib/csv';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ sessionId: string }>('panels.read', async ({ actor, params }) =>
  csvResponse(await summaryCsv(actor, uuidParam(params.sessionId, 'tasting')), 'summary.csv'),
);
