import { apiRoute, uuidParam } from '@/lib/api/route';
import { summaryCsv } from '@/lib/results/queries';
import { isSummaryTable, SUMMARY_TABLES } from '@/lib/results/schema';
import { ApiError } from '@/lib/api/errors';
import { csvResponse } from '@/lib/csv';

export const dynamic = 'force-dynamic';

/** ?table=means (default) | anova | penalty | triangle | ranking */
export const GET = apiRoute<{ tastingId: string }>('tastings.read', async ({ actor, params, req }) => {
  const id = uuidParam(params.tastingId, 'tasting');
  const table = new URL(req.url).searchParams.get('table') ?? 'means';
  if (!isSummaryTable(table)) throw new ApiError(422, 'invalid', `table must be one of: ${SUMMARY_TABLES.join(', ')}.`, { table: ['Unknown table.'] });
  return csvResponse(await summaryCsv(actor, id, table), `${table}.csv`);
});
