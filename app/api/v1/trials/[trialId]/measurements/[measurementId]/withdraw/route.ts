import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { withdrawMeasurement } from '@/lib/trials/mutations';
import { withdrawMeasurementSchema } from '@/lib/trials/schema';

export const dynamic = 'force-dynamic';

/** Withdraws a cook with a reason: it stays on record, out of every comparison and the promotion evidence. */
export const POST = apiRoute<{ trialId: string; measurementId: string }>('trials.write', async ({ actor, params, body }) => {
  const trialId = uuidParam(params.trialId, 'trial');
  const measurementId = uuidParam(params.measurementId, 'cook');
  await withdrawMeasurement(actor, trialId, measurementId, (await body(withdrawMeasurementSchema)).reason);
  return json({ ok: true });
});
