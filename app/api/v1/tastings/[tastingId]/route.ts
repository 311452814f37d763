import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getTasting } from '@/lib/tastings/queries';
import { discardTasting, updateTasting } from '@/lib/tastings/mutations';
import { createTastingSchema } from '@/lib/tastings/schema';

export const dynamic = 'force-dynamic';

type Params = { tastingId: string };

/** The session with live progress per seat; poll it (it holds no state in the app process). */
export const GET = apiRoute<Params>('tastings.read', async ({ actor, params }) =>
  json({ session: await getTasting(actor, uuidParam(params.tastingId, 'tasting')) }),
);

/** Replaces the set-up of a tasting that is still being set up (409 once it has opened). */
export const PATCH = apiRoute<Params>('tastings.run', async ({ actor, params, body }) => {
  const id = uuidParam(params.tastingId, 'tasting');
  await updateTasting(actor, id, await body(createTastingSchema));
  return json({ ok: true });
});

/** Discards a tasting that never opened (409 once it has). */
export const DELETE = apiRoute<Params>('tastings.run', async ({ actor, params }) => json(await discardTasting(actor, uuidParam(params.tastingId, 'tasting'))));
