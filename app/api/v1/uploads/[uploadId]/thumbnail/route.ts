import { apiRoute, uuidParam } from '@/lib/api/route';
import { openUpload } from '@/lib/uploads/queries';

export const dynamic = 'force-dynamic';

type Params = { uploadId: string };

/** The WebP thumbnail of a photo (no metadata); 404 for files, which have none. */
export const GET = apiRoute<Params>('trials.read', async ({ actor, params }) => {
  const { body, headers } = await openUpload(actor, uuidParam(params.uploadId, 'upload'), 'thumbnail');
  return new Response(body, { status: 200, headers });
});
