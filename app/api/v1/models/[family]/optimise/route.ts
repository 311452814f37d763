import { apiRoute, json } from '@/lib/api/route';
import { baseFormulaOfFamily, familyModelOrNotFound } from '@/lib/modelling/queries';
import { optimiseFamily } from '@/lib/modelling/optimise';
import { baseFormulaSources } from '@/lib/modelling/proposals';
import { familyParam } from '@/lib/modelling/respond';
import { optimiseRequestSchema } from '@/lib/modelling/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ family: string }>('models.read', async ({ actor, params, body }) => {
  const family = familyParam(params.family);
  const request = await body(optimiseRequestSchema);
  const [model, base] = await Promise.all([
    familyModelOrNotFound(actor, family, request.options),
    request.baseFormulaId ? baseFormulaOfFamily(actor, family, request.baseFormulaId) : null,
  ]);
  return json(optimiseFamily(model, request, base ? baseFormulaSources(base) : undefined));
});
