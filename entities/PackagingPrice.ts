import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { PackagingItem } from './PackagingItem';

/**
 * One dated price of a packaging item, as bought: a pack's price and how many pieces it holds
 * (labels come by the thousand). Kept like ingredient prices: never changed, withdrawn with a reason.
 */
export const PackagingPrice = defineEntity({
  name: 'PackagingPrice',
  tableName: 'packaging_prices',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    packagingItem: p.manyToOne(PackagingItem),
    validFrom: p.date(),
    packPriceMinor: p.integer(),
    piecesPerPack: p.integer(),
    supplier: p.string().length(120).nullable(),
    enteredBy: p.manyToOne(User),
    enteredAt: p.datetime().onCreate(() => new Date()),
    withdrawnAt: p.datetime().nullable(),
    withdrawnBy: p.manyToOne(User).nullable(),
    withdrawReason: p.text().nullable(),
  }),
  // Written by hand in a migration; declared here so `migration:create` knows them (and does not drop them).
  // The price in force on a day (the newest valid_from, then the newest entry, not withdrawn) and a history by date.
  indexes: [
    { name: 'packaging_prices_as_of_index', expression: 'create index "packaging_prices_as_of_index" on "packaging_prices" ("workspace_id", "packaging_item_id", "valid_from" desc, "entered_at" desc) where "withdrawn_at" is null' },
    { name: 'packaging_prices_history_index', properties: ['workspace', 'packagingItem', 'validFrom'] },
  ],
  checks: [{ name: 'packaging_prices_amounts_check', expression: '"pack_price_minor" >= 0 and "pieces_per_pack" > 0' }],
});
export type PackagingPriceEntity = InferEntity<typeof PackagingPrice>;
