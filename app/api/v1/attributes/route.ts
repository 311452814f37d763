import { apiRoute, json } from '@/lib/api/route';
import { listAttributes } from '@/lib/panels/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('panels.read', async ({ actor }) => json({ attributes: await listAttributes(actor) }));
