import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { correctMeasurement } from '@/lib/trials/mutations';
import { correctMeasurementSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

/** Corrects a cook (the fields sent replace the stored ones; the old values are kept with the reason). */
export const PATCH = apiRoute<{ trialId: string; measurementId: string }>('trials.write', async ({ actor, params, body }) => {
  const trialId = uuidParam(params.trialId, 'trial');
  const measurementId = uuidParam(params.measurementId, 'cook');
  await correctMeasurement(actor, trialId, measurementId, await body(correctMeasurementSchema));
  return json({ ok: true });
});
