import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { BatchRecord } from './BatchRecord';
import { BATCH_DECISION_KINDS, BATCH_OUTCOMES } from '../lib/production/vocabulary';
import type { QcCheck } from '../lib/chemistry/qc';
import type { BatchRetestReadings } from '../lib/production/holds';

/**
 * What happened to a held batch after it was recorded: a re-test (new readings checked against the
 * same spec), then a release or a reject. Insert-only like the batch record itself; at most one
 * release or reject per batch (a partial unique index).
 */
export const BatchDecision = defineEntity({
  name: 'BatchDecision',
  tableName: 'batch_decisions',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    batch: p.manyToOne(BatchRecord),
    kind: p.enum([...BATCH_DECISION_KINDS]),
    /** Re-tests only: the readings taken again, the checks of the merged readings and their outcome. */
    readings: p.json<BatchRetestReadings>().nullable(),
    checks: p.json<QcCheck[]>().nullable(),
    outcome: p.enum([...BATCH_OUTCOMES]).nullable(),
    comment: p.text(),
    decidedBy: p.manyToOne(User),
    createdAt: p.datetime().onCreate(() => new Date()),
  }),
  indexes: [{ properties: ['workspace', 'batch'] }],
  // Written by hand in a migration; declared here so `migration:create` knows them (and does not drop them).
  // One final decision (release or reject) per batch.
  uniques: [{ name: 'batch_decisions_one_final', expression: `create unique index "batch_decisions_one_final" on "batch_decisions" ("batch_id") where "kind" in ('release', 'reject')` }],
});
export type BatchDecisionEntity = InferEntity<typeof BatchDecision>;
