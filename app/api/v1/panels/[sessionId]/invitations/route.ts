import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { inviteStaffTasters } from '@/lib/panels/mutations';
import { inviteTastersSchema } from '@/lib/panels/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ sessionId: string }>('panels.run', async ({ actor, params, body }) => {
  const id = uuidParam(params.sessionId, 'tasting');
  return json(await inviteStaffTasters(actor, id, (await body(inviteTastersSchema)).userIds), 201);
});
