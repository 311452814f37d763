import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';

/** A personal API token for scripts, bound to one user in one workspace. Shown once, stored as SHA-256. */
export const ApiToken = defineEntity({
  name: 'ApiToken',
  tableName: 'api_tokens',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    user: p.manyToOne(User),
    label: p.string().length(80),
    /** The first characters, so a user can tell tokens apart without the secret. */
    displayPrefix: p.string().length(16),
    tokenHash: p.string().length(64).unique(),
    lastUsedAt: p.datetime().nullable(),
    revokedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
});
export type ApiTokenEntity = InferEntity<typeof ApiToken>;
