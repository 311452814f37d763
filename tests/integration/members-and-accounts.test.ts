/** Members admin, invitations, password resets and sign-in throttling against the real database and mail fake. */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, waitForMail, asCaller, type WorkspaceFixture } from './harness';
import * as membersRoute from '@/app/api/v1/members/route';
import * as memberRoute from '@/app/api/v1/members/[membershipId]/route';
import { acceptInvitationAction, requestPasswordResetAction, resetPasswordAction } from '@/lib/account/actions';
import { getEm } from '@/lib/db';
import { AuditEvent, Invitation, Membership, User } from '@/entities';
import * as invitationRoute from '@/app/api/v1/invitations/[invitationId]/route';
import { verifyPassword } from '@/lib/passwords';
import { consumeSignInAttempt, signInSucceeded, RateLimited, SIGN_IN_LIMITS } from '@/lib/rate-limit';

let a: WorkspaceFixture;
beforeAll(async () => {
  a = await createWorkspace('Members');
});

const admin = () => ({ kind: 'session' as const, person: a.people.admin });

function form(fields: Record<string, string>) {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

function linkToken(text: string, path: string): string {
  const m = text.match(new RegExp(`${path}/([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${path} link in: ${text}`);
  return m[1];
}

describe('invitations', () => {
  it('sends a mail with a plain-text part, and the link can be used exactly once', async () => {
    const email = `new.dev.${Date.now()}@test.example`;
    const res = await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller: admin(), body: { email, role: 'developer' } });
    expect(res.status).toBe(201);

    const mail = await waitForMail(email);
    expect(mail.subject).toContain(a.name);
    expect(mail.text).toContain('/accept-invite/');
    const token = linkToken(mail.text, 'accept-invite');

    // Only the hash is stored.
    const em = await getEm();
    const stored = await em.findOneOrFail(Invitation, { email });
    expect(stored.tokenHash).not.toContain(token);
    expect(stored.tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const accepted = await acceptInvitationAction(null, form({ token, name: 'New Developer', password: 'quince-jelly-77', confirm: 'quince-jelly-77' }));
    expect(accepted).toMatchObject({ ok: true, data: { email } });

    const user = await em.fork().findOneOrFail(User, { email });
    expect(await verifyPassword('quince-jelly-77', user.passwordHash)).toBe(true);
    const membership = await em.fork().findOneOrFail(Membership, { user: user.id, workspace: a.workspaceId });
    expect(membership.role).toBe('developer');

    const again = await acceptInvitationAction(null, form({ token, name: 'Second Try', password: 'quince-jelly-88', confirm: 'quince-jelly-88' }));
    expect(again).toMatchObject({ ok: false, status: 422 });
    const unchanged = await em.fork().findOneOrFail(User, { email });
    expect(await verifyPassword('quince-jelly-77', unchanged.passwordHash)).toBe(true);
  });

  it('refuses an expired invitation', async () => {
    const email = `late.${Date.now()}@test.example`;
    await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller: admin(), body: { email, role: 'taster' } });
    const token = linkToken((await waitForMail(email)).text, 'accept-invite');
    const em = await getEm();
    await em.nativeUpdate(Invitation, { email }, { expiresAt: new Date(Date.now() - 1000) });
    const res = await acceptInvitationAction(null, form({ token, name: 'Late', password: 'quince-jelly-77', confirm: 'quince-jelly-77' }));
    expect(res).toMatchObject({ ok: false, status: 422 });
    expect(await em.fork().findOne(User, { email })).toBeNull();
  });

  it('rejects bad input with field errors and writes nothing', async () => {
    const em = await getEm();
    const before = await em.count(Invitation, { workspace: a.workspaceId });
    const res = await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller: admin(), body: { email: 'not-an-address', role: 'chef' } });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'role']);
    const unknownField = await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller: admin(), body: { email: 'x@test.example', role: 'taster', isAdmin: true } });
    expect(unknownField.status).toBe(422);
    const badJson = await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller: admin(), body: '{"email":' });
    expect(badJson.status).toBe(400);
    expect(await em.fork().count(Invitation, { workspace: a.workspaceId })).toBe(before);
  });

  it('refuses to invite an existing member (409)', async () => {
    const res = await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller: admin(), body: { email: a.people.taster.email, role: 'taster' } });
    expect(res.status).toBe(409);
  });
});

describe('the last administrator', () => {
  it('cannot be demoted or deactivated, but can once another admin exists', async () => {
    const ws = await createWorkspace('Admins');
    const em = await getEm();
    const adminMembership = await em.findOneOrFail(Membership, { workspace: ws.workspaceId, user: ws.people.admin.userId });
    const caller = { kind: 'session' as const, person: ws.people.admin };
    const path = `/api/v1/members/${adminMembership.id}`;
    const params = { membershipId: adminMembership.id };

    const demote = await callRoute(memberRoute.PATCH, { method: 'PATCH', path, caller, params, body: { role: 'developer' } });
    expect(demote.status).toBe(409);
    const deactivate = await callRoute(memberRoute.PATCH, { method: 'PATCH', path, caller, params, body: { active: false } });
    expect(deactivate.status).toBe(409);
    expect((await em.fork().findOneOrFail(Membership, { id: adminMembership.id })).role).toBe('admin');

    const devMembership = await em.findOneOrFail(Membership, { workspace: ws.workspaceId, user: ws.people.developer.userId });
    const promote = await callRoute(memberRoute.PATCH, {
      method: 'PATCH', path: `/api/v1/members/${devMembership.id}`, caller, params: { membershipId: devMembership.id }, body: { role: 'admin' },
    });
    expect(promote.status).toBe(200);
    const nowDemote = await callRoute(memberRoute.PATCH, { method: 'PATCH', path, caller, params, body: { role: 'developer' } });
    expect(nowDemote.status).toBe(200);
  });

  it('a deactivated member loses access at once', async () => {
    const ws = await createWorkspace('Deactivate');
    const em = await getEm();
    const m = await em.findOneOrFail(Membership, { workspace: ws.workspaceId, user: ws.people.production.userId });
    const off = await callRoute(memberRoute.PATCH, {
      method: 'PATCH', path: `/api/v1/members/${m.id}`, caller: { kind: 'session', person: ws.people.admin }, params: { membershipId: m.id }, body: { active: false },
    });
    expect(off.status).toBe(200);
    const me = await import('@/app/api/v1/me/route');
    const res = await callRoute(me.GET, { method: 'GET', path: '/api/v1/me', caller: { kind: 'session', person: ws.people.production } });
    expect(res.status).toBe(401);
  });
});

describe('membership changes in the audit trail', () => {
  // A walk found role changes nowhere in the trail: who made whom an administrator must be on record.
  it('records invitations, revocations, role changes and (de)activations, with who did them, and nothing for a no-op', async () => {
    const ws = await createWorkspace('Audited members');
    const caller = { kind: 'session' as const, person: ws.people.admin };
    const em = await getEm();
    const m = await em.findOneOrFail(Membership, { workspace: ws.workspaceId, user: ws.people.taster.userId });
    const patch = (body: object) => callRoute(memberRoute.PATCH, { method: 'PATCH', path: `/api/v1/members/${m.id}`, caller, params: { membershipId: m.id }, body });

    expect((await patch({ role: 'production' })).status).toBe(200);
    expect((await patch({ role: 'production' })).status).toBe(200);
    expect((await patch({ active: false })).status).toBe(200);
    expect((await patch({ active: true })).status).toBe(200);
    const email = `audited.${Date.now()}@test.example`;
    const invited = await callRoute(membersRoute.POST, { method: 'POST', path: '/api/v1/members', caller, body: { email, role: 'developer' } });
    expect(invited.status).toBe(201);
    const invitationId = (invited.body as { invitation: { invitationId: string } }).invitation.invitationId;
    const revoked = await callRoute(invitationRoute.DELETE, { method: 'DELETE', path: `/api/v1/invitations/${invitationId}`, caller, params: { invitationId } });
    expect(revoked.status).toBe(200);

    const events = await em.fork().find(AuditEvent, { workspace: ws.workspaceId }, { orderBy: { at: 'asc' } });
    const adminName = (await em.fork().findOneOrFail(User, { id: ws.people.admin.userId })).name;
    const tasterName = (await em.fork().findOneOrFail(User, { id: ws.people.taster.userId })).name;
    expect(events.map((e) => e.action)).toEqual(['member.role_changed', 'member.deactivated', 'member.reactivated', 'member.invited', 'member.invitation_revoked']);
    expect(events.every((e) => e.actorName === adminName && e.actorRole === 'admin')).toBe(true);
    expect(events[0].summary).toBe(`${tasterName} (${ws.people.taster.email}): Taster → Production lead`);
    expect(events[0].subjectId).toBe(m.id);
    expect(events[3].summary).toBe(`Invited ${email} as Product developer`);
    expect(events[4].summary).toBe(`Revoked the invitation to ${email}`);
  });

  it('a refused change (the last administrator) writes nothing', async () => {
    const ws = await createWorkspace('Audited refusal');
    const em = await getEm();
    const own = await em.findOneOrFail(Membership, { workspace: ws.workspaceId, user: ws.people.admin.userId });
    const res = await callRoute(memberRoute.PATCH, { method: 'PATCH', path: `/api/v1/members/${own.id}`, caller: { kind: 'session', person: ws.people.admin }, params: { membershipId: own.id }, body: { role: 'taster' } });
    expect(res.status).toBe(409);
    expect(await em.fork().count(AuditEvent, { workspace: ws.workspaceId })).toBe(0);
  });
});

describe('password reset', () => {
  it('mails a single-use link and changes the password', async () => {
    const person = a.people.head_of_product;
    const asked = await asCaller({ kind: 'outsider' }, () => requestPasswordResetAction(null, form({ email: person.email.toUpperCase() })), { 'x-forwarded-for': '192.0.2.61' });
    expect(asked.ok).toBe(true);
    const token = linkToken((await waitForMail(person.email)).text, 'reset-password');

    const weak = await resetPasswordAction(null, form({ token, password: 'short', confirm: 'short' }));
    expect(weak).toMatchObject({ ok: false, status: 422 });
    expect(weak.ok === false && weak.fields?.password?.length).toBeTruthy();

    const done = await resetPasswordAction(null, form({ token, password: 'marmalade-2027', confirm: 'marmalade-2027' }));
    expect(done.ok).toBe(true);
    const user = await (await getEm()).findOneOrFail(User, { email: person.email });
    expect(await verifyPassword('marmalade-2027', user.passwordHash)).toBe(true);

    const reuse = await resetPasswordAction(null, form({ token, password: 'marmalade-2028', confirm: 'marmalade-2028' }));
    expect(reuse).toMatchObject({ ok: false, status: 422 });
  });

  it('answers the same for an unknown address and sends nothing', async () => {
    const res = await asCaller({ kind: 'outsider' }, () => requestPasswordResetAction(null, form({ email: 'nobody.here@test.example' })), { 'x-forwarded-for': '192.0.2.62' });
    expect(res.ok).toBe(true);
    await expect(waitForMail('nobody.here@test.example', 500)).rejects.toThrow();
  });
});

describe('sign-in throttling', () => {
  // Every attempt is counted before the password is checked (see account-security.test.ts for the race).
  it(`blocks an account after ${SIGN_IN_LIMITS.perAccount.points} attempts, with a wait time in the message`, async () => {
    const email = `throttle.${Date.now()}@test.example`;
    for (let i = 0; i < SIGN_IN_LIMITS.perAccount.points; i++) {
      await expect(consumeSignInAttempt(email, '203.0.113.7')).resolves.toBeUndefined();
    }
    const blocked = await consumeSignInAttempt(email, '203.0.113.7').catch((e: unknown) => e);
    expect(blocked).toBeInstanceOf(RateLimited);
    expect((blocked as Error).message).toMatch(/Wait \d+ minutes?/);
    // Another account from another address is unaffected.
    await expect(consumeSignInAttempt(`other.${email}`, '203.0.113.8')).resolves.toBeUndefined();
  });

  it(`blocks an address after ${SIGN_IN_LIMITS.perIp.points} attempts across accounts`, async () => {
    const ip = '198.51.100.23';
    for (let i = 0; i < SIGN_IN_LIMITS.perIp.points; i++) await consumeSignInAttempt(`spray${i}.${Date.now()}@test.example`, ip);
    await expect(consumeSignInAttempt('fresh@test.example', ip)).rejects.toBeInstanceOf(RateLimited);
  });

  it('a success clears the account counter and gives the address its attempt back', async () => {
    const email = `recover.${Date.now()}@test.example`;
    for (let i = 0; i < SIGN_IN_LIMITS.perAccount.points - 1; i++) await consumeSignInAttempt(email, '192.0.2.50');
    await signInSucceeded(email, '192.0.2.50');
    for (let i = 0; i < SIGN_IN_LIMITS.perAccount.points; i++) await expect(consumeSignInAttempt(email, '192.0.2.52')).resolves.toBeUndefined();
    await expect(consumeSignInAttempt(email, '192.0.2.52')).rejects.toBeInstanceOf(RateLimited);
  });
});
