import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Ingredient } from './Ingredient';

/**
 * One dated price of an ingredient: a pack's price (workspace currency, minor units) and size.
 * Points are never changed or deleted (a trigger refuses it); a correction adds a point, a
 * mistaken one is withdrawn once, with a reason, and then no longer counts.
 */
export const IngredientPrice = defineEntity({
  name: 'IngredientPrice',
  tableName: 'ingredient_prices',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    ingredient: p.manyToOne(Ingredient),
    validFrom: p.date(),
    packPriceMinor: p.integer(),
    packSizeG: p.double().$type<number>(),
    supplier: p.string().length(120).nullable(),
    enteredBy: p.manyToOne(User),
    enteredAt: p.datetime().onCreate(() => new Date()),
    withdrawnAt: p.datetime().nullable(),
    withdrawnBy: p.manyToOne(User).nullable(),
    withdrawReason: p.text().nullable(),
  }),
});
export type IngredientPriceEntity = InferEntity<typeof IngredientPrice>;
