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
});
export type PackagingPriceEntity = InferEntity<typeof PackagingPrice>;
