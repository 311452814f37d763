/**
 * Sessions and the current actor. next-auth issues a JWT session (it carries the user id);
 * everything else about the actor (workspace, role) is read fresh from the database on each
 * request, so a role change or a deactivation takes effect at once.
 */
import type { NextAuthOptions } from 'next-auth';
import Credentials from 'next-auth/providers/credentials';
import { decode } from 'next-auth/jwt';
import { getEm } from '@/lib/db';
import { env } from '@/lib/env';
import { Membership, User, ApiToken } from '@/entities';
import { verifyPassword } from '@/lib/passwords';
import { hashSecret } from '@/lib/secrets';
import { checkSignInAllowed, recordSignInFailure, recordSignInSuccess } from '@/lib/rate-limit';
import type { Actor, Role } from '@/lib/permissions';

export const WORKSPACE_COOKIE = 'setwell-workspace';
export const API_TOKEN_PREFIX = 'swt_';
const SESSION_COOKIES = ['__Secure-next-auth.session-token', 'next-auth.session-token'];

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
          const email = String(credentials?.email ?? '').trim().toLowerCase();
          const password = String(credentials?.password ?? '');
          const ip = clientIp(req?.headers ?? {});
          if (!email || !password) throw new Error('Enter your e-mail and password.');
          await checkSignInAllowed(email, ip);
          const em = await getEm();
          const user = await em.findOne(User, { email });
          const ok = await verifyPassword(password, user?.passwordHash);
          if (!user || !ok) {
            await recordSignInFailure(email, ip);
            throw new Error('That e-mail and password do not match an account.');
          }
          const active = await em.count(Membership, { user: user.id, active: true });
          if (active === 0) throw new Error('This account has no active workspace. Ask an administrator.');
          await recordSignInSuccess(email);
          return { id: user.id, email: user.email, name: user.name };
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user) token.sub = user.id;
        return token;
      },
      async session({ session, token }) {
        if (session.user && token.sub) (session.user as { id?: string }).id = token.sub;
        return session;
      },
    },
  };
}

/**
 * The address for the per-address sign-in limit: the right-most X-Forwarded-For entry, i.e.
 * the one our own load balancer appended. A client can forge entries to its left, not that one.
 * Without a proxy in front, Next.js passes a client's header through, so the per-account limit
 * is the one that always holds (see the README's operations notes).
 */
export function clientIp(headers: Record<string, unknown> | Headers): string {
  const get = (name: string) =>
    headers instanceof Headers ? headers.get(name) : (headers[name] as string | undefined);
  const forwarded = get('x-forwarded-for')?.split(',').map((s) => s.trim()).filter(Boolean);
  return forwarded?.at(-1) ?? get('x-real-ip')?.trim() ?? 'unknown';
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

async function userIdFromSessionCookies(cookieHeader: string | null | undefined): Promise<string | null> {
  const secret = env().NEXTAUTH_SECRET;
  for (const name of SESSION_COOKIES) {
    const raw = readCookie(cookieHeader, name);
    if (!raw) continue;
    try {
      const token = await decode({ token: raw, secret });
      if (token?.sub) return token.sub;
    } catch {
      return null;
    }
  }
  return null;
}

type MembershipRow = { workspace: { id: string; name: string }; role: Role };

async function actorFor(userId: string, preferredWorkspaceId: string | undefined, via: Actor['via']): Promise<Actor | null> {
  const em = await getEm();
  const user = await em.findOne(User, { id: userId });
  if (!user) return null;
  const memberships = (await em.find(
    Membership,
    { user: userId, active: true },
    { populate: ['workspace'], orderBy: { createdAt: 'asc' } },
  )) as unknown as MembershipRow[];
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
    const workspaceId = (token.workspace as unknown as { id: string }).id;
    const actor = await actorFor((token.user as unknown as { id: string }).id, workspaceId, 'token');
    // A token only ever acts in its own workspace.
    if (!actor || actor.workspaceId !== workspaceId) return null;
    await em.nativeUpdate(ApiToken, { id: token.id }, { lastUsedAt: new Date() });
    return actor;
  }
  const cookieHeader = headers.get('cookie');
  const userId = await userIdFromSessionCookies(cookieHeader);
  if (!userId) return null;
  return actorFor(userId, readCookie(cookieHeader, WORKSPACE_COOKIE), 'session');
}

/** The actor in a server component or server action, from the incoming request's headers. */
export async function currentActor(): Promise<Actor | null> {
  const { headers } = await import('next/headers');
  return actorFromHeaders(new Headers(await headers()));
}
