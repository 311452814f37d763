import 'server-only';
/**
 * Sessions and the current actor. next-auth issues a JWT session (it carries the user id and
 * the user's session epoch); everything else about the actor (workspace, role) is read fresh
 * from the database on each request, so a role change or a deactivation takes effect at once.
 */
import { cache } from 'react';
import type { NextAuthOptions } from 'next-auth';
import Credentials from 'next-auth/providers/credentials';
import { z } from 'zod';
import { getEm } from '@/lib/db';
import { sql } from '@/lib/sql';
import { env } from '@/lib/env';
import { Membership, User, ApiToken } from '@/entities';
import { verifyPassword } from '@/lib/passwords';
import { hashSecret } from '@/lib/secrets';
import { decodeSessionToken } from '@/lib/session-token';
import { clientAddress } from '@/lib/client-address';
import { consumeSignInAttempt, signInSucceeded, RateLimited } from '@/lib/rate-limit';
import { tooManyAttemptsCode, type SignInErrorCode } from '@/lib/sign-in-errors';
import { logger } from '@/lib/log';
import type { Actor } from '@/lib/permissions';
import type { WorkspaceChoice } from '@/lib/workspaces/schema';

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
      const token = await decodeSessionToken(raw, secret);
      if (token.sub) return { userId: token.sub, epoch: typeof token.epoch === 'number' ? token.epoch : 0 };
    } catch {
      return null;
    }
  }
  return null;
}

interface SignedIn {
  actor: Actor;
  /** Every active membership, oldest first. */
  workspaces: WorkspaceChoice[];
}

/**
 * The actor, read fresh: role, deactivation and (for a session) the session epoch are checked on
 * every request, so a role change, a deactivation, a password reset or "sign out everywhere"
 * takes effect at once. One plain statement (user and active memberships together): every page and
 * request pays for it, and the ORM's per-entity work showed there.
 */
async function readSignedIn(userId: string, preferredWorkspaceId: string | undefined, via: Actor['via'], sessionEpoch?: number): Promise<SignedIn | null> {
  const rows = await sql<{
    email: string; name: string; session_epoch: number; mass_units: Actor['massUnits']; temperature_unit: Actor['temperatureUnit'];
    role: Actor['role'] | null; workspace_id: string | null; workspace_name: string | null;
  }>(
    `select u.email, u.name, u.session_epoch, u.mass_units, u.temperature_unit, m.role, w.id as workspace_id, w.name as workspace_name
       from users u
       left join memberships m on m.user_id = u.id and m.active
       left join workspaces w on w.id = m.workspace_id
      where u.id = $1
      order by m.created_at asc, m.id asc`,
    [userId],
    'signed-in-actor',
  );
  const user = rows[0];
  if (!user) return null;
  if (sessionEpoch !== undefined && sessionEpoch !== user.session_epoch) return null;
  const workspaces: WorkspaceChoice[] = rows.flatMap((r) => (r.workspace_id && r.workspace_name && r.role ? [{ workspaceId: r.workspace_id, name: r.workspace_name, role: r.role }] : []));
  const chosen = workspaces.find((w) => w.workspaceId === preferredWorkspaceId) ?? workspaces[0];
  if (!chosen) return null;
  return {
    actor: {
      userId,
      email: user.email,
      name: user.name,
      workspaceId: chosen.workspaceId,
      workspaceName: chosen.name,
      role: chosen.role,
      via,
      massUnits: user.mass_units,
      temperatureUnit: user.temperature_unit,
    },
    workspaces,
  };
}

async function signedInFromHeaders(headers: Headers): Promise<SignedIn | null> {
  const authz = headers.get('authorization');
  if (authz?.startsWith('Bearer ')) {
    const secret = authz.slice(7).trim();
    if (!secret.startsWith(API_TOKEN_PREFIX)) return null;
    const em = await getEm();
    const token = await em.findOne(ApiToken, { tokenHash: hashSecret(secret), revokedAt: null });
    if (!token) return null;
    const workspaceId = token.workspace.id;
    const signedIn = await readSignedIn(token.user.id, workspaceId, 'token');
    // A token only ever acts in its own workspace.
    if (!signedIn || signedIn.actor.workspaceId !== workspaceId) return null;
    await em.nativeUpdate(ApiToken, { id: token.id }, { lastUsedAt: new Date() });
    return signedIn;
  }
  const cookieHeader = headers.get('cookie');
  const claim = await sessionFromCookies(cookieHeader);
  if (!claim) return null;
  return readSignedIn(claim.userId, readCookie(cookieHeader, WORKSPACE_COOKIE), 'session', claim.epoch);
}

/**
 * The actor behind a request: a personal API token (Authorization: Bearer swt_…) or the
 * session cookie plus the chosen-workspace cookie. Null when neither is valid.
 */
export async function actorFromHeaders(headers: Headers): Promise<Actor | null> {
  return (await signedInFromHeaders(headers))?.actor ?? null;
}

/**
 * The signed-in person of a server component or server action, from the incoming request's
 * headers. Once per rendered request (React `cache`): the layout and the page both ask, and each
 * read decodes the session cookie and queries the user and memberships. Outside a render it reads
 * every time.
 */
const currentSignedIn = cache(async (): Promise<SignedIn | null> => {
  const { headers } = await import('next/headers');
  return signedInFromHeaders(new Headers(await headers()));
});

export const currentActor = cache(async (): Promise<Actor | null> => (await currentSignedIn())?.actor ?? null);

/** The current person's workspaces, from the same read as currentActor() (the layout's switcher). */
export const currentWorkspaces = cache(async (): Promise<WorkspaceChoice[]> => (await currentSignedIn())?.workspaces ?? []);
