import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Tasting } from './Tasting';
import { SEAT_KINDS, type ServedCup } from '../lib/tastings/vocabulary';

/**
 * One taster's place at one session. The seat token is the taster's only identity here
 * (stored as SHA-256); the serving order lists the codes this seat gets, in order.
 */
export const TastingSeat = defineEntity({
  name: 'TastingSeat',
  tableName: 'panel_seats',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    session: p.manyToOne(Tasting),
    seatIndex: p.integer(),
    kind: p.enum([...SEAT_KINDS]),
    user: p.manyToOne(User).nullable(),
    displayName: p.string().length(60),
    tokenHash: p.string().length(64).unique(),
    servingOrder: p.json<ServedCup[]>(),
    designRow: p.string().length(40),
    consentedAt: p.datetime().nullable(),
    submittedAt: p.datetime().nullable(),
    lastSeenAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['session', 'seatIndex'] }],
});
export type TastingSeatEntity = InferEntity<typeof TastingSeat>;
