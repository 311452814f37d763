import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Formula } from './Formula';
import { TRIAL_STATUSES } from '../lib/trials/vocabulary';

/** A question tested by cooking variants of one base formula revision. */
export const Trial = defineEntity({
  name: 'Trial',
  tableName: 'trials',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    /** Sequential per workspace: shown as T-001. */
    number: p.integer(),
    title: p.string().length(160),
    question: p.text(),
    owner: p.manyToOne(User),
    baseFormula: p.manyToOne(Formula),
    baseRevision: p.integer(),
    status: p.enum([...TRIAL_STATUSES]).default('planning'),
    /** The product developer's pick for promotion, with the reasons. */
    recommendedVariantId: p.uuid().nullable(),
    recommendationRationale: p.text().nullable(),
    recommendedBy: p.manyToOne(User).nullable(),
    recommendedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['workspace', 'number'] }],
  indexes: [{ properties: ['workspace', 'status'] }],
});
export type TrialEntity = InferEntity<typeof Trial>;
