import { defineEntity, type InferEntity } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import { Workspace } from './Workspace';
import { User } from './User';

/** Who did what, when, from which request. Insert-only: the database refuses updates and deletes. */
export const AuditEvent = defineEntity({
  name: 'AuditEvent',
  tableName: 'audit_events',
  properties: (p) => ({
    id: p.uuid().primary().onCreate(() => randomUUID()),
    workspace: p.manyToOne(Workspace),
    at: p.datetime().onCreate(() => new Date()),
    actor: p.manyToOne(User),
    /** The name and role at the time, so the trail reads true after renames or role changes. */
    actorName: p.string().length(120),
    actorRole: p.string().length(20),
    action: p.string().length(40),
    subjectType: p.string().length(40),
    subjectId: p.uuid(),
    promotionRequestId: p.uuid().nullable(),
    summary: p.text(),
  }),
  indexes: [{ properties: ['workspace', 'at'] }, { properties: ['workspace', 'subjectId'] }],
});
export type AuditEventEntity = InferEntity<typeof AuditEvent>;
