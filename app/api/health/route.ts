import { getOrm } from '@/lib/db';

export const dynamic = 'force-dynamic';

/** Liveness and database reachability, for load balancers. Reveals nothing else. */
export async function GET() {
  try {
    const orm = await getOrm();
    await orm.em.getConnection().execute('select 1');
    return Response.json({ status: 'ok', database: 'ok' }, { headers: { 'cache-control': 'no-store' } });
  } catch {
    return Response.json({ status: 'degraded', database: 'unreachable' }, { status: 503 });
  }
}
