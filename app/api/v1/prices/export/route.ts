import { apiRoute } from '@/lib/api/route';
import { exportPricesCsv } from '@/lib/pricing/csv';
import { csvResponse } from '@/lib/csv';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('prices.read', async ({ actor }) => {
  const { filename, csv } = await exportPricesCsv(actor);
  return csvResponse(csv, filename);
});
