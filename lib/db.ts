import 'server-only';
import { MikroORM, type EntityManager } from '@mikro-orm/postgresql';
import config from '@/mikro-orm.config';
import { closeSqlPool } from '@/lib/sql';
import { logger, withoutStatement } from '@/lib/log';

/**
 * One ORM per process, cached on globalThis so dev-server reloads do not open a new pool
 * each time. Every request works in its own forked EntityManager: the global one is never used.
 *
 * After a PostgreSQL restart the pool drops its dead connections by itself (knex marks a
 * connection disposed on its 'error'/'end' event and validates on acquire); requests that were
 * running at that moment fail once with a 503 and Retry-After (lib/api/errors.ts), and the phone's
 * queue resends them with the same idempotency key. scripts/soak.ts checks this under load.
 */
/** Typed in lib/process-cache.ts. */
const cache = globalThis;

/** knex's own warnings ("Connection Error: …") as structured log lines instead of bare console text. */
const knexLog = {
  warn: (message: unknown) => logger.warn({ source: 'knex' }, withoutStatement(String(message))),
  error: (message: unknown) => logger.error({ source: 'knex' }, withoutStatement(String(message))),
  deprecate: (method: unknown, alternative: unknown) => logger.warn({ source: 'knex' }, `${String(method)} is deprecated; use ${String(alternative)}`),
  debug: () => undefined,
};

async function init(): Promise<MikroORM> {
  const orm = await MikroORM.init({ ...config, driverOptions: { ...(config.driverOptions ?? {}), log: knexLog } });
  // A failed query's error message starts with the statement, and MikroORM inlines the values
  // (answers, token hashes, password hashes). Cut it off here, before anything can print it.
  orm.em.getConnection().getKnex().on('query-error', (err: { message?: unknown }) => {
    if (typeof err?.message === 'string') err.message = withoutStatement(err.message);
  });
  return orm;
}

export function getOrm(): Promise<MikroORM> {
  cache.setwellOrm ??= init().catch((err) => {
    cache.setwellOrm = undefined;
    throw err;
  });
  return cache.setwellOrm;
}

export async function getEm(): Promise<EntityManager> {
  return (await getOrm()).em.fork();
}

/**
 * Serialises writers on `key` until the transaction ends. The lock must be taken on the
 * transaction's own connection (`tx.execute`): `tx.getConnection().execute` borrows another pooled
 * connection, where the lock is released as soon as that statement commits.
 */
export async function lockForTransaction(tx: EntityManager, key: string): Promise<void> {
  if (!tx.isInTransaction()) throw new Error('lockForTransaction needs the EntityManager of a running transaction.');
  await tx.execute('select pg_advisory_xact_lock(hashtext(?))', [key]);
}

export async function closeOrm(): Promise<void> {
  await closeSqlPool();
  if (!cache.setwellOrm) return;
  const orm = await cache.setwellOrm;
  cache.setwellOrm = undefined;
  await orm.close(true);
}
