import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { openTasting } from '@/lib/tastings/mutations';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ tastingId: string }>('tastings.run', async ({ actor, params }) =>
  json(await openTasting(actor, uuidParam(params.tastingId, 'tasting'))),
);
