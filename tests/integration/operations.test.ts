/** Operations: the health check and what the logs may hold (no secrets, tokens or taster answers). */
import { describe, it, expect, vi, afterEach } from 'vitest';
import { Writable } from 'node:stream';
import { randomUUID } from 'node:crypto';
import pino from 'pino';
import './harness';
import { GET as health } from '@/app/api/health/route';
import { checkHealth } from '@/lib/health';
import { logger, logOptions, pathForLog } from '@/lib/log';
import { publicRoute } from '@/lib/api/route';
import { getEm } from '@/lib/db';
import { hashSecret, newSecret } from '@/lib/secrets';

/** A logger with the app's options that writes into memory, so a test can read every line. */
function capturingLogger() {
  const lines: string[] = [];
  const sink = new Writable({
    write(chunk, _enc, done) {
      lines.push(...String(chunk).split('\n').filter(Boolean));
      done();
    },
  });
  return { log: pino({ ...logOptions, level: 'info' }, sink), text: () => lines.join('\n'), lines };
}

/**
 * A real not-null violation: the statement carries a password hash and the e-mail inline, and
 * PostgreSQL's detail quotes the whole failing row.
 */
async function failingInsert(email: string, passwordHash: string): Promise<Error & { code?: string }> {
  const conn = (await getEm()).getConnection();
  return conn
    .execute(`insert into users (id, email, name, password_hash, mass_units, temperature_unit, created_at) values (?, ?, null, ?, 'metric', 'C', now())`, [randomUUID(), email, passwordHash])
    .then(
      () => {
        throw new Error('the insert should have failed');
      },
      (err: Error & { code?: string }) => err,
    );
}

afterEach(() => {
  vi.restoreAllMocks();
});

describe('health check', () => {
  it('runs a real query against the database and says ok', async () => {
    const res = await health();
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('no-store');
    expect(await res.json()).toEqual({ status: 'ok', database: 'ok' });
  });

  it('turns red when the database fails or hangs, within its deadline', async () => {
    expect(await checkHealth(() => Promise.reject(new Error('connect ECONNREFUSED')))).toEqual({ status: 'degraded', database: 'unreachable' });
    const started = Date.now();
    expect(await checkHealth(() => new Promise(() => undefined), 100)).toEqual({ status: 'degraded', database: 'timeout' });
    expect(Date.now() - started).toBeLessThan(2000);
  });
});

describe('logs', () => {
  it('a database error carries no statement values and no row details, from the source on', async () => {
    const marker = `$2b$12$${randomUUID().replace(/-/g, '')}`;
    const email = `log.${randomUUID().slice(0, 8)}@test.example`;
    const err = await failingInsert(email, marker);
    expect(err.code).toBe('23502');
    // The ORM's message no longer starts with the statement (which held the hash inline).
    expect(err.message).not.toContain(marker);
    expect(err.message).not.toContain(email);
    expect(err.message).toContain('violates not-null constraint');

    const { log, text } = capturingLogger();
    log.error({ err }, 'api handler failed');
    const out = text();
    expect(out).toContain('23502');
    expect(out).toContain('violates not-null constraint');
    expect(out).not.toContain(marker);
    expect(out).not.toContain(email); // the detail "Failing row contains (…)" is dropped
    expect(out).not.toContain('insert into');
  });

  it('a failing tasting request logs a masked path: no seat token, no answer, no idempotency key', async () => {
    const token = newSecret('sws_');
    const key = randomUUID();
    const marker = `$2b$12$${randomUUID().replace(/-/g, '')}`;
    const dbError = await failingInsert(`log.${randomUUID().slice(0, 8)}@test.example`, marker);
    // Capture what the route adapter hands to the logger, then write it with the app's options.
    const calls: unknown[][] = [];
    vi.spyOn(logger, 'error').mockImplementation(((...args: unknown[]) => {
      calls.push(args);
    }) as never);
    const route = publicRoute<{ seatToken: string }>(async () => {
      throw dbError;
    });
    const req = new Request(`http://127.0.0.1/api/v1/tastings/seats/${token}/answers?k=${token}`, {
      method: 'PUT', headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
      body: JSON.stringify({ idempotencyKey: key, code: '427', attributeId: randomUUID(), value: 7 }),
    });
    const res = await route(req, { params: Promise.resolve({ seatToken: token }) });
    expect(res.status).toBe(500);
    expect(calls).toHaveLength(1);
    const { log, text } = capturingLogger();
    log.error(...(calls[0] as [object, string]));
    const out = text();
    expect(out).toContain('/api/v1/tastings/seats/sws_[redacted]/answers');
    for (const secret of [token, token.slice(4), hashSecret(token), key, marker]) expect(out).not.toContain(secret);
    expect(out).not.toMatch(/"value":\s*7/);
  });

  it('masks tokens in any logged path and redacts fields named like secrets', () => {
    expect(pathForLog('http://x/accept-invite/abcDEF123?x=1')).toBe('/accept-invite/[redacted]');
    expect(pathForLog('http://x/reset-password/zzz')).toBe('/reset-password/[redacted]');
    expect(pathForLog('http://x/api/v1/tastings/seats/sws_Ab-9_x/submit')).toBe('/api/v1/tastings/seats/sws_[redacted]/submit');
    expect(pathForLog('http://x/api/v1/formulas?token=swt_abc')).toBe('/api/v1/formulas');
    const { log, text } = capturingLogger();
    log.info({ password: 'hunter2-pass', user: { passwordHash: 'h4sh', token: 'swt_zzz' }, authorization: 'Bearer swt_yyy', answer: { value: 8, idempotencyKey: 'k-123' } }, 'test line');
    const out = text();
    for (const s of ['hunter2-pass', 'h4sh', 'swt_zzz', 'swt_yyy', 'k-123', '"value":8']) expect(out).not.toContain(s);
    expect(out).toContain('test line');
  });
});
