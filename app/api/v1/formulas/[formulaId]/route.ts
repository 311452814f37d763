import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getFormula } from '@/lib/formulas/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ formulaId: string }>('formulas.read', async ({ actor, params }) =>
  json({ formula: await getFormula(actor, uuidParam(params.formulaId, 'formula')) }),
);
