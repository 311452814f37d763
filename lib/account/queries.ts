import 'server-only';
/** Reads of the signed-out account flows. */
import { getEm } from '@/lib/db';
import { Invitation, User } from '@/entities';
import { hashSecret } from '@/lib/secrets';
import type { InvitationPreview } from './schema';

/** What the accept page shows before the invitee commits. Null when the link is not usable. */
export async function previewInvitation(token: string): Promise<InvitationPreview | null> {
  const em = await getEm();
  const inv = await em.findOne(
    Invitation,
    { tokenHash: hashSecret(token), acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } },
    { populate: ['workspace'] },
  );
  if (!inv) return null;
  const user = await em.findOne(User, { email: inv.email });
  return { email: inv.email, workspaceName: inv.workspace.name, role: inv.role, hasAccount: !!user?.passwordHash };
}
