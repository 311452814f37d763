import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { closeTasting } from '@/lib/tastings/mutations';

export const dynamic = 'force-dynamic';

/** Locks the answers. The response says how many seats had not submitted (they stay, marked partial). */
export const POST = apiRoute<{ tastingId: string }>('tastings.run', async ({ actor, params }) =>
  json(await closeTasting(actor, uuidParam(params.tastingId, 'tasting'))),
);
