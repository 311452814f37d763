import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { PACKAGING_KINDS } from '../lib/pricing/vocabulary';

/** Something bought by the piece that goes with a jar: the jar itself, a lid, a label, a case. */
export const PackagingItem = defineEntity({
  name: 'PackagingItem',
  tableName: 'packaging_items',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    name: p.string().length(120),
    kind: p.enum([...PACKAGING_KINDS]),
    archivedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  indexes: [{ properties: ['workspace', 'name'] }],
});
export type PackagingItemEntity = InferEntity<typeof PackagingItem>;
