import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import type { TiptapDoc } from '../lib/notebook/shape';
import { Trial } from './Trial';

/**
 * A rich-text notebook entry (Tiptap JSON) for a trial, or for one variant of it.
 * `version` increases with every save; a save names the version it started from.
 */
export const NotebookEntry = defineEntity({
  name: 'NotebookEntry',
  tableName: 'notebook_entries',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    trial: p.manyToOne(Trial),
    /** Null for the trial's own entry. */
    variantId: p.uuid().nullable(),
    doc: p.json<TiptapDoc>(),
    version: p.integer().default(0),
    updatedBy: p.manyToOne(User).nullable(),
    updatedAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['trial', 'variantId'] }],
});
export type NotebookEntryEntity = InferEntity<typeof NotebookEntry>;
