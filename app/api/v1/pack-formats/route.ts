import { apiRoute, json } from '@/lib/api/route';
import { packFormatList } from '@/lib/pricing/queries';
import { createPackFormat } from '@/lib/pricing/mutations';
import { packFormatSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('prices.read', async ({ actor }) => json({ packFormats: await packFormatList(actor) }));

export const POST = apiRoute('prices.write', async ({ actor, body }) => json(await createPackFormat(actor, await body(packFormatSchema)), 201));
