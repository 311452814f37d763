import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Trial } from './Trial';
import { TASTING_METHODS, TASTING_STATES } from '../lib/tastings/vocabulary';

/** A tasting of some of a trial's variants, by one method. */
export const Tasting = defineEntity({
  name: 'Tasting',
  tableName: 'panel_sessions',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    trial: p.manyToOne(Trial),
    /** What tasters see: never a variant or formula name. */
    title: p.string().length(120),
    place: p.string().length(120).nullable(),
    startsAt: p.datetime().nullable(),
    method: p.enum([...TASTING_METHODS]),
    state: p.enum([...TASTING_STATES]).default('draft'),
    /** The allergen and consent notice tasters accept before the first sample. */
    notice: p.text(),
    attributeIds: p.json<string[]>(),
    rankingAttributeId: p.uuid().nullable(),
    /** Design state: treatment letters for Williams orders, the triangle order cycle. */
    design: p.json<{ treatments?: Array<{ letter: string; sampleId: string }>; triangleCycle?: string[] }>(),
    /** Short code guests type (or scan) to join; set when the session opens. */
    joinCode: p.string().length(8).nullable().unique(),
    createdBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
    openedAt: p.datetime().nullable(),
    closedAt: p.datetime().nullable(),
  }),
  indexes: [{ properties: ['workspace', 'state'] }],
});
export type TastingEntity = InferEntity<typeof Tasting>;
