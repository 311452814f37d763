import { apiRoute, json } from '@/lib/api/route';
import { createToken } from '@/lib/api-tokens/mutations';
import { listMyTokens } from '@/lib/api-tokens/queries';
import { createTokenSchema } from '@/lib/api-tokens/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('tokens.manage', async ({ actor }) => json({ tokens: await listMyTokens(actor) }));

export const POST = apiRoute('tokens.manage', async ({ actor, body }) =>
  json({ token: await createToken(actor, await body(createTokenSchema)) }, 201),
);
