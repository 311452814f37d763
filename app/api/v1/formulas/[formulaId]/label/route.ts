import { apiRoute, uuidParam } from '@/lib/api/route';
import { formulaLabel } from '@/lib/label/queries';
import { labelQuerySchema } from '@/lib/label/schema';
import { labelResponse } from '@/lib/label/respond';

export const dynamic = 'force-dynamic';

/** ?reference=typical|<formula id> (the "reduced sugars" claim's reference) &format=csv|json (a download). */
export const GET = apiRoute<{ formulaId: string }>('formulas.read', async ({ actor, params, req }) => {
  const query = labelQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return labelResponse(await formulaLabel(actor, uuidParam(params.formulaId, 'formula'), query), query.format);
});
