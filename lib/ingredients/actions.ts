'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { ingredientInputSchema } from './schema';
import { createIngredient, importIngredientsCsv, updateIngredient, setIngredientArchived } from './mutations';
import { importIngredientsSchema } from './csv';

/** Creates when ingredientId is null, otherwise updates that ingredient of the workspace. */
export async function saveIngredientAction(ingredientId: unknown, input: unknown) {
  const schema = z.object({ ingredientId: z.uuid('Unknown ingredient.').nullable(), data: ingredientInputSchema });
  const result = await runAction('ingredients.write', schema, { ingredientId, data: input }, (actor, d) =>
    d.ingredientId ? updateIngredient(actor, d.ingredientId, d.data) : createIngredient(actor, d.data),
  );
  if (result.ok) revalidatePath('/ingredients');
  return result;
}

export async function archiveIngredientAction(ingredientId: unknown, archived: unknown) {
  const schema = z.object({ ingredientId: z.uuid('Unknown ingredient.'), archived: z.boolean() });
  const result = await runAction('ingredients.write', schema, { ingredientId, archived }, (actor, d) => setIngredientArchived(actor, d.ingredientId, d.archived));
  if (result.ok) revalidatePath('/ingredients');
  return result;
}

/** All-or-nothing import of the library's CSV (the export's columns); every bad cell comes back as "row N, column". */
export async function importIngredientsAction(csv: unknown, confirmUpdates?: unknown) {
  const result = await runAction('ingredients.write', importIngredientsSchema, { csv, confirmUpdates }, (actor, d) => importIngredientsCsv(actor, d.csv, { confirmUpdates: d.confirmUpdates }));
  if (result.ok) revalidatePath('/ingredients');
  return result;
}
