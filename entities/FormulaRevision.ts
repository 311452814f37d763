import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Formula } from './Formula';
import type { FormulaSettingsInput, RevisionLine, RevisionSummary } from '../lib/formulas/schema';

/**
 * One saved state of a formula. Never updated after insert: lines carry a snapshot of each
 * ingredient's composition, so later library edits do not rewrite history.
 */
export const FormulaRevision = defineEntity({
  name: 'FormulaRevision',
  tableName: 'formula_revisions',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    formula: p.manyToOne(Formula),
    number: p.integer(),
    name: p.string().length(120),
    settings: p.json<FormulaSettingsInput>(),
    lines: p.json<RevisionLine[]>(),
    note: p.text().nullable(),
    /** Headline results at save time, for lists (full results are recomputed on read). */
    summary: p.json<RevisionSummary>(),
    createdBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  uniques: [{ properties: ['formula', 'number'] }],
});
export type FormulaRevisionEntity = InferEntity<typeof FormulaRevision>;
