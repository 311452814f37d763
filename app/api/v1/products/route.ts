import { apiRoute, json } from '@/lib/api/route';
import { listProducts } from '@/lib/production/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('production.read', async ({ actor }) => json({ products: await listProducts(actor) }));
