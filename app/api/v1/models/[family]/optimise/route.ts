import { apiRoute, json } from '@/lib/api/route';
import { authorize } from '@/lib/permissions';
import { baseFormulaOfFamily, familyModelOrNotFound, proposalCostingOf } from '@/lib/modelling/queries';
import { optimiseFamily } from '@/lib/modelling/optimise';
import { baseFormulaSources } from '@/lib/modelling/proposals';
import { familyParam } from '@/lib/modelling/respond';
import { optimiseRequestSchema } from '@/lib/modelling/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ family: string }>('models.read', async ({ actor, params, body }) => {
  const family = familyParam(params.family);
  const request = await body(optimiseRequestSchema);
  const ceiling = request.constraints?.costCeilingPerJarMinor;
  // A cost ceiling is about prices: it follows prices.read, as the Propose screen's field does.
  if (ceiling !== undefined) authorize(actor, 'prices.read');
  const [model, base, costing] = await Promise.all([
    familyModelOrNotFound(actor, family, request.options),
    request.baseFormulaId ? baseFormulaOfFamily(actor, family, request.baseFormulaId) : null,
    request.baseFormulaId && ceiling !== undefined ? proposalCostingOf(actor, request.baseFormulaId) : null,
  ]);
  return json(optimiseFamily(model, request, base ? baseFormulaSources(base, ceiling === undefined ? undefined : { costing, perJarMinor: ceiling }) : undefined));
});
