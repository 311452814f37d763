import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';
import { Trial } from './Trial';
import { TRIAL_STATUSES } from '../lib/trials/vocabulary';

/** Every status move of a trial, kept for the record. */
export const TrialStatusChange = defineEntity({
  name: 'TrialStatusChange',
  tableName: 'trial_status_changes',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    trial: p.manyToOne(Trial),
    fromStatus: p.enum([...TRIAL_STATUSES]).nullable(),
    toStatus: p.enum([...TRIAL_STATUSES]),
    note: p.text().nullable(),
    changedBy: p.manyToOne(User),
    changedAt: p.datetime().onCreate(() => new Date()),
  }),
});
export type TrialStatusChangeEntity = InferEntity<typeof TrialStatusChange>;
