import { apiRoute, uuidParam } from '@/lib/api/route';
import { batchesCsv } from '@/lib/production/queries';
import { csvResponse } from '@/lib/csv';

export const dynamic = 'force-dynamic';

export const GET = apiRoute<{ productId: string }>('production.read', async ({ actor, params }) => {
  const { csv, filename } = await batchesCsv(actor, uuidParam(params.productId, 'product'));
  return csvResponse(csv, filename);
});
