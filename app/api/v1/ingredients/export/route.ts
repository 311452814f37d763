import { apiRoute } from '@/lib/api/route';
import { listIngredients } from '@/lib/ingredients/queries';
import { ingredientListQuerySchema } from '@/lib/ingredients/schema';
import { csvResponse } from '@/lib/csv';
import { ingredientsToCsv } from '@/lib/ingredients/csv';
import { todayIso } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('ingredients.read', async ({ actor, req }) => {
  const query = ingredientListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  const rows = await listIngredients(actor, query);
  const csv = ingredientsToCsv(rows);
  return csvResponse(csv, `ingredients-${todayIso()}.csv`);
});
