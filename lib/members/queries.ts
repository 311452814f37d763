import 'server-only';
import { getEm } from '@/lib/db';
import { Invitation, Membership } from '@/entities';
import { inWorkspace, type Actor } from '@/lib/permissions';
import type { MemberRow, PendingInvitation } from './schema';

type PopulatedMembership = {
  id: string; role: MemberRow['role']; active: boolean; createdAt: Date;
  user: { id: string; name: string; email: string };
};

export async function listMembers(actor: Actor): Promise<{ members: MemberRow[]; invitations: PendingInvitation[] }> {
  const em = await getEm();
  const memberships = (await em.find(Membership, inWorkspace(actor), {
    populate: ['user'],
    orderBy: { createdAt: 'asc' },
  })) as unknown as PopulatedMembership[];
  const invitations = (await em.find(
    Invitation,
    { ...inWorkspace(actor), acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } },
    { populate: ['invitedBy'], orderBy: { createdAt: 'desc' } },
  )) as unknown as Array<{ id: string; email: string; role: MemberRow['role']; expiresAt: Date; invitedBy: { name: string } }>;
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
