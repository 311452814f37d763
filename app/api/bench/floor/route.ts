/**
 * The benchmark's floor: one plain INSERT through a pooled `pg` client, behind the same framework.
 * It exists only when the server was started with SETWELL_BENCH_FLOOR=1 (npm run bench does);
 * otherwise it answers 404 like any unknown path.
 */
import { Pool } from 'pg';
import { json } from '@/lib/api/route';

export const dynamic = 'force-dynamic';

/** Typed in lib/process-cache.ts. */
const cache = globalThis;

function pool(): Pool {
  if (!cache.setwellBenchPool) {
    cache.setwellBenchPool = new Pool({ connectionString: process.env.DATABASE_URL, max: 10 });
    cache.setwellBenchPool.on('error', () => undefined);
  }
  return cache.setwellBenchPool;
}

export async function POST(req: Request): Promise<Response> {
  if (process.env.SETWELL_BENCH_FLOOR !== '1') return json({ error: { code: 'not_found', message: 'No such page.' } }, 404);
  const body = await req.text();
  await pool().query('insert into bench_floor (seat, body) values ($1, $2)', [req.headers.get('x-bench-seat') ?? '', body]);
  return json({ stored: true });
}
