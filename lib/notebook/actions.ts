'use server';

import { revalidatePath } from 'next/cache';
import { runAction } from '@/lib/actions';
import { resolveNotebookConflictSchema, saveNotebookSchema } from './schema';
import { resolveConflict, saveEntry } from './mutations';
import { getEntry } from './queries';

/** Autosave from the editor. A stale base version is not an error: the result says 'conflict' and the save is kept beside the entry. */
export async function saveNotebookAction(input: unknown) {
  return runAction('trials.write', saveNotebookSchema, input, saveEntry);
}

/** Resolves one kept conflict and returns the entry as it now is, so the editor reloads from it. */
export async function resolveNotebookConflictAction(input: unknown) {
  const result = await runAction('trials.write', resolveNotebookConflictSchema, input, async (actor, data) => {
    const resolution = await resolveConflict(actor, data);
    return { ...resolution, entry: await getEntry(actor, resolution.trialId, resolution.variantId) };
  });
  if (result.ok) revalidatePath(`/trials/${result.data.trialId}`, 'layout');
  return result;
}
