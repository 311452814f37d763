import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { openUpload } from '@/lib/uploads/queries';
import { deleteUpload } from '@/lib/uploads/mutations';

export const dynamic = 'force-dynamic';

type Params = { uploadId: string };

/** The original bytes, proxied so the bucket stays private and the trial's authorisation applies. */
export const GET = apiRoute<Params>('trials.read', async ({ actor, params }) => {
  const { body, headers } = await openUpload(actor, uuidParam(params.uploadId, 'upload'), 'original');
  return new Response(body, { status: 200, headers });
});

export const DELETE = apiRoute<Params>('trials.write', async ({ actor, params }) => {
  await deleteUpload(actor, uuidParam(params.uploadId, 'upload'));
  return json({ ok: true });
});
