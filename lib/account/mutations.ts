import 'server-only';
/** Signed-out account flows and the user's own preferences. */
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { Invitation, Membership, PasswordReset, User, Workspace } from '@/entities';
import { hashPassword } from '@/lib/passwords';
import { hashSecret, newSecret } from '@/lib/secrets';
import { sendMail, escapeHtml } from '@/lib/mail';
import { env } from '@/lib/env';
import { ValidationFailed } from '@/lib/errors';
import { consumeResetRequest } from '@/lib/rate-limit';
import type { Actor } from '@/lib/permissions';
import type { AcceptInvitationInput, PreferencesInput, ResetPasswordInput } from './schema';

export const RESET_LIFETIME_MINUTES = 60;

const linkInvalid = () =>
  new ValidationFailed('This link has expired or was already used. Ask for a new one.', { token: ['This link has expired or was already used.'] });

/**
 * Uses the invitation exactly once: the conditional UPDATE claims it, so two tabs
 * submitting the same link cannot both succeed. An existing account keeps its password.
 */
export async function acceptInvitation(input: AcceptInvitationInput): Promise<{ email: string }> {
  const em = await getEm();
  const passwordHash = await hashPassword(input.password);
  return em.transactional(async (tx) => {
    const claimed = await tx.nativeUpdate(
      Invitation,
      { tokenHash: hashSecret(input.token), acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } },
      { acceptedAt: new Date() },
    );
    if (claimed !== 1) throw linkInvalid();
    const inv = await tx.findOneOrFail(Invitation, { tokenHash: hashSecret(input.token) });
    const workspaceId = inv.workspace.id;
    let user = await tx.findOne(User, { email: inv.email });
    if (!user) {
      user = tx.create(User, { email: inv.email, name: input.name, passwordHash });
    } else if (!user.passwordHash) {
      user.passwordHash = passwordHash;
      user.name = input.name;
    }
    const existing = await tx.findOne(Membership, { workspace: workspaceId, user: user.id });
    if (existing) {
      existing.active = true;
      existing.role = inv.role;
    } else {
      tx.create(Membership, { workspace: workspaceId, user, role: inv.role });
    }
    await tx.flush();
    await tx.findOneOrFail(Workspace, { id: workspaceId });
    return { email: inv.email };
  });
}

/**
 * Always succeeds from the caller's view, so the form does not reveal which e-mails have accounts
 * or that a limit was reached: past RESET_LIMITS (per account, per address) no mail is sent.
 */
export async function requestPasswordReset(email: string, address: string): Promise<void> {
  if (!(await consumeResetRequest(email, address))) return;
  const em = await getEm();
  const user = await em.findOne(User, { email });
  if (!user?.passwordHash) return;
  const token = newSecret();
  em.create(PasswordReset, {
    user,
    tokenHash: hashSecret(token),
    expiresAt: new Date(Date.now() + RESET_LIFETIME_MINUTES * 60_000),
  });
  await em.flush();
  const link = `${env().APP_URL}/reset-password/${token}`;
  await sendMail({
    // Not a workspace's mail: no workspace's outbox ever shows it.
    workspaceId: null,
    to: user.email,
    subject: 'Reset your Setwell password',
    text: [
      'Someone asked to reset the password of your Setwell account.',
      '',
      `Choose a new password here (the link works once and expires in ${RESET_LIFETIME_MINUTES} minutes):`,
      link,
      '',
      'If it was not you, ignore this message: your password stays as it is.',
    ].join('\n'),
    html: `<p>Someone asked to reset the password of your Setwell account.</p><p><a href="${escapeHtml(link)}">Choose a new password</a> (works once, expires in ${RESET_LIFETIME_MINUTES} minutes).</p><p>If it was not you, ignore this message.</p>`,
  });
}

/**
 * Uses the link once and sets the password. A new password ends everything that came before
 * it: every session of the user (endSessions) and every other reset link still open.
 */
export async function resetPassword(input: ResetPasswordInput): Promise<void> {
  const em = await getEm();
  const passwordHash = await hashPassword(input.password);
  await em.transactional(async (tx) => {
    const now = new Date();
    const claimed = await tx.nativeUpdate(
      PasswordReset,
      { tokenHash: hashSecret(input.token), usedAt: null, expiresAt: { $gt: now } },
      { usedAt: now },
    );
    if (claimed !== 1) throw linkInvalid();
    const reset = await tx.findOneOrFail(PasswordReset, { tokenHash: hashSecret(input.token) });
    const userId = reset.user.id;
    await tx.nativeUpdate(User, { id: userId }, { passwordHash });
    await tx.nativeUpdate(PasswordReset, { user: userId, usedAt: null }, { usedAt: now });
    await endSessions(tx, userId);
  });
}

/** Raises the user's session epoch: every session signed in before now stops working. */
async function endSessions(em: EntityManager, userId: string): Promise<void> {
  // em.execute runs inside em's transaction when there is one.
  await em.execute('update "users" set "session_epoch" = "session_epoch" + 1 where "id" = ?', [userId]);
}

/** "Sign out everywhere": ends every session of the actor, this one included. API tokens stay. */
export async function signOutEverywhere(actor: Actor): Promise<void> {
  const em = await getEm();
  await endSessions(em, actor.userId);
}

export async function updatePreferences(actor: Actor, input: PreferencesInput): Promise<void> {
  const em = await getEm();
  await em.nativeUpdate(User, { id: actor.userId }, input);
}
