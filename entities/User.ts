import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';

export const User = defineEntity({
  name: 'User',
  tableName: 'users',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    /** Stored lower-case; sign-in compares lower-case. */
    email: p.string().length(254).unique(),
    name: p.string().length(120),
    /** bcrypt hash; null until an invited user sets a password. */
    passwordHash: p.string().length(100).nullable(),
    /** Mass units on screen: 'metric' (g, kg) or 'imperial' (lb, oz). Stored masses are always grams. */
    massUnits: p.enum(['metric', 'imperial']).default('metric'),
    temperatureUnit: p.enum(['C', 'F']).default('C'),
    /** Raised by a password reset and by "sign out everywhere": sessions signed in under an older epoch end. */
    sessionEpoch: p.integer().default(0),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
});
export type UserEntity = InferEntity<typeof User>;
