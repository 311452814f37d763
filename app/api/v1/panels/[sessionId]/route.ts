import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getPanelSession } from '@/lib/panels/queries';
import { discardPanelSession, updatePanelSession } from '@/lib/panels/mutations';
import { createPanelSchema } from '@/lib/panels/schema';

export const dynamic = 'force-dynamic';

type Params = { sessionId: string };

/** The session with live progress per seat; poll it (it holds no state in the app process). */
export const GET = apiRoute<Params>('panels.read', async ({ actor, params }) =>
  json({ session: await getPanelSession(actor, uuidParam(params.sessionId, 'tasting')) }),
);

/** Replaces the set-up of a tasting that is still being set up (409 once it has opened). */
export const PATCH = apiRoute<Params>('panels.run', async ({ actor, params, body }) => {
  const id = uuidParam(params.sessionId, 'tasting');
  await updatePanelSession(actor, id, await body(createPanelSchema));
  return json({ ok: true });
});

/** Discards a tasting that never opened (409 once it has). */
export const DELETE = apiRoute<Params>('panels.run', async ({ actor, params }) => json(await discardPanelSession(actor, uuidParam(params.sessionId, 'tasting'))));
