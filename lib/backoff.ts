/**
 * PURE: how long to wait before the n-th retry (n counts from 1): the first delay, doubling each
 * time, never more than the cap. The one back-off of the app (notebook saves, the phone's outbox).
 */
export function backoffDelayMs(retry: number, { firstMs, maxMs }: { firstMs: number; maxMs: number }): number {
  const n = Number.isFinite(retry) ? Math.max(1, Math.floor(retry)) : 1;
  return Math.min(maxMs, firstMs * 2 ** Math.min(n - 1, 30));
}
