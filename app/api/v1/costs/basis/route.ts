import { apiRoute, json } from '@/lib/api/route';
import { editorCostBasis } from '@/lib/costs/queries';
import { costQuerySchema } from '@/lib/costs/schema';

export const dynamic = 'force-dynamic';

/** The prices on one day that the formula editor costs with (?asOf=YYYY-MM-DD, default today). */
export const GET = apiRoute('prices.read', async ({ actor, req }) => {
  const query = costQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return json({ basis: await editorCostBasis(actor, query.asOf) });
});
