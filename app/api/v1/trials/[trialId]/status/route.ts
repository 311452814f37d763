import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { transitionTrial } from '@/lib/trials/mutations';
import { transitionSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

/** Moves the trial to another status; 409 when that move is not allowed from where it stands. */
export const POST = apiRoute<{ trialId: string }>('trials.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  const change = await body(transitionSchema);
  await transitionTrial(actor, id, change.to, change.note);
  return json({ ok: true, status: change.to });
});
