import { apiRoute, json } from '@/lib/api/route';
import { importIngredientsCsv } from '@/lib/ingredients/mutations';
import { importIngredientsSchema } from '@/lib/ingredients/csv';

export const dynamic = 'force-dynamic';

/** All-or-nothing: 422 lists every bad cell as "row N, column" and imports nothing. */
export const POST = apiRoute('ingredients.write', async ({ actor, body }) =>
  json(await importIngredientsCsv(actor, (await body(importIngredientsSchema)).csv)),
);
