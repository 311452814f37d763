import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';

/** A container and its net fill (e.g. a 340 g jar); its packaging is in pack_format_items. */
export const PackFormat = defineEntity({
  name: 'PackFormat',
  tableName: 'pack_formats',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    name: p.string().length(120),
    netFillG: p.double().$type<number>(),
    archivedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  indexes: [{ properties: ['workspace', 'name'] }],
});
export type PackFormatEntity = InferEntity<typeof PackFormat>;
