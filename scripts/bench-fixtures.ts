/** Starter-library ids by their handbook key, for the benchmark's invented formula. */
import type { EntityManager } from '@mikro-orm/postgresql';
import { Ingredient } from '../entities';

export async function starterLineIds(em: EntityManager, workspaceId: string): Promise<Record<string, string>> {
  const rows = await em.find(Ingredient, { workspace: workspaceId, typicalKey: { $ne: null } });
  return Object.fromEntries(rows.map((r) => [r.typicalKey!, r.id]));
}
