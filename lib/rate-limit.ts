/**
 * Sign-in throttling, with counters in PostgreSQL (rate-limiter-flexible's Postgres store)
 * so that several app servers share them. Failed attempts count; a success clears the
 * account's counter.
 */
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { Pool } from 'pg';
import { env } from '@/lib/env';
import { logger } from '@/lib/log';

export const SIGN_IN_LIMITS = {
  perAccount: { points: 5, durationSeconds: 15 * 60 },
  perIp: { points: 30, durationSeconds: 15 * 60 },
} as const;

export class RateLimited extends Error {
  constructor(readonly retryAfterSeconds: number) {
    const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
    super(`Too many sign-in attempts. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`);
    this.name = 'RateLimited';
  }
}

export const JOIN_LIMIT = { points: 20, durationSeconds: 10 * 60 } as const;

type Limiters = { account: RateLimiterPostgres; ip: RateLimiterPostgres; join: RateLimiterPostgres; pool: Pool };
const cache = globalThis as unknown as { setwellLimiters?: Limiters };

function limiters(): Limiters {
  if (cache.setwellLimiters) return cache.setwellLimiters;
  const pool = new Pool({ connectionString: env().DATABASE_URL, max: 4 });
  // An idle client dies when PostgreSQL restarts; without a listener that error would end the process.
  pool.on('error', (err) => logger.warn({ err: err.message }, 'rate-limit pool lost a connection'));
  const common = { storeClient: pool, storeType: 'pool', tableName: 'rate_limits', tableCreated: true, clearExpiredByTimeout: false };
  cache.setwellLimiters = {
    pool,
    account: new RateLimiterPostgres({ ...common, keyPrefix: 'signin-account', points: SIGN_IN_LIMITS.perAccount.points, duration: SIGN_IN_LIMITS.perAccount.durationSeconds }),
    ip: new RateLimiterPostgres({ ...common, keyPrefix: 'signin-ip', points: SIGN_IN_LIMITS.perIp.points, duration: SIGN_IN_LIMITS.perIp.durationSeconds }),
    join: new RateLimiterPostgres({ ...common, keyPrefix: 'join-ip', points: JOIN_LIMIT.points, duration: JOIN_LIMIT.durationSeconds }),
  };
  return cache.setwellLimiters;
}

async function remainingBlock(limiter: RateLimiterPostgres, key: string, points: number): Promise<number> {
  const res = await limiter.get(key);
  if (res && res.consumedPoints >= points) return Math.ceil(res.msBeforeNext / 1000);
  return 0;
}

/** Throws RateLimited when the account or the address has used up its attempts. */
export async function checkSignInAllowed(email: string, ip: string): Promise<void> {
  const l = limiters();
  const wait = Math.max(
    await remainingBlock(l.account, email, SIGN_IN_LIMITS.perAccount.points),
    await remainingBlock(l.ip, ip, SIGN_IN_LIMITS.perIp.points),
  );
  if (wait > 0) throw new RateLimited(wait);
}

export async function recordSignInFailure(email: string, ip: string): Promise<void> {
  const l = limiters();
  await Promise.all([
    l.account.penalty(email, 1).catch(ignoreLimit),
    l.ip.penalty(ip, 1).catch(ignoreLimit),
  ]);
}

export async function recordSignInSuccess(email: string): Promise<void> {
  await limiters().account.delete(email);
}

function ignoreLimit(err: unknown) {
  if (err instanceof RateLimiterRes) return;
  throw err;
}

/** Join-code guesses per address: every attempt counts, so codes cannot be walked. */
export async function consumeJoinAttempt(ip: string): Promise<void> {
  try {
    await limiters().join.consume(ip, 1);
  } catch (err) {
    if (err instanceof RateLimiterRes) {
      const minutes = Math.max(1, Math.ceil(err.msBeforeNext / 60000));
      throw Object.assign(new Error(`Too many tries with join codes. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`), { name: 'RateLimited', retryAfterSeconds: Math.ceil(err.msBeforeNext / 1000) });
    }
    throw err;
  }
}
