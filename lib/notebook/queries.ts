import 'server-only';
/** Reading notebook entries: always scoped to the actor's workspace and the trial (404 otherwise). */
import { getEm } from '@/lib/db';
import { NotebookConflict, NotebookEntry } from '@/entities';
import type { NotebookConflictEntity } from '@/entities/NotebookConflict';
import { inWorkspace, type Actor } from '@/lib/permissions';
import { assertVariantOfTrial, loadTrial } from '@/lib/trials/access';
import { EMPTY_NOTEBOOK_DOC } from './shape';
import { type NotebookConflictView, type NotebookEntryView } from './schema';

type ConflictRow = Pick<NotebookConflictEntity, 'id' | 'doc' | 'baseVersion' | 'createdAt'> & { savedBy: { name: string } };

/** 404 unless the trial is in the actor's workspace and, when given, the variant belongs to it. */
export async function assertNotebookScope(actor: Actor, trialId: string, variantId: string | null): Promise<void> {
  await loadTrial(actor, trialId);
  if (variantId) await assertVariantOfTrial(actor, trialId, variantId);
}

export function toConflictView(c: ConflictRow): NotebookConflictView {
  return { conflictId: c.id, doc: c.doc, baseVersion: c.baseVersion, savedByName: c.savedBy.name, createdAt: c.createdAt.toISOString() };
}

/** The entry with its unresolved conflicts, oldest first; an entry nobody wrote yet is empty at version 0. */
export async function getEntry(actor: Actor, trialId: string, variantId: string | null): Promise<NotebookEntryView> {
  await assertNotebookScope(actor, trialId, variantId);
  return readEntry(actor, trialId, variantId);
}

/**
 * getEntry without its scope check, for a caller that checks the trial itself in the same request
 * (the trial page). Still scoped to the actor's workspace.
 */
export async function readEntry(actor: Actor, trialId: string, variantId: string | null): Promise<NotebookEntryView> {
  const em = await getEm();
  const entry = await em.findOne(
    NotebookEntry,
    { ...inWorkspace(actor), trial: trialId, variantId },
    { populate: ['updatedBy'] },
  );
  if (!entry) {
    return { entryId: null, doc: structuredClone(EMPTY_NOTEBOOK_DOC), version: 0, updatedAt: null, updatedByName: null, conflicts: [] };
  }
  const conflicts = await em.find(
    NotebookConflict,
    { ...inWorkspace(actor), entry: entry.id, resolvedAt: null },
    { populate: ['savedBy'], orderBy: { createdAt: 'asc' } },
  );
  return {
    entryId: entry.id,
    doc: entry.doc,
    version: entry.version,
    // A row created only to lock it (version 0) has not really been written by anyone yet.
    updatedAt: entry.version > 0 ? entry.updatedAt.toISOString() : null,
    updatedByName: entry.updatedBy?.name ?? null,
    conflicts: conflicts.map(toConflictView),
  };
}
