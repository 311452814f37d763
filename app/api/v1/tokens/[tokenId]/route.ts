import { apiRoute, json, uuidParam } from '@/lib/api/route';
import { revokeToken } from '@/lib/api-tokens/mutations';

export const dynamic = 'force-dynamic';

export const DELETE = apiRoute<{ tokenId: string }>('tokens.manage', async ({ actor, params }) => {
  await revokeToken(actor, params.tokenId);
  return json({ ok: true });
});
