import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';

/** A product on the production floor. Its recipe lives in immutable production versions. */
export const Product = defineEntity({
  name: 'Product',
  tableName: 'products',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    /** Short upper-case code that starts every lot code, e.g. QMJ. */
    code: p.string().length(5),
    name: p.string().length(120),
    createdBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['workspace', 'code'] }],
});
export type ProductEntity = InferEntity<typeof Product>;
