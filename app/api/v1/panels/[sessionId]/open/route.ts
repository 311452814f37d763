import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { openPanelSession } from '@/lib/panels/mutations';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ sessionId: string }>('panels.run', async ({ actor, params }) =>
  json(await openPanelSession(actor, uuidParam(params.sessionId, 'tasting'))),
);
