import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { inviteStaffTasters } from '@/lib/tastings/mutations';
import { inviteTastersSchema } from '@/lib/tastings/schema';

export const dynamic = 'force-dynamic';

export const POST = apiRoute<{ tastingId: string }>('tastings.run', async ({ actor, params, body }) => {
  const id = uuidParam(params.tastingId, 'tasting');
  return json(await inviteStaffTasters(actor, id, (await body(inviteTastersSchema)).userIds), 201);
});
