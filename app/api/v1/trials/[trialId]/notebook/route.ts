import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getEntry } from '@/lib/notebook/queries';
import { loadTrial } from '@/lib/trials/access';
import { saveEntry } from '@/lib/notebook/mutations';
import { notebookQuerySchema, saveNotebookBodySchema } from '@/lib/notebook/schema';

export const dynamic = 'force-dynamic';

type Params = { trialId: string };

/** The trial's own entry, or a variant's (query: variantId), with unresolved conflicts. */
export const GET = apiRoute<Params>('trials.read', async ({ req, actor, params }) => {
  const trialId = uuidParam(params.trialId, 'trial');
  const { variantId } = notebookQuerySchema.parse({ variantId: new URL(req.url).searchParams.get('variantId') || null });
  return json({ entry: await getEntry(actor, trialId, variantId) });
});

/** Saves the entry; 409 when baseVersion is stale, with the incoming document kept as a conflict. */
export const PUT = apiRoute<Params>('trials.write', async ({ actor, params, body }) => {
  const trialId = uuidParam(params.trialId, 'trial');
  // 404 before 422: another workspace's trial must not reveal whether the body was valid.
  await loadTrial(actor, trialId);
  const result = await saveEntry(actor, { trialId, ...(await body(saveNotebookBodySchema)) });
  if (result.status === 'conflict') {
    const conflict = { version: result.version, conflictId: result.conflictId, current: result.current };
    return json(
      {
        error: {
          code: 'conflict',
          message: 'Someone else saved this entry after the version you started from. Your version is kept beside theirs; nothing is lost.',
          conflict,
        },
      },
      409,
    );
  }
  return json(result);
});
