import { z } from 'zod';
import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { importMeasurementsCsv } from '@/lib/trials/csv';

export const dynamic = 'force-dynamic';

const bodySchema = z.object({ csv: z.string().min(1, 'Send the CSV text.').max(2_000_000, 'At most 2 MB.') }).strict();

/** All-or-nothing: 422 lists every bad cell as "row N, column" and imports nothing. */
export const POST = apiRoute<{ trialId: string }>('trials.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.trialId, 'trial');
  return json(await importMeasurementsCsv(actor, id, (await body(bodySchema)).csv), 201);
});
