import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { updateMember } from '@/lib/members/mutations';
import { updateMemberSchema } from '@/lib/members/schema';

export const dynamic = 'force-dynamic';

export const PATCH = apiRoute<{ membershipId: string }>('members.manage', async ({ actor, params, body }) => {
  await updateMember(actor, uuidParam(params.membershipId, 'member'), await body(updateMemberSchema));
  return json({ ok: true });
});
