import { apiRoute, json } from '@/lib/api/route';
import { listMembers } from '@/lib/members/queries';
import { inviteMember } from '@/lib/members/mutations';
import { inviteMemberSchema } from '@/lib/members/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('members.manage', async ({ actor }) => json(await listMembers(actor)));

export const POST = apiRoute('members.manage', async ({ actor, body }) =>
  json({ invitation: await inviteMember(actor, await body(inviteMemberSchema)) }, 201),
);
