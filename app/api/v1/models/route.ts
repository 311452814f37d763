import { apiRoute, json } from '@/lib/api/route';
import { listFamilies } from '@/lib/modelling/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('models.read', async ({ actor }) => json({ families: await listFamilies(actor) }));
