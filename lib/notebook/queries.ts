import 'server-only';
/** Reading notebook entries: always scoped to the actor's workspace and the trial (404 otherwise). */
import { sql } from '@/lib/sql';
import type { NotebookConflictEntity } from '@/entities/NotebookConflict';
import type { Actor } from '@/lib/permissions';
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
  // One plain statement, the unresolved conflicts as JSON: the trial page reads it on every load.
  const [entry] = await sql<{
    id: string; doc: NotebookEntryView['doc']; version: number; updated_at: Date; updated_by_name: string | null;
    conflicts: Array<Omit<NotebookConflictView, 'createdAt'> & { createdAt: string }>;
  }>(
    `select e.id, e.doc, e.version, e.updated_at, u.name as updated_by_name,
            coalesce((select json_agg(json_build_object('conflictId', c.id, 'doc', c.doc, 'baseVersion', c.base_version, 'savedByName', su.name, 'createdAt', c.created_at) order by c.created_at, c.id)
                        from notebook_conflicts c join users su on su.id = c.saved_by_id
                       where c.entry_id = e.id and c.workspace_id = e.workspace_id and c.resolved_at is null), '[]'::json) as conflicts
       from notebook_entries e left join users u on u.id = e.updated_by_id
      where e.workspace_id = $1 and e.trial_id = $2 and e.variant_id is not distinct from $3::uuid`,
    [actor.workspaceId, trialId, variantId],
    'notebook-entry',
  );
  if (!entry) {
    return { entryId: null, doc: structuredClone(EMPTY_NOTEBOOK_DOC), version: 0, updatedAt: null, updatedByName: null, conflicts: [] };
  }
  return {
    entryId: entry.id,
    doc: entry.doc,
    version: entry.version,
    // A row created only to lock it (version 0) has not really been written by anyone yet.
    updatedAt: entry.version > 0 ? entry.updated_at.toISOString() : null,
    updatedByName: entry.updated_by_name,
    // PostgreSQL's JSON timestamps carry microseconds and an offset: shown as every other timestamp is.
    conflicts: entry.conflicts.map((c) => ({ ...c, createdAt: new Date(c.createdAt).toISOString() })),
  };
}
