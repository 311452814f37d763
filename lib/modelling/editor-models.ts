import 'server-only';
/**
 * The models the formula editor predicts from: every product family's default fit, read once with the
 * page so the editor predicts in the browser without a request per keystroke. The formula's family
 * can change while it is typed (another fruit, another product class), so all families come along;
 * a workspace has a handful. Each is cut to what a prediction needs (editorModelOf).
 *
 * Reading every family's data set and fitting it costs far more than the rest of the page, and the
 * data change only with a cook, an answer or a revised variant. So the fits are kept per workspace
 * under modelDataVersion(), a fingerprint of those rows: a page load costs one fingerprint query, and the first
 * load after any change refits. Concurrent loads share one fit.
 */
import { familyModel, listFamilies, modelDataVersion } from './queries';
import { editorModelOf } from './editor-predictions';
import type { EditorFamilyModel, FamilyModel } from './schema';
import type { Actor } from '@/lib/permissions';

/** Families past this many are left out of the editor (the most-tried first). */
const MAX_EDITOR_FAMILIES = 6;
/** Workspaces whose fits are kept; the least recently used goes first. */
const KEPT_WORKSPACES = 100;

const kept = new Map<string, { version: string; models: Promise<EditorFamilyModel[]> }>();

async function fitAll(actor: Pick<Actor, 'workspaceId'>): Promise<EditorFamilyModel[]> {
  const families = (await listFamilies(actor)).slice(0, MAX_EDITOR_FAMILIES);
  const models = await Promise.all(families.map((f) => familyModel(actor, f)));
  return models.filter((m): m is FamilyModel => m !== null && m.responses.length > 0).map(editorModelOf);
}

export async function editorModels(actor: Pick<Actor, 'workspaceId'>): Promise<EditorFamilyModel[]> {
  const version = await modelDataVersion(actor);
  const entry = kept.get(actor.workspaceId);
  kept.delete(actor.workspaceId);
  if (entry && entry.version === version) {
    kept.set(actor.workspaceId, entry);
    return entry.models;
  }
  const models = fitAll(actor);
  kept.set(actor.workspaceId, { version, models });
  const oldest = kept.keys().next();
  if (kept.size > KEPT_WORKSPACES && !oldest.done) kept.delete(oldest.value);
  // A failed fit is not kept: the next load tries again.
  models.catch(() => {
    if (kept.get(actor.workspaceId)?.models === models) kept.delete(actor.workspaceId);
  });
  return models;
}
