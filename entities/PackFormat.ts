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
  // Written by hand in a migration; declared here so `migration:create` knows them (and does not drop them).
  // A double column's bound is spelled as PostgreSQL prints it back (`(0)::double precision`): the generator compares that text.
  checks: [{ name: 'pack_formats_net_fill_check', expression: '"net_fill_g" > (0)::double precision' }],
});
export type PackFormatEntity = InferEntity<typeof PackFormat>;
