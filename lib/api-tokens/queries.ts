import 'server-only';
/** Reads of personal API tokens: the signed-in person's own, never anyone else's. */
import { getEm } from '@/lib/db';
import { ApiToken } from '@/entities';
import type { ApiTokenEntity } from '@/entities/ApiToken';
import { inWorkspace, type Actor } from '@/lib/permissions';
import type { TokenRow } from './schema';

type TokenEntity = Pick<ApiTokenEntity, 'id' | 'label' | 'displayPrefix' | 'createdAt' | 'lastUsedAt'>;

export const toRow = (t: TokenEntity): TokenRow => ({
  tokenId: t.id,
  label: t.label,
  displayPrefix: t.displayPrefix,
  createdAt: t.createdAt.toISOString(),
  lastUsedAt: t.lastUsedAt ? t.lastUsedAt.toISOString() : null,
});

export async function listMyTokens(actor: Actor): Promise<TokenRow[]> {
  const em = await getEm();
  const rows = await em.find(ApiToken, { ...inWorkspace(actor), user: actor.userId, revokedAt: null }, { orderBy: { createdAt: 'desc' } });
  return rows.map(toRow);
}
