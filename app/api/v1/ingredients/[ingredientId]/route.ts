import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { getIngredient } from '@/lib/ingredients/queries';
import { setIngredientArchived, updateIngredient } from '@/lib/ingredients/mutations';
import { ingredientInputSchema } from '@/lib/ingredients/schema';

export const dynamic = 'force-dynamic';

type Params = { ingredientId: string };

export const GET = apiRoute<Params>('ingredients.read', async ({ actor, params }) =>
  json({ ingredient: await getIngredient(actor, uuidParam(params.ingredientId, 'ingredient')) }),
);

/** Replaces the ingredient's values (send them all). A typical value becomes the workspace's edited value. */
export const PATCH = apiRoute<Params>('ingredients.write', async ({ actor, params, body }) => {
  const id = uuidParam(params.ingredientId, 'ingredient');
  return json(await updateIngredient(actor, id, await body(ingredientInputSchema)));
});

/** Archives: old revisions keep their snapshot, new lines cannot use it. Nothing is deleted. */
export const DELETE = apiRoute<Params>('ingredients.write', async ({ actor, params }) => {
  await setIngredientArchived(actor, uuidParam(params.ingredientId, 'ingredient'), true);
  return json({ ok: true, archived: true });
});
