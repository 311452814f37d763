import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getServingSheet } from '@/lib/tastings/queries';

export const dynamic = 'force-dynamic';

/** Which code is which variant, seat by seat: for the staff who run the panel only. */
export const GET = apiRoute<{ tastingId: string }>('tastings.run', async ({ actor, params }) =>
  json({ sheet: await getServingSheet(actor, uuidParam(params.tastingId, 'tasting')) }),
);
