import { getOrm } from '@/lib/db';
import { checkHealth } from '@/lib/health';
import { RETRY_AFTER_SECONDS } from '@/lib/api/errors';

export const dynamic = 'force-dynamic';

/** Liveness and database reachability (a real query, with a deadline), for load balancers. Reveals nothing else. */
export async function GET() {
  const health = await checkHealth(async () => (await getOrm()).em.getConnection().execute('select 1'));
  if (health.status === 'ok') return Response.json(health, { headers: { 'cache-control': 'no-store' } });
  return Response.json(health, { status: 503, headers: { 'cache-control': 'no-store', 'retry-after': String(RETRY_AFTER_SECONDS) } });
}
