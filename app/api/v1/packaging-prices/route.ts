import { apiRoute, json } from '@/lib/api/route';
import { addPackagingPrice } from '@/lib/pricing/mutations';
import { packagingPriceSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute('prices.write', async ({ actor, body }) => json(await addPackagingPrice(actor, await body(packagingPriceSchema)), 201));
