import { MikroORM, type EntityManager } from '@mikro-orm/postgresql';
import config from '@/mikro-orm.config';
import { closeSqlPool } from '@/lib/sql';

/**
 * One ORM per process, cached on globalThis so dev-server reloads do not open a new pool
 * each time. Every request works in its own forked EntityManager: the global one is never used.
 */
const cache = globalThis as unknown as { setwellOrm?: Promise<MikroORM> };

export function getOrm(): Promise<MikroORM> {
  cache.setwellOrm ??= MikroORM.init(config).catch((err) => {
    cache.setwellOrm = undefined;
    throw err;
  });
  return cache.setwellOrm;
}

export async function getEm(): Promise<EntityManager> {
  return (await getOrm()).em.fork();
}

export async function closeOrm(): Promise<void> {
  await closeSqlPool();
  if (!cache.setwellOrm) return;
  const orm = await cache.setwellOrm;
  cache.setwellOrm = undefined;
  await orm.close(true);
}
