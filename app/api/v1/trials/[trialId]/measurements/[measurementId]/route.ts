import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { deleteMeasurement } from '@/lib/trials/mutations';

export const dynamic = 'force-dynamic';

export const DELETE = apiRoute<{ trialId: string; measurementId: string }>('trials.write', async ({ actor, params }) => {
  await deleteMeasurement(actor, uuidParam(params.trialId, 'trial'), uuidParam(params.measurementId, 'measurement'));
  return json({ ok: true });
});
