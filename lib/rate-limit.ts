import 'server-only';
/**
 * Rate limits, with counters in PostgreSQL (rate-limiter-flexible's Postgres store) so that
 * several app servers share them. Every limit counts the attempt first, in one statement
 * (INSERT … ON CONFLICT DO UPDATE … RETURNING points), and refuses when the count is past the
 * limit: parallel attempts cannot all pass a check before any of them is counted.
 */
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { Pool } from 'pg';
import { env } from '@/lib/env';
import { logger } from '@/lib/log';

export const SIGN_IN_LIMITS = {
  perAccount: { points: 5, durationSeconds: 15 * 60 },
  perIp: { points: 30, durationSeconds: 15 * 60 },
} as const;

/** Reset mails: a few per account, more per address (one office may share one). */
export const RESET_LIMITS = {
  perAccount: { points: 3, durationSeconds: 60 * 60 },
  perIp: { points: 10, durationSeconds: 60 * 60 },
} as const;

export const JOIN_LIMIT = { points: 20, durationSeconds: 10 * 60 } as const;

export class RateLimited extends Error {
  constructor(readonly retryAfterSeconds: number, what = 'sign-in attempts') {
    const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
    super(`Too many ${what}. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`);
    this.name = 'RateLimited';
  }
}

type LimiterName = 'signInAccount' | 'signInIp' | 'resetAccount' | 'resetIp' | 'join';
export type Limiters = Record<LimiterName, RateLimiterPostgres> & { pool: Pool };
/** Typed in lib/process-cache.ts. */
const cache = globalThis;

function limiters(): Limiters {
  if (cache.setwellLimiters) return cache.setwellLimiters;
  const pool = new Pool({ connectionString: env().DATABASE_URL, max: 4 });
  // An idle client dies when PostgreSQL restarts; without a listener that error would end the process.
  pool.on('error', (err) => logger.warn({ err: err.message }, 'rate-limit pool lost a connection'));
  const common = { storeClient: pool, storeType: 'pool', tableName: 'rate_limits', tableCreated: true, clearExpiredByTimeout: false };
  const limiter = (keyPrefix: string, limit: { points: number; durationSeconds: number }) =>
    new RateLimiterPostgres({ ...common, keyPrefix, points: limit.points, duration: limit.durationSeconds });
  cache.setwellLimiters = {
    pool,
    signInAccount: limiter('signin-account', SIGN_IN_LIMITS.perAccount),
    signInIp: limiter('signin-ip', SIGN_IN_LIMITS.perIp),
    resetAccount: limiter('reset-account', RESET_LIMITS.perAccount),
    resetIp: limiter('reset-ip', RESET_LIMITS.perIp),
    join: limiter('join-ip', JOIN_LIMIT),
  };
  return cache.setwellLimiters;
}

/**
 * Counts one attempt against every key and answers how long to wait when any of them is past
 * its limit (0: allowed). Every key is counted even when one refuses, so a refused attempt is
 * an attempt too.
 */
async function consume(keys: Array<[LimiterName, string]>): Promise<number> {
  const l = limiters();
  const waits = await Promise.all(
    keys.map(([name, key]) =>
      l[name].consume(key, 1).then(
        () => 0,
        (err: unknown) => {
          if (err instanceof RateLimiterRes) return Math.max(1, Math.ceil(err.msBeforeNext / 1000));
          throw err;
        },
      ),
    ),
  );
  return Math.max(0, ...waits);
}

/**
 * Counts a sign-in attempt for the account and the address BEFORE the password is checked;
 * throws RateLimited when either is past its limit. A success gives both back (signInSucceeded).
 */
export async function consumeSignInAttempt(email: string, address: string): Promise<void> {
  const wait = await consume([['signInAccount', email], ['signInIp', address]]);
  if (wait > 0) throw new RateLimited(wait);
}

/** Only failures should stay counted: clear the account's counter and return the address's point. */
export async function signInSucceeded(email: string, address: string): Promise<void> {
  const l = limiters();
  await Promise.all([l.signInAccount.delete(email), l.signInIp.reward(address, 1)]);
}

/** True when another reset mail may go to this account from this address (the attempt is counted either way). */
export async function consumeResetRequest(email: string, address: string): Promise<boolean> {
  return (await consume([['resetAccount', email], ['resetIp', address]])) === 0;
}

/** Join-code guesses per address: every attempt counts, so codes cannot be walked. */
export async function consumeJoinAttempt(address: string): Promise<void> {
  const wait = await consume([['join', address]]);
  if (wait > 0) throw new RateLimited(wait, 'tries with join codes');
}
