import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { costSettings, ingredientPriceDetail } from '@/lib/pricing/queries';

export const dynamic = 'force-dynamic';

/** An ingredient's whole price history, withdrawn points included (with who and why). */
export const GET = apiRoute<{ ingredientId: string }>('prices.read', async ({ actor, params }) => {
  const detail = await ingredientPriceDetail(actor, uuidParam(params.ingredientId, 'ingredient'));
  return json({ currency: (await costSettings(actor.workspaceId)).currency, ...detail });
});
