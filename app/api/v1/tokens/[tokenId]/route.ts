import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { revokeToken } from '@/lib/api-tokens/mutations';

export const dynamic = 'force-dynamic';

export const DELETE = apiRoute<{ tokenId: string }>('tokens.manage', async ({ actor, params }) => {
  await revokeToken(actor, uuidParam(params.tokenId, 'token'));
  return json({ ok: true });
});
