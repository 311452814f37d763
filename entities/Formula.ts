import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { PackFormat } from './PackFormat';

/**
 * A development formula. Its content lives in immutable revisions; this row only holds
 * what lists need and the number of the latest revision (the optimistic-concurrency check).
 */
export const Formula = defineEntity({
  name: 'Formula',
  tableName: 'formulas',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    name: p.string().length(120),
    description: p.text().nullable(),
    latestRevision: p.integer(),
    createdBy: p.manyToOne(User),
    updatedBy: p.manyToOne(User),
    archivedAt: p.datetime().nullable(),
    /** The jar and packaging this formula is costed in (lib/pricing); none until someone picks one. */
    packFormat: p.manyToOne(PackFormat).nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()),
  }),
  indexes: [{ properties: ['workspace', 'updatedAt'] }],
});
export type FormulaEntity = InferEntity<typeof Formula>;
