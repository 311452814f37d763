import { apiRoute, json } from '@/lib/api/route';
import { listFormulas } from '@/lib/formulas/queries';
import { createFormula } from '@/lib/formulas/mutations';
import { createFormulaSchema, formulaListQuerySchema } from '@/lib/formulas/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('formulas.read', async ({ actor, req }) => {
  const query = formulaListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return json({ formulas: await listFormulas(actor, query) });
});

export const POST = apiRoute('formulas.write', async ({ actor, body }) => json(await createFormula(actor, await body(createFormulaSchema)), 201));
