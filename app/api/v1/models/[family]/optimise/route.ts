import { apiRoute, json } from '@/lib/api/route';
import { familyModelOrNotFound } from '@/lib/modelling/queries';
import { optimiseFamily } from '@/lib/modelling/optimise';
import { familyParam } from '@/lib/modelling/respond';
import { optimiseRequestSchema } from '@/lib/modelling/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ family: string }>('models.read', async ({ actor, params, body }) => {
  const family = familyParam(params.family);
  const request = await body(optimiseRequestSchema);
  const model = await familyModelOrNotFound(actor, family, request.options);
  return json(optimiseFamily(model, request));
});
