import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getBatch } from '@/lib/production/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ batchId: string }>('production.read', async ({ actor, params }) => json(await getBatch(actor, uuidParam(params.batchId, 'batch'))));
