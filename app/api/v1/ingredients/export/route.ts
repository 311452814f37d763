import { apiRoute } from '@/lib/api/route';
import { listIngredients } from '@/lib/ingredients/queries';
import { ingredientListQuerySchema } from '@/lib/ingredients/schema';
import { csvResponse, toCsv } from '@/lib/csv';
import { todayIso } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('ingredients.read', async ({ actor, req }) => {
  const query = ingredientListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  const rows = await listIngredients(actor, query);
  const csv = toCsv(rows, [
    { header: 'name', value: (r) => r.name },
    { header: 'kind', value: (r) => r.kind },
    { header: 'soluble_solids_pct', value: (r) => r.solidsPct },
    { header: 'ph_min', value: (r) => r.phMin },
    { header: 'ph_max', value: (r) => r.phMax },
    { header: 'acid_pct_as_citric', value: (r) => r.acidPct },
    { header: 'pectin_level', value: (r) => r.pectinLevel },
    { header: 'pectin_type', value: (r) => r.pectinType },
    { header: 'pectin_grade', value: (r) => r.pectinGrade },
    { header: 'sweetener_type', value: (r) => r.sweetenerType },
    { header: 'acid_type', value: (r) => r.acidType },
    { header: 'eu_fruit_group', value: (r) => r.euFruitGroup },
    { header: 'us_fruit_group', value: (r) => r.usFruitGroup },
    { header: 'calcium_source', value: (r) => (r.calciumSource ? 'yes' : '') },
    { header: 'origin', value: (r) => r.origin },
    { header: 'source', value: (r) => r.source },
    { header: 'updated_at', value: (r) => r.updatedAt },
  ]);
  return csvResponse(csv, `ingredients-${todayIso()}.csv`);
});
