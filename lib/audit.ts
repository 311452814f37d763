import 'server-only';
/** The workspace's audit trail: one row per change, written in the change's own transaction. */
import type { EntityManager } from '@mikro-orm/postgresql';
import { AuditEvent } from '@/entities';
import type { Actor } from '@/lib/permissions';

export function writeAudit(tx: EntityManager, actor: Actor, action: string, subject: { type: string; id: string }, summary: string): void {
  tx.create(AuditEvent, {
    workspace: actor.workspaceId, actor: actor.userId, actorName: actor.name, actorRole: actor.role,
    action, subjectType: subject.type, subjectId: subject.id, promotionRequestId: null, summary,
  });
}
