/**
 * A plain `pg` pool for the hot statements where the ORM's per-query work shows under load (a full
 * tasting room's answers, the reads every staff page or the busiest ones make; DEVELOPERS.md lists
 * them). Everything else goes through MikroORM. Same database, same
 * pool size setting; a dead connection (say, after a PostgreSQL restart) is dropped by pg itself.
 */
import { Pool, type QueryResultRow } from 'pg';
import { env } from '@/lib/env';

/** Typed in lib/process-cache.ts. */
const cache = globalThis;

function pool(): Pool {
  if (!cache.setwellSqlPool) {
    const p = new Pool({ connectionString: env().DATABASE_URL, max: Number(process.env.DB_POOL_MAX ?? 10) });
    // An idle client's error (the server went away) must not crash the process; the pool discards it.
    p.on('error', () => undefined);
    cache.setwellSqlPool = p;
  }
  return cache.setwellSqlPool;
}

/**
 * Runs one statement. A `name` makes it a prepared statement: each pooled connection parses and
 * plans it once and reuses the plan, which matters on the hot path. A connection opened after a
 * PostgreSQL restart simply prepares it again.
 */
export async function sql<T extends QueryResultRow>(text: string, values: unknown[], name?: string): Promise<T[]> {
  return (await pool().query<T>(name ? { name, text, values } : { text, values })).rows;
}

export async function closeSqlPool(): Promise<void> {
  const p = cache.setwellSqlPool;
  cache.setwellSqlPool = undefined;
  await p?.end();
}
