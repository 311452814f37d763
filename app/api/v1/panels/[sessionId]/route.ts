import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getPanelSession } from '@/lib/panels/queries';

export const dynamic = 'force-dynamic';

/** The session with live progress per seat; poll it (it holds no state in the app process). */
export const GET = apiRoute<{ sessionId: string }>('panels.read', async ({ actor, params }) =>
  json({ session: await getPanelSession(actor, uuidParam(params.sessionId, 'tasting')) }),
);
