import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import {
  ACID_TYPES, EU_FRUIT_GROUPS, INGREDIENT_KINDS, PECTIN_LEVELS, PECTIN_TYPES, SWEETENER_TYPES, US_FRUIT_GROUPS,
} from '../lib/ingredients/schema';
import { ADDITIVE_CLASSES } from '../lib/ingredients/label-data';
import type { EuAllergen, UsAllergen } from '../lib/label/types';

/**
 * One entry of a workspace's ingredient library. Starter entries carry a handbook value
 * (`typicalKey` + `source`); once a user edits one it is marked edited and the source is cleared.
 */
export const Ingredient = defineEntity({
  name: 'Ingredient',
  tableName: 'ingredients',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    name: p.string().length(120),
    kind: p.enum([...INGREDIENT_KINDS]),
    solidsPct: p.double().$type<number>(),
    phMin: p.double().$type<number>().nullable(),
    phMax: p.double().$type<number>().nullable(),
    acidPct: p.double().$type<number>().nullable(),
    pectinLevel: p.enum([...PECTIN_LEVELS]).nullable(),
    euFruitGroup: p.enum([...EU_FRUIT_GROUPS]).nullable(),
    usFruitGroup: p.enum([...US_FRUIT_GROUPS]).nullable(),
    pectinType: p.enum([...PECTIN_TYPES]).nullable(),
    pectinGrade: p.double().$type<number>().nullable(),
    sweetenerType: p.enum([...SWEETENER_TYPES]).nullable(),
    acidType: p.enum([...ACID_TYPES]).nullable(),
    calciumSource: p.boolean().default(false),
    notes: p.text().nullable(),
    /** Share of the bought mass trimmed away before weighing (stones, peel, stalks), % 0–95; set on the price list. */
    refusePct: p.double().$type<number>().default(0),
    origin: p.enum(['typical', 'edited', 'custom']),
    typicalKey: p.string().length(60).nullable(),
    source: p.text().nullable(),
    // Label data, per 100 g as used (lib/ingredients/label-data.ts). null = not known, never zero.
    labelName: p.string().length(120).nullable(),
    waterG: p.double().$type<number>().nullable(),
    energyKcal: p.double().$type<number>().nullable(),
    energyKj: p.double().$type<number>().nullable(),
    proteinG: p.double().$type<number>().nullable(),
    fatG: p.double().$type<number>().nullable(),
    saturatesG: p.double().$type<number>().nullable(),
    carbohydrateG: p.double().$type<number>().nullable(),
    sugarsG: p.double().$type<number>().nullable(),
    sucroseG: p.double().$type<number>().nullable(),
    glucoseG: p.double().$type<number>().nullable(),
    fructoseG: p.double().$type<number>().nullable(),
    fibreG: p.double().$type<number>().nullable(),
    polyolsG: p.double().$type<number>().nullable(),
    organicAcidsG: p.double().$type<number>().nullable(),
    sodiumMg: p.double().$type<number>().nullable(),
    cholesterolMg: p.double().$type<number>().nullable(),
    euAllergens: p.json<EuAllergen[]>().default('[]'),
    usAllergens: p.json<UsAllergen[]>().default('[]'),
    sulphiteMgPerKg: p.double().$type<number>().nullable(),
    eNumber: p.string().length(12).nullable(),
    additiveClass: p.enum([...ADDITIVE_CLASSES]).nullable(),
    isAddedWater: p.boolean().default(false),
    compositionSource: p.text().nullable(),
    archivedAt: p.datetime().nullable(),
    updatedBy: p.manyToOne(User).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  }),
  indexes: [{ properties: ['workspace', 'name'] }],
  // Written by hand in a migration; declared here so `migration:create` knows them (and does not drop them).
  // A double column's bound is spelled as PostgreSQL prints it back (`(0)::double precision`): the generator compares that text.
  checks: [{ name: 'ingredients_refuse_pct_check', expression: '"refuse_pct" >= (0)::double precision and "refuse_pct" <= (95)::double precision' }],
});
export type IngredientEntity = InferEntity<typeof Ingredient>;
