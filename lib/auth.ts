import 'server-only';
/**
 * Sessions and the current actor. next-auth issues a JWT session (it carries the user id and
 * the user's session epoch); everything else about the actor (workspace, role) is read fresh
 * from the database on each request, so a role change or a deactivation takes effect at once.
 */
import { cache } from 'react';
import type { NextAuthOptions } from 'next-auth';
import Credentials from 'next-auth/providers/credentials';
import { decode } from 'next-auth/jwt';
import { z } from 'zod';
import { getEm } from '@/lib/db';
import { env } from '@/lib/env';
import { Membership, User, ApiToken } from '@/entities';
import { verifyPassword } from '@/lib/passwords';
import { hashSecret } from '@/lib/secrets';
import { clientAddress } from '@/lib/client-address';
import { consumeSignInAttempt, signInSucceeded, RateLimited } from '@/lib/rate-limit';
import { tooManyAttemptsCode, type SignInErrorCode } from '@/lib/sign-in-errors';
import { logger } from '@/lib/log';
import type { Actor } from '@/lib/permissions';

export const WORKSPACE_COOKIE = 'setwell-workspace';
export const API_TOKEN_PREFIX = 'swt_';
const SESSION_COOKIES = ['__Secure-next-auth.session-token', 'next-auth.session-token'];

const credentialsSchema = z.object({
  email: z.email().max(254),
  password: z.string().min(1).max(1000),
});

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
  /** The user's session epoch at sign-in, carried in the JWT. */
  sessionEpoch: number;
}

/**
 * Checks an e-mail and password. Throws an Error whose message is one of our sign-in codes
 * (lib/sign-in-errors.ts), never anything else: next-auth puts it into the sign-in URL.
 * The attempt is counted before the password is evaluated, so parallel guesses cannot outrun
 * the limit.
 */
export async function signInWithPassword(credentials: unknown, headers: Headers | Record<string, unknown>): Promise<SignedInUser> {
  try {
    const raw = (credentials ?? {}) as Record<string, unknown>;
    if (!raw.email || !raw.password) throw fail('missing_fields');
    const parsed = credentialsSchema.safeParse({ email: String(raw.email).trim().toLowerCase(), password: raw.password });
    // An address that cannot exist matches no account; it never reaches the database.
    if (!parsed.success) throw fail('bad_credentials');
    const { email, password } = parsed.data;
    const address = clientAddress(headers);
    await consumeSignInAttempt(email, address);
    const em = await getEm();
    const user = await em.findOne(User, { email });
    const ok = await verifyPassword(password, user?.passwordHash);
    if (!user || !ok) throw fail('bad_credentials');
    const active = await em.count(Membership, { user: user.id, active: true });
    if (active === 0) throw fail('no_workspace');
    await signInSucceeded(email, address);
    return { id: user.id, email: user.email, name: user.name, sessionEpoch: user.sessionEpoch };
  } catch (err) {
    if (err instanceof SignInRefused) throw new Error(err.code);
    if (err instanceof RateLimited) throw new Error(tooManyAttemptsCode(err.retryAfterSeconds));
    logger.error({ err }, 'sign-in failed');
    throw new Error('sign_in_failed' satisfies SignInErrorCode);
  }
}

class SignInRefused extends Error {
  constructor(readonly code: SignInErrorCode) {
    super(code);
  }
}
const fail = (code: SignInErrorCode) => new SignInRefused(code);

/** appUrl decides the cookie flags: Secure (and the __Secure- name) exactly when the app is served over https. */
export function authOptions(appUrl: string = env().APP_URL): NextAuthOptions {
  return {
    secret: env().NEXTAUTH_SECRET,
    useSecureCookies: appUrl.startsWith('https://'),
    session: { strategy: 'jwt', maxAge: 12 * 60 * 60 },
    pages: { signIn: '/sign-in', error: '/sign-in' },
    providers: [
      Credentials({
        name: 'E-mail and password',
        credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
        async authorize(credentials, req) {
          return signInWithPassword(credentials, req?.headers ?? {});
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) {
          token.sub = user.id;
          if ('sessionEpoch' in user && typeof user.sessionEpoch === 'number') token.epoch = user.sessionEpoch;
        }
        return token;
      },
      async session({ session, token }) {
        if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
        return session;
      },
    },
  };
}

/** Reads a cookie value out of a Cookie header. */
export function readCookie(cookieHeader: string | null | undefined, name: string): string | undefined {
  if (!cookieHeader) return undefined;
  for (const part of cookieHeader.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return decodeURIComponent(part.slice(eq + 1).trim());
  }
  return undefined;
}

interface SessionClaim {
  userId: string;
  /** Sessions from before epochs existed carry none: they count as epoch 0. */
  epoch: number;
}

async function sessionFromCookies(cookieHeader: string | null | undefined): Promise<SessionClaim | null> {
  const secret = env().NEXTAUTH_SECRET;
  for (const name of SESSION_COOKIES) {
    const raw = readCookie(cookieHeader, name);
    if (!raw) continue;
    try {
      const token = await decode({ token: raw, secret });
      if (token?.sub) return { userId: token.sub, epoch: typeof token.epoch === 'number' ? token.epoch : 0 };
    } catch {
      return null;
    }
  }
  return null;
}

/**
 * The actor, read fresh: role, deactivation and (for a session) the session epoch are checked on
 * every request, so a role change, a deactivation, a password reset or "sign out everywhere"
 * takes effect at once.
 */
async function actorFor(userId: string, preferredWorkspaceId: string | undefined, via: Actor['via'], sessionEpoch?: number): Promise<Actor | null> {
  const em = await getEm();
  const user = await em.findOne(User, { id: userId });
  if (!user) return null;
  if (sessionEpoch !== undefined && sessionEpoch !== user.sessionEpoch) return null;
  const memberships = await em.find(
    Membership,
    { user: userId, active: true },
    { populate: ['workspace'], orderBy: { createdAt: 'asc' } },
  );
  const chosen = memberships.find((m) => m.workspace.id === preferredWorkspaceId) ?? memberships[0];
  if (!chosen) return null;
  return {
    userId: user.id,
    email: user.email,
    name: user.name,
    workspaceId: chosen.workspace.id,
    workspaceName: chosen.workspace.name,
    role: chosen.role,
    via,
    massUnits: user.massUnits,
    temperatureUnit: user.temperatureUnit,
  };
}

/**
 * The actor behind a request: a personal API token (Authorization: Bearer swt_…) or the
 * session cookie plus the chosen-workspace cookie. Null when neither is valid.
 */
export async function actorFromHeaders(headers: Headers): Promise<Actor | null> {
  const authz = headers.get('authorization');
  if (authz?.startsWith('Bearer ')) {
    const secret = authz.slice(7).trim();
    if (!secret.startsWith(API_TOKEN_PREFIX)) return null;
    const em = await getEm();
    const token = await em.findOne(ApiToken, { tokenHash: hashSecret(secret), revokedAt: null });
    if (!token) return null;
    const workspaceId = token.workspace.id;
    const actor = await actorFor(token.user.id, workspaceId, 'token');
    // A token only ever acts in its own workspace.
    if (!actor || actor.workspaceId !== workspaceId) return null;
    await em.nativeUpdate(ApiToken, { id: token.id }, { lastUsedAt: new Date() });
    return actor;
  }
  const cookieHeader = headers.get('cookie');
  const claim = await sessionFromCookies(cookieHeader);
  if (!claim) return null;
  return actorFor(claim.userId, readCookie(cookieHeader, WORKSPACE_COOKIE), 'session', claim.epoch);
}

/**
 * The actor in a server component or server action, from the incoming request's headers. Once per
 * rendered request (React `cache`): the layout and the page both ask, and each read decodes the
 * session cookie and queries the user and memberships (~12 ms). Outside a render it reads every time.
 */
export const currentActor = cache(async (): Promise<Actor | null> => {
  const { headers } = await import('next/headers');
  return actorFromHeaders(new Headers(await headers()));
});
