import { apiRoute, json } from '@/lib/api/route';
import { listAttributes } from '@/lib/tastings/queries';
import { createAttribute } from '@/lib/tastings/mutations';
import { createAttributeSchema } from '@/lib/tastings/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('tastings.read', async ({ actor }) => json({ attributes: await listAttributes(actor) }));

export const POST = apiRoute('tastings.run', async ({ actor, body }) => json(await createAttribute(actor, await body(createAttributeSchema)), 201));
