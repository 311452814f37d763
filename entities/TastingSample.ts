import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { Tasting } from './Tasting';
import { Variant } from './Variant';

/** One variant in a session. Rated and ranking sessions give it one blinding code for all seats. */
export const TastingSample = defineEntity({
  name: 'TastingSample',
  tableName: 'panel_samples',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    session: p.manyToOne(Tasting),
    variant: p.manyToOne(Variant),
    /** Three-digit code (ISO 13299); null for triangle sessions, whose cups are coded per seat. */
    code: p.string().length(3).nullable(),
    position: p.integer(),
  }),
  uniques: [{ properties: ['session', 'variant'] }, { properties: ['session', 'code'] }],
});
export type TastingSampleEntity = InferEntity<typeof TastingSample>;
