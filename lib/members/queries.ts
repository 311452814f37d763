import 'server-only';
import { getEm } from '@/lib/db';
import { Invitation, Membership } from '@/entities';
import { inWorkspace, type Actor } from '@/lib/permissions';
import type { MemberRow, PendingInvitation } from './schema';

export async function listMembers(actor: Actor): Promise<{ members: MemberRow[]; invitations: PendingInvitation[] }> {
  const em = await getEm();
  const memberships = await em.find(Membership, inWorkspace(actor), {
    populate: ['user'],
    orderBy: { createdAt: 'asc' },
  });
  const invitations = await em.find(
    Invitation,
    { ...inWorkspace(actor), acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } },
    { populate: ['invitedBy'], orderBy: { createdAt: 'desc' } },
  );
  return {
    members: memberships.map((m) => ({
      membershipId: m.id,
      userId: m.user.id,
      name: m.user.name,
      email: m.user.email,
      role: m.role,
      active: m.active,
      joinedAt: m.createdAt.toISOString(),
    })),
    invitations: invitations.map((i) => ({
      invitationId: i.id,
      email: i.email,
      role: i.role,
      invitedBy: i.invitedBy.name,
      expiresAt: i.expiresAt.toISOString(),
    })),
  };
}
