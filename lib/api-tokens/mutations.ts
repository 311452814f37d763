import 'server-only';
/** Personal API tokens: each belongs to its creator in the workspace it was made in. */
import { getEm } from '@/lib/db';
import { ApiToken } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { API_TOKEN_PREFIX } from '@/lib/auth';
import { hashSecret, newSecret } from '@/lib/secrets';
import type { TokenRow } from './schema';
import { toRow } from './queries';

/** Returns the secret once; only its hash is kept. */
export async function createToken(actor: Actor, input: { label: string }): Promise<TokenRow & { secret: string }> {
  const em = await getEm();
  const secret = newSecret(API_TOKEN_PREFIX);
  const token = em.create(ApiToken, {
    workspace: actor.workspaceId,
    user: actor.userId,
    label: input.label,
    displayPrefix: secret.slice(0, 10),
    tokenHash: hashSecret(secret),
  });
  await em.flush();
  return { ...toRow(token), secret };
}

export async function revokeToken(actor: Actor, tokenId: string): Promise<void> {
  const em = await getEm();
  const n = await em.nativeUpdate(ApiToken, { ...inWorkspace(actor), user: actor.userId, id: tokenId, revokedAt: null }, { revokedAt: new Date() });
  if (n === 0) throw notFound('token');
}
