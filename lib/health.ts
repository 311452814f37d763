/** The health check's logic, kept apart from the route so it can be tested with any probe. */

export const HEALTH_TIMEOUT_MS = 2000;

export type Health = { status: 'ok'; database: 'ok' } | { status: 'degraded'; database: 'unreachable' | 'timeout' };

/**
 * Runs the database probe with a deadline: a database that hangs (a lost network path, a full
 * pool) must turn the check red within seconds, not leave the load balancer waiting.
 */
export async function checkHealth(probe: () => Promise<unknown>, timeoutMs = HEALTH_TIMEOUT_MS): Promise<Health> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const deadline = new Promise<'timeout'>((resolve) => {
    timer = setTimeout(() => resolve('timeout'), timeoutMs);
  });
  try {
    const outcome = await Promise.race([probe().then(() => 'ok' as const), deadline]);
    return outcome === 'ok' ? { status: 'ok', database: 'ok' } : { status: 'degraded', database: 'timeout' };
  } catch {
    return { status: 'degraded', database: 'unreachable' };
  } finally {
    clearTimeout(timer);
  }
}
