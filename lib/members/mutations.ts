import 'server-only';
/** Member administration. The API handlers and the server actions both call these. */
import { LockMode } from '@mikro-orm/core';
import { getEm } from '@/lib/db';
import { writeAudit } from '@/lib/audit';
import { Invitation, Membership, User, Workspace } from '@/entities';
import { inWorkspace, notFound, ROLE_LABELS, type Actor } from '@/lib/permissions';
import { Conflict } from '@/lib/errors';
import { newSecret, hashSecret } from '@/lib/secrets';
import { sendMail, escapeHtml } from '@/lib/mail';
import { env } from '@/lib/env';
import type { InviteMemberInput, UpdateMemberInput, PendingInvitation } from './schema';

export const INVITATION_LIFETIME_HOURS = 72;

export async function inviteMember(actor: Actor, input: InviteMemberInput): Promise<PendingInvitation> {
  const em = await getEm();
  const existingUser = await em.findOne(User, { email: input.email });
  if (existingUser) {
    const membership = await em.findOne(Membership, { ...inWorkspace(actor), user: existingUser.id });
    if (membership) throw new Conflict(`${input.email} is already a member of this workspace.`);
  }
  const token = newSecret();
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_HOURS * 3600_000);
  const invitation = await em.transactional(async (tx) => {
    // A new invitation replaces any earlier open one for the same address.
    await tx.nativeUpdate(Invitation, { ...inWorkspace(actor), email: input.email, acceptedAt: null, revokedAt: null }, { revokedAt: new Date() });
    const created = tx.create(Invitation, {
      workspace: actor.workspaceId,
      email: input.email,
      role: input.role,
      tokenHash: hashSecret(token),
      invitedBy: actor.userId,
      expiresAt,
    });
    await tx.flush();
    writeAudit(tx, actor, 'member.invited', { type: 'invitation', id: created.id }, `Invited ${input.email} as ${ROLE_LABELS[input.role]}`);
    return created;
  });

  const workspace = await em.findOneOrFail(Workspace, { id: actor.workspaceId });
  const link = `${env().APP_URL}/accept-invite/${token}`;
  const role = ROLE_LABELS[input.role];
  await sendMail({
    workspaceId: actor.workspaceId,
    to: input.email,
    subject: `${actor.name} invited you to ${workspace.name} on Setwell`,
    text: [
      `${actor.name} invited you to join ${workspace.name} on Setwell as ${role}.`,
      '',
      `Accept the invitation and choose a password here (the link works once and expires in ${INVITATION_LIFETIME_HOURS} hours):`,
      link,
      '',
      'If you did not expect this, ignore this message.',
    ].join('\n'),
    html: `<p>${escapeHtml(actor.name)} invited you to join <strong>${escapeHtml(workspace.name)}</strong> on Setwell as ${escapeHtml(role)}.</p><p><a href="${escapeHtml(link)}">Accept the invitation</a> (works once, expires in ${INVITATION_LIFETIME_HOURS} hours).</p>`,
  });

  return { invitationId: invitation.id, email: input.email, role: input.role, invitedBy: actor.name, expiresAt: expiresAt.toISOString() };
}

export async function revokeInvitation(actor: Actor, invitationId: string): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const invitation = await tx.findOne(Invitation, { ...inWorkspace(actor), id: invitationId, acceptedAt: null, revokedAt: null }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!invitation) throw notFound('invitation');
    invitation.revokedAt = new Date();
    writeAudit(tx, actor, 'member.invitation_revoked', { type: 'invitation', id: invitation.id }, `Revoked the invitation to ${invitation.email}`);
  });
}

/**
 * Changes a member's role or active flag. The workspace's admin memberships are locked
 * for the transaction, so two admins demoting each other at once cannot leave none.
 */
export async function updateMember(actor: Actor, membershipId: string, input: UpdateMemberInput): Promise<void> {
  const em = await getEm();
  await em.transactional(async (tx) => {
    const target = await tx.findOne(Membership, { ...inWorkspace(actor), id: membershipId }, { lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!target) throw notFound('member');
    const losesAdmin =
      target.role === 'admin' && target.active && ((input.role && input.role !== 'admin') || input.active === false);
    if (losesAdmin) {
      const admins = await tx.find(Membership, { ...inWorkspace(actor), role: 'admin', active: true }, { lockMode: LockMode.PESSIMISTIC_WRITE });
      if (admins.length <= 1) {
        throw new Conflict('A workspace always needs an active administrator. Make someone else an administrator first.');
      }
    }
    const user = await tx.findOneOrFail(User, { id: target.user.id }, { fields: ['name', 'email'] });
    const who = `${user.name} (${user.email})`;
    if (input.role && input.role !== target.role) {
      writeAudit(tx, actor, 'member.role_changed', { type: 'membership', id: target.id }, `${who}: ${ROLE_LABELS[target.role]} → ${ROLE_LABELS[input.role]}`);
      target.role = input.role;
    }
    if (input.active !== undefined && input.active !== target.active) {
      writeAudit(tx, actor, input.active ? 'member.reactivated' : 'member.deactivated', { type: 'membership', id: target.id }, `${input.active ? 'Reactivated' : 'Deactivated'} ${who}`);
      target.active = input.active;
    }
  });
}
