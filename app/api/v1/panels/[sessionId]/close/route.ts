import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { closePanelSession } from '@/lib/panels/mutations';

export const dynamic = 'force-dynamic';

/** Locks the answers. The response says how many seats had not submitted (they stay, marked partial). */
export const POST = apiRoute<{ sessionId: string }>('panels.run', async ({ actor, params }) =>
  json(await closePanelSession(actor, uuidParam(params.sessionId, 'tasting'))),
);
