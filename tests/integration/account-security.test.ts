/**
 * Accounts from the outside (issue 13): the mail outbox across workspaces, what a password reset
 * ends, sign out everywhere, limits counted before the password is checked, and sign-in errors
 * that never carry a database message. Runs behind a trusted proxy (vitest.config.ts), so each
 * scenario's X-Forwarded-For is its own address; trust-proxy.test.ts covers the direct case.
 */
import { describe, it, expect, beforeAll, vi } from 'vitest';
// The harness first: its next/headers and next/cache mocks must be in place before the actions load.
import {
  asCaller, callRoute, createWorkspace, outbox, signedInCookie, signInThroughNextAuth, waitForMail, TEST_PASSWORD,
  type Caller, type Person, type WorkspaceFixture,
} from './harness';
import { renderToStaticMarkup } from 'react-dom/server';
import type { ReactElement } from 'react';
import { getEm } from '@/lib/db';
import { PasswordReset, User } from '@/entities';
import { authOptions, signInWithPassword } from '@/lib/auth';
import { RESET_LIMITS, SIGN_IN_LIMITS } from '@/lib/rate-limit';
import { requestPasswordResetAction, resetPasswordAction, signOutEverywhereAction } from '@/lib/account/actions';
import { outboxAvailable, LINK_HIDDEN } from '@/lib/outbox';
import { clientAddress } from '@/lib/client-address';
import { assertSameOrigin } from '@/lib/api/route';
import * as membersRoute from '@/app/api/v1/members/route';
import * as meRoute from '@/app/api/v1/me/route';
import OutboxPage from '@/app/(lab)/settings/outbox/page';

// Counts bcrypt evaluations: the limit must stop guesses before the password is checked.
const passwordChecks = vi.hoisted(() => ({ count: 0 }));
vi.mock('@/lib/passwords', async (importOriginal) => {
  const original = await importOriginal<typeof import('@/lib/passwords')>();
  return {
    ...original,
    verifyPassword: (password: string, hash: string | null | undefined) => {
      passwordChecks.count++;
      return original.verifyPassword(password, hash);
    },
  };
});

let a: WorkspaceFixture;
let b: WorkspaceFixture;
beforeAll(async () => {
  a = await createWorkspace('Mail A');
  b = await createWorkspace('Mail B');
});

function form(fields: Record<string, string>): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

let addressCounter = 0;
/** A fresh client address for each scenario (the benchmarking range), so one test's limits never touch another's. */
const freshAddress = () => `198.18.7.${++addressCounter}`;

function askReset(email: string, address = freshAddress()) {
  return asCaller({ kind: 'outsider' }, () => requestPasswordResetAction(null, form({ email })), { 'x-forwarded-for': address });
}

const tokenIn = (text: string, path: string) => new RegExp(`${path}/([A-Za-z0-9_-]+)`).exec(text)?.[1];

async function mailsTo(email: string, subject?: string) {
  return (await outbox()).filter((m) => m.to.includes(email) && (subject === undefined || m.subject === subject));
}

const RESET_SUBJECT = 'Reset your Setwell password';

async function renderOutboxAs(person: Person): Promise<string> {
  const page = await asCaller({ kind: 'session', person }, () => OutboxPage());
  return renderToStaticMarkup(page as ReactElement);
}

async function me(cookie: string): Promise<number> {
  const caller: Caller = { kind: 'session', person: { ...a.people.developer, sessionCookie: cookie } };
  return (await callRoute(meRoute.GET, { method: 'GET', path: '/api/v1/me', caller })).status;
}

describe('cross-workspace mail', () => {
  it("admin of B cannot see A's reset link, A's invitation link or any of A's mail; A's admin sees A's mail without links", async () => {
    const member = a.people.developer;
    await askReset(member.email);
    const resetToken = tokenIn((await waitForMail(member.email, 5000, RESET_SUBJECT)).text, 'reset-password');
    expect(resetToken).toBeDefined();

    const inviteeA = `invitee.a.${Date.now()}@test.example`;
    const invited = await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller: { kind: 'session', person: a.people.admin }, body: { email: inviteeA, role: 'head_of_product' } });
    expect(invited.status).toBe(201);
    const invitationToken = tokenIn((await waitForMail(inviteeA)).text, 'accept-invite');
    expect(invitationToken).toBeDefined();

    const inviteeB = `invitee.b.${Date.now()}@test.example`;
    await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller: { kind: 'session', person: b.people.admin }, body: { email: inviteeB, role: 'taster' } });
    const invitationTokenB = tokenIn((await waitForMail(inviteeB)).text, 'accept-invite');

    const seenByB = await renderOutboxAs(b.people.admin);
    expect(seenByB).toContain(inviteeB);
    for (const secret of [resetToken!, invitationToken!, invitationTokenB!]) expect(seenByB).not.toContain(secret);
    expect(seenByB).not.toContain(inviteeA);
    expect(seenByB).not.toContain(member.email);
    expect(seenByB).not.toContain(a.name);
    expect(seenByB).toContain(LINK_HIDDEN);

    const seenByA = await renderOutboxAs(a.people.admin);
    expect(seenByA).toContain(inviteeA);
    expect(seenByA).not.toContain(invitationToken!);
    expect(seenByA).not.toContain(resetToken!);
    // Password-reset mail belongs to no workspace and is never shown.
    expect(seenByA).not.toContain(RESET_SUBJECT);
    expect(seenByA).not.toContain(inviteeB);
  });

  it('the outbox exists only with the local mail fake: a real relay (or no fake) means no page', () => {
    expect(outboxAvailable()).toBe(true);
    expect(outboxAvailable({ MAIL_OUTBOX_URL: 'http://127.0.0.1:8025', SMTP_URL: 'smtp://user:pw@relay.example.net:587' })).toBe(false);
    expect(outboxAvailable({ MAIL_OUTBOX_URL: undefined, SMTP_URL: 'smtp://127.0.0.1:2525' })).toBe(false);
  });
});

describe('password change ends old sessions', () => {
  it('a session from before a reset gets 401 afterwards; a new sign-in works', async () => {
    const person = a.people.production;
    const before = await signedInCookie(authOptions(), person.email);
    expect(await me(before)).toBe(200);
    expect(await me(person.sessionCookie)).toBe(200);

    await askReset(person.email);
    const token = tokenIn((await waitForMail(person.email, 5000, RESET_SUBJECT)).text, 'reset-password')!;
    expect(await resetPasswordAction(null, form({ token, password: 'bramble-jelly-31', confirm: 'bramble-jelly-31' }))).toMatchObject({ ok: true });

    expect(await me(before)).toBe(401);
    expect(await me(person.sessionCookie)).toBe(401);
    const after = await signedInCookie(authOptions(), person.email, 'bramble-jelly-31');
    expect(await me(after)).toBe(200);
  });

  it('an older reset link is refused after a newer one was used', async () => {
    const person = a.people.taster;
    await askReset(person.email);
    await askReset(person.email);
    const links = (await mailsTo(person.email, RESET_SUBJECT)).map((m) => tokenIn(m.text, 'reset-password')!);
    expect(links.length).toBeGreaterThanOrEqual(2);
    const [newer, older] = links; // newest first
    expect(await resetPasswordAction(null, form({ token: newer, password: 'quince-paste-52', confirm: 'quince-paste-52' }))).toMatchObject({ ok: true });
    expect(await resetPasswordAction(null, form({ token: older, password: 'quince-paste-53', confirm: 'quince-paste-53' }))).toMatchObject({ ok: false, status: 422 });
    const em = await getEm();
    expect(await em.count(PasswordReset, { user: person.userId, usedAt: null })).toBe(0);
  });

  it(`reset requests: ${10} asks for one account send at most ${RESET_LIMITS.perAccount.points} mails, each answered the same`, async () => {
    const ws = await createWorkspace('Reset limit');
    const person = ws.people.developer;
    const answers = [];
    for (let i = 0; i < 10; i++) answers.push(await askReset(person.email));
    expect(new Set(answers.map((x) => JSON.stringify(x))).size).toBe(1);
    expect(answers[0]).toMatchObject({ ok: true });
    await waitForMail(person.email, 5000, RESET_SUBJECT);
    await new Promise((r) => setTimeout(r, 300));
    expect((await mailsTo(person.email, RESET_SUBJECT)).length).toBe(RESET_LIMITS.perAccount.points);
    const em = await getEm();
    expect(await em.count(PasswordReset, { user: person.userId })).toBe(RESET_LIMITS.perAccount.points);
  });

  it(`reset requests: one address gets at most ${RESET_LIMITS.perIp.points} mails across accounts`, async () => {
    const ws = await createWorkspace('Reset spray');
    const address = freshAddress();
    const people = Object.values(ws.people);
    const answers = [];
    for (const p of people) for (let i = 0; i < 3; i++) answers.push(await askReset(p.email, address));
    expect(answers.length).toBeGreaterThan(RESET_LIMITS.perIp.points);
    expect(answers.every((x) => x.ok)).toBe(true);
    await new Promise((r) => setTimeout(r, 500));
    const em = await getEm();
    expect(await em.count(PasswordReset, { user: { $in: people.map((p) => p.userId) } })).toBe(RESET_LIMITS.perIp.points);
  });

  it('sign out everywhere ends every other session (and this one); API tokens keep working', async () => {
    const ws = await createWorkspace('Everywhere');
    const person = ws.people.head_of_product;
    const phone = await signedInCookie(authOptions(), person.email);
    const laptop = await signedInCookie(authOptions(), person.email);
    expect(await me(phone)).toBe(200);

    const res = await asCaller({ kind: 'session', person: { ...person, sessionCookie: laptop } }, () => signOutEverywhereAction());
    expect(res).toMatchObject({ ok: true });
    expect(await me(phone)).toBe(401);
    expect(await me(laptop)).toBe(401);
    const viaToken = await callRoute(meRoute.GET, { method: 'GET', path: '/api/v1/me', caller: { kind: 'token', person } });
    expect(viaToken.status).toBe(200);
    const user = await (await getEm()).findOneOrFail(User, { id: person.userId });
    expect(user.sessionEpoch).toBe(1);
  });
});

describe('limits that hold', () => {
  it(`60 parallel wrong passwords against one account evaluate the password at most ${SIGN_IN_LIMITS.perAccount.points} times`, async () => {
    const ws = await createWorkspace('Race');
    const email = ws.people.admin.email;
    passwordChecks.count = 0;
    const results = await Promise.allSettled(
      Array.from({ length: 60 }, (_, i) => signInWithPassword({ email, password: `wrong-guess-${i}` }, { 'x-forwarded-for': `203.0.113.${i + 1}` })),
    );
    expect(results.every((r) => r.status === 'rejected')).toBe(true);
    const codes = results.map((r) => (r as PromiseRejectedResult).reason.message as string);
    expect(codes.filter((c) => c === 'bad_credentials').length).toBeLessThanOrEqual(SIGN_IN_LIMITS.perAccount.points);
    expect(codes.filter((c) => /^too_many_attempts_\d+$/.test(c)).length).toBeGreaterThanOrEqual(60 - SIGN_IN_LIMITS.perAccount.points);
    expect(passwordChecks.count).toBeLessThanOrEqual(SIGN_IN_LIMITS.perAccount.points);
    // The right password is refused too until the window passes, without being checked.
    const checksBefore = passwordChecks.count;
    await expect(signInWithPassword({ email, password: TEST_PASSWORD }, { 'x-forwarded-for': '203.0.113.99' })).rejects.toThrow(/^too_many_attempts_\d+$/);
    expect(passwordChecks.count).toBe(checksBefore);
  });
});

describe('forwarded headers behind a trusted proxy (TRUST_PROXY=true)', () => {
  it('the address is the right-most X-Forwarded-For entry, the one our proxy appended', () => {
    expect(clientAddress(new Headers({ 'x-forwarded-for': '6.6.6.6, 192.0.2.77' }))).toBe('192.0.2.77');
  });

  it('the Origin check compares with X-Forwarded-Host', () => {
    expect(() => assertSameOrigin(new Headers({ host: '10.0.0.5:3000', 'x-forwarded-host': 'setwell.example', origin: 'https://setwell.example' }))).not.toThrow();
    expect(() => assertSameOrigin(new Headers({ host: '10.0.0.5:3000', 'x-forwarded-host': 'setwell.example', origin: 'https://evil.example' }))).toThrow();
  });
});

describe('sign-in errors never carry a database message', () => {
  const BAD_EMAILS = ['dev\u0000@test.example', 'dev@test.example\u0000', '\u202edev@test.example', 'dev\ud800@test.example', `${'x'.repeat(300)}@test.example`, 'not-an-address'];

  it.each(BAD_EMAILS.map((e) => [JSON.stringify(e), e]))('%s is refused as a plain mismatch before any query', async (_label, email) => {
    const err = await signInWithPassword({ email, password: 'whatever-1' }, { 'x-forwarded-for': freshAddress() }).catch((e: Error) => e);
    expect((err as Error).message).toBe('bad_credentials');
  });

  it('through next-auth, a NUL in the e-mail redirects with our code only', async () => {
    const res = await signInThroughNextAuth(authOptions(), { email: `${a.people.admin.email}\u0000`, password: 'whatever-1' }, { 'x-forwarded-for': freshAddress() });
    const redirect = decodeURIComponent(res.redirect ?? '');
    expect(redirect).toMatch(/error=bad_credentials$/);
    expect(redirect).not.toMatch(/byte|sequence|UTF8|invalid|postgres|select/i);
  });

  it('an unexpected failure inside sign-in maps to the generic code', async () => {
    const failing = new Proxy({}, { get: () => { throw new Error('relation "users" does not exist'); } });
    const err = await signInWithPassword({ email: 'dev@test.example', password: 'x' }, failing).catch((e: Error) => e);
    expect((err as Error).message).toBe('sign_in_failed');
  });
});
