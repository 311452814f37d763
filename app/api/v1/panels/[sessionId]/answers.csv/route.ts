import { apiRoute, uuidParam } from '@/lib/api/route';
import { answersCsv } from '@/lib/results/queries';
import { csvResponse } from '@/lib/csv';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ sessionId: string }>('panels.read', async ({ actor, params }) =>
  csvResponse(await answersCsv(actor, uuidParam(params.sessionId, 'tasting')), 'answers.csv'),
);
