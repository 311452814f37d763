import { apiRoute, json } from '@/lib/api/route';
import { ApiError } from '@/lib/api/errors';
import { importIngredientsCsv } from '@/lib/ingredients/mutations';
import { importIngredientsSchema } from '@/lib/ingredients/csv';

export const dynamic = 'force-dynamic';

/**
 * All-or-nothing: 422 lists every bad cell as "row N, column" and imports nothing. A file that changes
 * ingredients already there imports nothing either until it is sent again with confirmUpdates: true
 * (409 lists each change, before → after).
 */
export const POST = apiRoute('ingredients.write', async ({ actor, body }) => {
  const input = await body(importIngredientsSchema);
  const result = await importIngredientsCsv(actor, input.csv, { confirmUpdates: input.confirmUpdates });
  if (!result.imported) {
    const fields = Object.fromEntries(result.updates.map((u) => [`row ${u.row}, ${u.name}`, u.changes.map((c) => `${c.column}: ${c.before || 'blank'} → ${c.after || 'blank'}`)]));
    throw new ApiError(409, 'confirm_updates', `Nothing was imported: ${result.updates.length} row${result.updates.length > 1 ? 's change ingredients' : ' changes an ingredient'} already in the library. Send the file again with confirmUpdates: true to apply.`, fields);
  }
  return json(result);
});
