/**
 * Security basics, each asserting something that fails if the protection is removed.
 *
 * Where the other checks live (not repeated here):
 * - API authorisation matrix (401/403/404 per role and workspace): tests/integration/authorization.test.ts
 * - Origin check on a cookie-authenticated API write from a foreign origin: authorization.test.ts ("cookie-authenticated writes")
 * - Sign-in throttling per account and per address: tests/integration/members-and-accounts.test.ts ("sign-in throttling"),
 *   counted before the password is checked: account-security.test.ts ("limits that hold"),
 *   and in the browser: tests/e2e/platform.test.ts ("the rate limit kicks in…")
 * - Forwarded headers ignored without TRUST_PROXY (limits, Origin): tests/integration/trust-proxy.test.ts
 * - The mail outbox across workspaces, what a password reset ends, sign out everywhere, reset limits, sign-in
 *   error codes: tests/integration/account-security.test.ts, tests/unit/security/sign-in-errors.test.ts,
 *   tests/e2e/accounts.test.ts
 * - Join-code guesses rate-limited per address: tests/integration/tastings.test.ts ("join-code guesses are rate-limited")
 * - Invitation links stored as SHA-256 only: members-and-accounts.test.ts ("Only the hash is stored")
 * - Uploads typed by their bytes (renamed programs, archives, HEIC, NUL-byte CSV; 413/415): tests/integration/uploads.test.ts
 * - Rich text validated node by node and rendered through the schema (no <script>, no onerror, javascript: links refused):
 *   tests/unit/notebook/schema.test.ts, tests/unit/notebook/view.test.tsx, tests/unit/notebook/editor.test.tsx
 * - Fuzzed bodies, ids and queries on every API operation (4xx, error shape, nothing written): tests/integration/fuzz.test.ts
 * - Content-Security-Policy: tests/unit/security/csp.test.ts (the policy) and tests/e2e/security.test.ts (in chromium)
 * - Framing, nosniff, referrer policy headers: tests/e2e/platform.test.ts ("baseline security headers")
 */
import { describe, it, expect, beforeAll } from 'vitest';
// The harness first: its next/headers and next/cache mocks must be in place before the actions load.
import { asCaller, callRoute, createWorkspace, lastSetCookies, waitForMail, signInThroughNextAuth, TEST_PASSWORD, type WorkspaceFixture } from './harness';
import { createHash } from 'node:crypto';
import { getEm } from '@/lib/db';
import { ApiToken, TastingSeat, PasswordReset, User } from '@/entities';
import { authOptions } from '@/lib/auth';
import { hashPassword } from '@/lib/passwords';
import { passwordSchema, PASSWORD_RULES } from '@/lib/password-rules';
import { updatePreferencesAction, requestPasswordResetAction } from '@/lib/account/actions';
import { switchWorkspaceAction } from '@/lib/workspaces/actions';
import * as tokensRoute from '@/app/api/v1/tokens/route';
import * as joinRoute from '@/app/api/v1/tastings/join/route';
import { tastingFixture } from './access-tastings';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

let a: WorkspaceFixture;
beforeAll(async () => {
  a = await createWorkspace('Security kitchen');
});

function form(fields: Record<string, string>): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

/** The whole stored row as text, to show the secret appears nowhere in it. */
async function rowText(table: string, id: string): Promise<string> {
  const rows = (await (await getEm()).getConnection().execute(`select to_jsonb(x)::text as t from "${table}" x where id = ?`, [id])) as Array<{ t: string }>;
  return rows[0].t;
}

describe('session cookie', () => {
  // next-auth's own handler, given our options: sign in with the credentials provider and read the cookie it sets.
  async function signInCookies(options: ReturnType<typeof authOptions>) {
    return (await signInThroughNextAuth(options, { email: a.people.developer.email, password: TEST_PASSWORD })).cookies;
  }

  it('is HttpOnly and SameSite=Lax, and not Secure on plain http', async () => {
    expect(process.env.APP_URL).toMatch(/^http:\/\//);
    const session = (await signInCookies(authOptions())).find((c) => c.name.endsWith('next-auth.session-token'));
    expect(session, 'a session cookie was set').toBeDefined();
    expect(session!.name).toBe('next-auth.session-token');
    expect(session!.options).toMatchObject({ httpOnly: true, sameSite: 'lax', path: '/' });
    expect(session!.options.secure).toBeFalsy();
  });

  it('is Secure (and __Secure- prefixed) when APP_URL is https', async () => {
    const options = authOptions('https://setwell.example');
    expect(options.useSecureCookies).toBe(true);
    const session = (await signInCookies(options)).find((c) => c.name.endsWith('next-auth.session-token'));
    expect(session!.name).toBe('__Secure-next-auth.session-token');
    expect(session!.options).toMatchObject({ httpOnly: true, sameSite: 'lax', secure: true });
  });

  it('the workspace choice cookie is HttpOnly and SameSite=Lax too', async () => {
    await asCaller({ kind: 'session', person: a.people.developer }, () => switchWorkspaceAction(a.workspaceId));
    const cookie = lastSetCookies().find((c) => c.name === 'setwell-workspace');
    expect(cookie?.options).toMatchObject({ httpOnly: true, sameSite: 'lax', secure: false });
  });
});

describe('Origin on cookie-authenticated writes', () => {
  const dev = () => ({ kind: 'session' as const, person: a.people.developer });
  const prefs = () => form({ name: 'Security Person', massUnits: 'metric', temperatureUnit: 'C' });

  it('a server action from another origin, or with no Origin, is refused (403) and changes nothing', async () => {
    const forged = () => form({ name: 'Changed by a forged form', massUnits: 'imperial', temperatureUnit: 'F' });
    for (const origin of ['https://evil.example', null]) {
      const res = await asCaller(dev(), () => updatePreferencesAction(null, forged()), { origin });
      expect(res, String(origin)).toMatchObject({ ok: false, status: 403 });
    }
    const user = await (await getEm()).findOneOrFail(User, { id: a.people.developer.userId });
    expect(user.name).not.toBe('Changed by a forged form');
    const ok = await asCaller(dev(), () => updatePreferencesAction(null, prefs()));
    expect(ok.ok).toBe(true);
  });

  it('an API write with the session cookie and no Origin is refused; with an API token the Origin does not matter', async () => {
    const noOrigin = await callRoute(tokensRoute.POST, { method: 'POST', path: '/api/v1/tokens', caller: dev(), body: { label: 'no origin' }, headers: { origin: null } });
    expect(noOrigin.status).toBe(403);
    expect(noOrigin.body.error.code).toBe('bad_origin');
    const viaToken = await callRoute(tokensRoute.POST, {
      method: 'POST',
      path: '/api/v1/tokens',
      caller: { kind: 'token', person: a.people.developer },
      body: { label: 'scripted' },
      headers: { origin: 'https://elsewhere.example' },
    });
    expect(viaToken.status).toBe(201);
  });
});

describe('password rules', () => {
  // Project rules (lib/passwords.ts), shown to users as PASSWORD_RULES. NIST SP 800-63B §5.1.1.2 asks for
  // at least 8 characters and a length limit of at least 64; we ask for 10 and allow 200.
  it.each([
    ['short-1', 'too short'],
    ['abcdefghij', 'letters only'],
    ['1234567890', 'no letter'],
    ['aaaa1aaaa1', 'too few different characters'],
    ['quince-jelly-77'.repeat(14), 'longer than 200'],
  ])('refuses %s (%s)', (pw) => {
    expect(passwordSchema.safeParse(pw).success).toBe(false);
  });

  it('accepts a password that meets every rule, and the rules text says the same minimum', () => {
    expect(passwordSchema.safeParse('quince-jelly-77').success).toBe(true);
    expect(PASSWORD_RULES).toContain('10 characters');
    expect(passwordSchema.safeParse('abcdefgh1').success).toBe(false);
    expect(passwordSchema.safeParse('abcdefgh12').success).toBe(true);
  });

  it('stores passwords as bcrypt hashes with a work factor of at least 10', async () => {
    const hash = await hashPassword('quince-jelly-77');
    const m = /^\$2[aby]\$(\d{2})\$/.exec(hash);
    expect(m, hash).not.toBeNull();
    expect(Number(m![1])).toBeGreaterThanOrEqual(10);
    expect(hash).not.toContain('quince');
  });
});

describe('secrets are stored as SHA-256 only', () => {
  it('an API token: the response shows it once, the row holds only its hash', async () => {
    const res = await callRoute(tokensRoute.POST, { method: 'POST', path: '/api/v1/tokens', caller: { kind: 'session', person: a.people.admin }, body: { label: 'hash check' } });
    expect(res.status).toBe(201);
    const secret: string = res.body.token.secret;
    const row = await (await getEm()).findOneOrFail(ApiToken, { id: res.body.token.tokenId });
    expect(row.tokenHash).toBe(sha256(secret));
    expect(await rowText('api_tokens', row.id)).not.toContain(secret.slice(10));
  });

  it('a password-reset link: the mail carries it, the row holds only its hash', async () => {
    const person = a.people.head_of_product;
    await asCaller({ kind: 'outsider' }, () => requestPasswordResetAction(null, form({ email: person.email })), { 'x-forwarded-for': '192.0.2.63' });
    const token = /reset-password\/([A-Za-z0-9_-]+)/.exec((await waitForMail(person.email)).text)![1];
    const row = await (await getEm()).findOneOrFail(PasswordReset, { tokenHash: sha256(token) });
    expect(await rowText('password_resets', row.id)).not.toContain(token);
  });

  it("a taster's seat token: the phone gets it, the row holds only its hash", async () => {
    const p = await tastingFixture(a);
    const res = await callRoute(joinRoute.POST, {
      method: 'POST',
      path: '/api/v1/tastings/join',
      caller: { kind: 'outsider' },
      body: { joinCode: p.joinCode, displayName: 'Hash guest' },
      headers: { 'x-forwarded-for': '192.0.2.44' },
    });
    expect(res.status).toBe(201);
    const seatToken: string = res.body.seatToken;
    const row = await (await getEm()).findOneOrFail(TastingSeat, { tokenHash: sha256(seatToken) });
    expect(await rowText('panel_seats', row.id)).not.toContain(seatToken);
  });
});
