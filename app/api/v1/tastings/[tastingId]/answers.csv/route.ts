import { apiRoute, uuidParam } from '@/lib/api/route';
import { answersCsv } from '@/lib/results/queries';
import { csvResponse } from '@/lib/csv';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ tastingId: string }>('tastings.read', async ({ actor, params }) =>
  csvResponse(await answersCsv(actor, uuidParam(params.tastingId, 'tasting')), 'answers.csv'),
);
