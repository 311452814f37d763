import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';

/** One producer: every record in Setwell belongs to exactly one workspace. */
export const Workspace = defineEntity({
  name: 'Workspace',
  tableName: 'workspaces',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    name: p.string().length(120),
    slug: p.string().length(60).unique(),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
});
export type WorkspaceEntity = InferEntity<typeof Workspace>;
