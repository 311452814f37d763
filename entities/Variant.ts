import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Trial } from './Trial';
import type { FormulaSettingsInput, RevisionLine, RevisionSummary } from '../lib/formulas/schema';
import type { FactorLevel } from '../lib/trials/plan';

/**
 * One variant of a trial: the base formula with its changes applied, stored whole (lines with
 * ingredient snapshots, settings), plus the factor levels the statistics use.
 */
export const Variant = defineEntity({
  name: 'Variant',
  tableName: 'variants',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    trial: p.manyToOne(Trial),
    /** Our label scheme: A is the base, then B, C, … in creation order. */
    label: p.string().length(8),
    isBase: p.boolean().default(false),
    description: p.string().length(200),
    factorLevels: p.json<FactorLevel[]>(),
    settings: p.json<FormulaSettingsInput>(),
    lines: p.json<RevisionLine[]>(),
    summary: p.json<RevisionSummary>(),
    position: p.integer(),
    createdBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()),
    removedAt: p.datetime().nullable(),
  }),
  uniques: [{ properties: ['trial', 'label'] }],
});
export type VariantEntity = InferEntity<typeof Variant>;
