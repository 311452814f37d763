import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { PackFormat } from './PackFormat';
import { PackagingItem } from './PackagingItem';

/** A packaging item in a pack format: `pieces` of it for every `perJars` jars (a case of 12: 1 per 12). */
export const PackFormatItem = defineEntity({
  name: 'PackFormatItem',
  tableName: 'pack_format_items',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    packFormat: p.manyToOne(PackFormat),
    packagingItem: p.manyToOne(PackagingItem),
    pieces: p.integer(),
    perJars: p.integer(),
    position: p.integer(),
  }),
  uniques: [{ properties: ['packFormat', 'packagingItem'] }],
  // Written by hand in a migration; declared here so `migration:create` knows them (and does not drop them).
  checks: [{ name: 'pack_format_items_share_check', expression: '"pieces" > 0 and "per_jars" > 0' }],
});
export type PackFormatItemEntity = InferEntity<typeof PackFormatItem>;
