import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { ROLES } from './Membership';

/** An e-mailed invitation. Only the SHA-256 of the link's token is stored; it is single-use and expires. */
export const Invitation = defineEntity({
  name: 'Invitation',
  tableName: 'invitations',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    email: p.string().length(254),
    role: p.enum([...ROLES]),
    tokenHash: p.string().length(64).unique(),
    invitedBy: p.manyToOne(User),
    expiresAt: p.datetime(),
    acceptedAt: p.datetime().nullable(),
    revokedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
});
export type InvitationEntity = InferEntity<typeof Invitation>;
