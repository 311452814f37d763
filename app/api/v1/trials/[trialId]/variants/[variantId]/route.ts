import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { removeVariant } from '@/lib/trials/mutations';

export const dynamic = 'force-dynamic';

/** Removes a variant from the trial (kept on record with its cooks); the base cannot be removed (409). */
export const DELETE = apiRoute<{ trialId: string; variantId: string }>('trials.write', async ({ actor, params }) => {
  await removeVariant(actor, uuidParam(params.trialId, 'trial'), uuidParam(params.variantId, 'variant'));
  return json({ ok: true });
});
