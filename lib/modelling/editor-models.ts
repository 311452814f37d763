/**
 * The models the formula editor predicts from: every product family's default fit, read once with the
 * page so the editor predicts in the browser without a request per keystroke. The formula's family
 * can change while it is typed (another fruit, another product class), so all families come along;
 * a workspace has a handful.
 */
import { familyModel, listFamilies } from './queries';
import type { FamilyModel } from './schema';
import type { Actor } from '@/lib/permissions';

/** Families past this many are left out of the editor (the most-tried first). */
const MAX_EDITOR_FAMILIES = 6;

export async function editorModels(actor: Actor): Promise<FamilyModel[]> {
  const families = (await listFamilies(actor)).slice(0, MAX_EDITOR_FAMILIES);
  const models = await Promise.all(families.map((f) => familyModel(actor, f)));
  return models.filter((m): m is FamilyModel => m !== null && m.responses.length > 0);
}
