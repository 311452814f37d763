import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { importCooksCsv } from '@/lib/trials/csv';
import { importCooksSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

/** All-or-nothing: 422 lists every bad cell as "row N, column" and imports nothing. */
export const POST = apiRoute<{ trialId: string }>('trials.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  return json(await importCooksCsv(actor, id, (await body(importCooksSchema)).csv), 201);
});
