import { apiRoute, json } from '@/lib/api/route';
import { costSettings, ingredientPriceList } from '@/lib/pricing/queries';
import { addIngredientPrice } from '@/lib/pricing/mutations';
import { ingredientPriceSchema, priceListQuerySchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('prices.read', async ({ actor, req }) => {
  const query = priceListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  const { currency } = await costSettings(actor.workspaceId);
  return json({ currency, prices: await ingredientPriceList(actor, query.asOf) });
});

export const POST = apiRoute('prices.write', async ({ actor, body }) => json(await addIngredientPrice(actor, await body(ingredientPriceSchema)), 201));
