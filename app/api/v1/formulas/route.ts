import { apiRoute, json } from '@/lib/api/route';
import { listFormulas } from '@/lib/formulas/queries';
import { createFormula } from '@/lib/formulas/mutations';
import { createFormulaSchema } from '@/lib/formulas/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('formulas.read', async ({ actor, req }) => {
  const q = new URL(req.url).searchParams.get('q') ?? undefined;
  return json({ formulas: await listFormulas(actor, { q: q?.slice(0, 100) }) });
});

export const POST = apiRoute('formulas.write', async ({ actor, body }) => json(await createFormula(actor, await body(createFormulaSchema)), 201));
