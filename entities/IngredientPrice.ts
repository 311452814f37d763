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
  // Written by hand in a migration; declared here so `migration:create` knows them (and does not drop them).
  // A double column's bound is spelled as PostgreSQL prints it back (`(0)::double precision`): the generator compares that text.
  // The price in force on a day (the newest valid_from, then the newest entry, not withdrawn) and a history by date.
  indexes: [
    { name: 'ingredient_prices_as_of_index', expression: 'create index "ingredient_prices_as_of_index" on "ingredient_prices" ("workspace_id", "ingredient_id", "valid_from" desc, "entered_at" desc) where "withdrawn_at" is null' },
    { name: 'ingredient_prices_history_index', properties: ['workspace', 'ingredient', 'validFrom'] },
  ],
  checks: [{ name: 'ingredient_prices_amounts_check', expression: '"pack_price_minor" >= 0 and "pack_size_g" > (0)::double precision' }],
});
export type IngredientPriceEntity = InferEntity<typeof IngredientPrice>;
