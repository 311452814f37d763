import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { listRevisions } from '@/lib/formulas/queries';
import { reviseFormula } from '@/lib/formulas/mutations';
import { reviseFormulaSchema } from '@/lib/formulas/schema';

export const dynamic = 'force-dynamic';

type Params = { formulaId: string };

export const GET = apiRoute<Params>('formulas.read', async ({ actor, params }) =>
  json({ revisions: await listRevisions(actor, uuidParam(params.formulaId, 'formula')) }),
);

/** Saves a new revision; 409 when baseRevision is not the latest (unless force is true). */
export const POST = apiRoute<Params>('formulas.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.formulaId, 'formula');
  return json(await reviseFormula(actor, id, await body(reviseFormulaSchema)), 201);
});
