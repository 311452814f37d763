import { apiRoute, json } from '@/lib/api/route';
import { importPricesCsv } from '@/lib/pricing/csv';
import { priceImportSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute('prices.write', async ({ actor, body }) => json(await importPricesCsv(actor, (await body(priceImportSchema)).csv), 201));
