import { apiRoute, json } from '@/lib/api/route';
import { listAttributes } from '@/lib/panels/queries';
import { createAttribute } from '@/lib/panels/mutations';
import { createAttributeSchema } from '@/lib/panels/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('panels.read', async ({ actor }) => json({ attributes: await listAttributes(actor) }));

export const POST = apiRoute('panels.run', async ({ actor, body }) => json(await createAttribute(actor, await body(createAttributeSchema)), 201));
