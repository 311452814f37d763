import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';

import { ROLES } from '../lib/roles';

export { ROLES };

/** A user's one role in one workspace. Deactivated members keep their history but cannot sign in to it. */
export const Membership = defineEntity({
  name: 'Membership',
  tableName: 'memberships',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    user: p.manyToOne(User),
    role: p.enum([...ROLES]),
    active: p.boolean().default(true),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['workspace', 'user'] }],
});
export type MembershipEntity = InferEntity<typeof Membership>;
