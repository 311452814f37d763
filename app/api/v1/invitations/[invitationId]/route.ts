import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { revokeInvitation } from '@/lib/members/mutations';

export const dynamic = 'force-dynamic';

export const DELETE = apiRoute<{ invitationId: string }>('members.manage', async ({ actor, params }) => {
  await revokeInvitation(actor, uuidParam(params.invitationId, 'invitation'));
  return json({ ok: true });
});
