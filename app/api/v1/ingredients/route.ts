import { apiRoute, json } from '@/lib/api/route';
import { listIngredients } from '@/lib/ingredients/queries';
import { createIngredient } from '@/lib/ingredients/mutations';
import { ingredientInputSchema, ingredientListQuerySchema } from '@/lib/ingredients/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('ingredients.read', async ({ actor, req }) => {
  const query = ingredientListQuerySchema.parse(Object.fromEntries(new URL(req.url).searchParams));
  return json({ ingredients: await listIngredients(actor, query) });
});

export const POST = apiRoute('ingredients.write', async ({ actor, body }) =>
  json(await createIngredient(actor, await body(ingredientInputSchema)), 201),
);
