/** The stateless batch calculator behind POST /api/v1/calc/batch. */
import { ValidationFailed, type FieldErrors } from '@/lib/errors';
import type { BatchComputation, IngredientComposition } from '@/lib/chemistry';
import { compositionOf, compositionOfView, ingredientsByIds } from '@/lib/ingredients/queries';
import type { Actor } from '@/lib/permissions';
import { chemistryFieldPath, computeFormula, normaliseQuantity } from './compute';
import type { CalcBatchInput } from './schema';

const UNKNOWN_SUGARS = { sucroseG: null, glucoseG: null, fructoseG: null };

export async function calculateBatch(actor: Actor, input: CalcBatchInput): Promise<{ computation: BatchComputation }> {
  const library = await ingredientsByIds(actor, input.lines.flatMap((l) => (l.ingredientId ? [l.ingredientId] : [])));
  const fields: FieldErrors = {};
  const lines = input.lines.map((l, i) => {
    let ingredient: IngredientComposition | undefined;
    if (l.ingredientId) {
      const found = library.get(l.ingredientId);
      ingredient = found && compositionOfView(found);
      if (!ingredient) fields[`lines.${i}.ingredientId`] = ['No such ingredient in this workspace’s library.'];
    } else {
      // An ingredient of the request's own: its sugars are those of its label data, unknown without it.
      const own = l.ingredient!;
      ingredient = compositionOf(own, own.labelData?.nutrients ?? UNKNOWN_SUGARS);
    }
    return { ingredient: ingredient!, ...normaliseQuantity(l.quantity, l.unit) };
  });
  if (Object.keys(fields).length) throw new ValidationFailed('Some lines are not valid.', fields);
  const outcome = computeFormula(input.settings, lines);
  if (!outcome.ok) throw new ValidationFailed(outcome.message, { [chemistryFieldPath(outcome.field)]: [outcome.message] });
  return { computation: outcome.computation };
}
