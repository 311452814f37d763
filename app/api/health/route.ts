import { getOrm } from '@/lib/db';
import { checkHealth } from '@/lib/health';

export const dynamic = 'force-dynamic';

/** Liveness and database reachability (a real query, with a deadline), for load balancers. Reveals nothing else. */
export async function GET() {
  const health = await checkHealth(async () => (await getOrm()).em.getConnection().execute('select 1'));
  return Response.json(health, { status: health.status === 'ok' ? 200 : 503, headers: { 'cache-control': 'no-store' } });
}
