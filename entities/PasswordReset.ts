import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { User } from './User';

/** A password-reset link: token stored hashed, single-use, short-lived. */
export const PasswordReset = defineEntity({
  name: 'PasswordReset',
  tableName: 'password_resets',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    user: p.manyToOne(User),
    tokenHash: p.string().length(64).unique(),
    expiresAt: p.datetime(),
    usedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  indexes: [{ properties: ['user', 'usedAt'] }],
});
export type PasswordResetEntity = InferEntity<typeof PasswordReset>;
