import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import type { TiptapDoc } from '../lib/notebook/shape';
import { NotebookEntry } from './NotebookEntry';

/** A save that arrived from an older version: kept whole beside the entry, never dropped. */
export const NotebookConflict = defineEntity({
  name: 'NotebookConflict',
  tableName: 'notebook_conflicts',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    entry: p.manyToOne(NotebookEntry),
    doc: p.json<TiptapDoc>(),
    baseVersion: p.integer(),
    savedBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
    resolvedAt: p.datetime().nullable(),
  }),
});
export type NotebookConflictEntity = InferEntity<typeof NotebookConflict>;
