import 'server-only';
/**
 * Notebook writes. A save names the version it started from; when someone else saved in the
 * meantime the incoming document is kept whole as a conflict row beside the entry, never
 * written over it, and never dropped.
 */
import { randomUUID } from 'node:crypto';
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { NotebookConflict, NotebookEntry, User } from '@/entities';
import type { NotebookEntryEntity } from '@/entities/NotebookEntry';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { Conflict, ValidationFailed } from '@/lib/errors';
import { assertNotebookScope } from './queries';
import { formatDateTime } from '@/lib/format/dates';
import { EMPTY_NOTEBOOK_DOC, type TiptapDoc } from './shape';
import { findDocProblems, mergeKeepingBoth } from './document';
import { type ConflictResolution, type ResolveNotebookConflictInput, type SaveNotebookInput, type SaveNotebookResult } from './schema';

async function nameOf(tx: EntityManager, userId: string | undefined | null): Promise<string | null> {
  if (!userId) return null;
  const user = await tx.findOne(User, { id: userId });
  return user?.name ?? null;
}

/** "2 Dec 2026, 14:02 UTC": the app's one date format, for text stored in the document itself. */
export function utcStamp(at: Date): string {
  return formatDateTime(at);
}

/**
 * Creates the entry at version 0 if it does not exist and locks it. Two first saves racing
 * each other both reach the same row: the insert of the second does nothing.
 */
async function lockEntry(tx: EntityManager, actor: Actor, trialId: string, variantId: string | null): Promise<NotebookEntryEntity> {
  await tx.execute(
    `insert into notebook_entries (id, workspace_id, trial_id, variant_id, doc, version, updated_at)
     values (?, ?, ?, ?, ?::jsonb, 0, now()) on conflict do nothing`,
    [randomUUID(), actor.workspaceId, trialId, variantId, JSON.stringify(EMPTY_NOTEBOOK_DOC)],
  );
  const entry = await tx.findOne(NotebookEntry, { ...inWorkspace(actor), trial: trialId, variantId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
  if (!entry) throw notFound('notebook entry');
  return entry;
}

export async function saveEntry(actor: Actor, input: SaveNotebookInput): Promise<SaveNotebookResult> {
  // 404 before anything else: another workspace's trial must not reveal whether the body was valid.
  await assertNotebookScope(actor, input.trialId, input.variantId);
  const em = await getEm();
  return em.transactional(async (tx) => {
    const entry = await lockEntry(tx, actor, input.trialId, input.variantId);
    if (input.baseVersion === entry.version) {
      const nextVersion = entry.version + 1;
      const savedAt = new Date();
      Object.assign(entry, { doc: input.doc, version: nextVersion, updatedBy: tx.getReference(User, actor.userId), updatedAt: savedAt } satisfies Partial<NotebookEntryEntity>);
      await tx.flush();
      return { status: 'saved' as const, version: nextVersion, updatedAt: savedAt.toISOString() };
    }
    // Someone else saved after this writer's base version: keep both, change nothing in the entry.
    const conflict = tx.create(NotebookConflict, {
      workspace: actor.workspaceId,
      entry: entry.id,
      doc: input.doc,
      baseVersion: input.baseVersion,
      savedBy: actor.userId,
    });
    await tx.flush();
    return {
      status: 'conflict' as const,
      version: entry.version,
      conflictId: conflict.id,
      current: {
        doc: entry.doc,
        updatedByName: await nameOf(tx, entry.updatedBy?.id),
        updatedAt: entry.version > 0 ? entry.updatedAt.toISOString() : null,
      },
    };
  });
}

/**
 * 'mine' makes the kept document the new version, 'theirs' leaves the entry as it is, 'both'
 * appends the kept document under a heading naming its author and time. The conflict row
 * stays, marked resolved, so the history of what was kept is never lost.
 */
export async function resolveConflict(actor: Actor, input: ResolveNotebookConflictInput): Promise<ConflictResolution> {
  const em = await getEm();
  return em.transactional(async (tx) => {
    const conflict = await tx.findOne(NotebookConflict, { ...inWorkspace(actor), id: input.conflictId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!conflict) throw notFound('conflict');
    if (conflict.resolvedAt) throw new Conflict('This conflict was already resolved; reload the entry to see the current version.');
    const entry = await tx.findOne(NotebookEntry, { ...inWorkspace(actor), id: conflict.entry.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!entry) throw notFound('notebook entry');

    let nextDoc: TiptapDoc | null = null;
    if (input.keep === 'mine') nextDoc = conflict.doc;
    if (input.keep === 'both') {
      const byName = (await nameOf(tx, conflict.savedBy.id)) ?? 'someone';
      nextDoc = mergeKeepingBoth(entry.doc, conflict.doc, byName, utcStamp(conflict.createdAt));
      const problems = findDocProblems(nextDoc);
      if (problems.length) {
        throw new ValidationFailed(`Both versions together do not fit in one entry: ${problems[0].message} Choose “Keep mine” or “Keep theirs”, or shorten the entry first.`, { keep: [problems[0].message] });
      }
    }
    const version = nextDoc ? entry.version + 1 : entry.version;
    if (nextDoc) Object.assign(entry, { doc: nextDoc, version, updatedBy: tx.getReference(User, actor.userId), updatedAt: new Date() } satisfies Partial<NotebookEntryEntity>);
    conflict.resolvedAt = new Date();
    await tx.flush();
    return { entryId: entry.id, trialId: entry.trial.id, variantId: entry.variantId ?? null, version, keep: input.keep };
  });
}
