import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { listUploads } from '@/lib/uploads/queries';
import { createUpload } from '@/lib/uploads/mutations';
import { readUploadForm } from '@/lib/uploads/multipart';
import { uploadListQuerySchema } from '@/lib/uploads/schema';

export const dynamic = 'force-dynamic';

type Params = { trialId: string };

export const GET = apiRoute<Params>('trials.read', async ({ actor, params, req }) => {
  const trialId = uuidParam(params.trialId, 'trial');
  const query = uploadListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return json({ uploads: await listUploads(actor, trialId, query) });
});

/** multipart/form-data: file, and optionally variantId, cookId, subject. The type is read from the bytes. */
export const POST = apiRoute<Params>('trials.write', async ({ actor, params, req }) => {
  const trialId = uuidParam(params.trialId, 'trial');
  const { file, fields } = await readUploadForm(req);
  const upload = await createUpload(actor, { trialId, variantId: fields.variantId, cookId: fields.cookId, subject: fields.subject, file });
  return json({ upload }, 201);
});
