import { apiRoute, json } from '@/lib/api/route';
import { familyModelOrNotFound } from '@/lib/modelling/queries';
import { predictFamily } from '@/lib/modelling/predict';
import { familyParam } from '@/lib/modelling/respond';
import { predictRequestSchema } from '@/lib/modelling/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ family: string }>('models.read', async ({ actor, params, body }) => {
  const family = familyParam(params.family);
  const request = await body(predictRequestSchema);
  const model = await familyModelOrNotFound(actor, family, request.options);
  return json({ factors: model.factors, predictions: predictFamily(model, request.point) });
});
