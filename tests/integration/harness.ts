/**
 * Shared set-up for integration tests: real PostgreSQL (the test cluster started by
 * scripts/test.sh), real route handlers called with real Request objects, and server
 * actions called with the request headers a browser would send.
 */
import { afterAll, vi } from 'vitest';
import { randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import path from 'node:path';
import { encode } from 'next-auth/jwt';
import { getEm, closeOrm } from '@/lib/db';
import { Membership, User, Workspace, ApiToken } from '@/entities';
import { hashPassword } from '@/lib/passwords';
import { hashSecret, newSecret } from '@/lib/secrets';
import { API_TOKEN_PREFIX, type authOptions } from '@/lib/auth';
import { ROLES, type Actor, type Role } from '@/lib/permissions';
import { addStarterLibrary } from '@/lib/ingredients/mutations';
import { addDefaultAttributes } from '@/lib/tastings/mutations';

// Server actions read the request through next/headers; tests set it per call.
const requestState = vi.hoisted(() => ({ headers: new Headers(), setCookies: [] as Array<{ name: string; value: string; options?: Record<string, unknown> }> }));
vi.mock('next/headers', () => ({
  headers: async () => requestState.headers,
  cookies: async () => ({
    get: () => undefined,
    set: (name: string, value: string, options?: Record<string, unknown>) => requestState.setCookies.push({ name, value, options }),
    delete: () => undefined,
  }),
}));
vi.mock('next/cache', () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

afterAll(async () => {
  await closeOrm();
});

export const APP_ORIGIN = process.env.APP_URL ?? 'http://localhost:3100';
export const TEST_PASSWORD = 'integration-pass-42';

export interface Person {
  userId: string;
  email: string;
  role: Role;
  sessionCookie: string;
  token: string;
}

export interface WorkspaceFixture {
  workspaceId: string;
  name: string;
  people: Record<Role, Person>;
}

export async function sessionCookieFor(userId: string): Promise<string> {
  const jwt = await encode({ token: { sub: userId }, secret: process.env.NEXTAUTH_SECRET! });
  return `next-auth.session-token=${jwt}`;
}

/** A workspace with one person in each role, each with a session cookie and an API token. */
export async function createWorkspace(label = 'Test kitchen'): Promise<WorkspaceFixture> {
  const em = await getEm();
  const tag = randomUUID().slice(0, 8);
  const workspace = em.create(Workspace, { name: `${label} ${tag}`, slug: `t-${tag}` });
  const passwordHash = await hashPassword(TEST_PASSWORD);
  const created = ROLES.map((role) => {
    const email = `${role}.${tag}@test.example`;
    const user = em.create(User, { email, name: `${role} ${tag}`, passwordHash } as never) as unknown as { id: string };
    em.create(Membership, { workspace, user, role } as never);
    const token = newSecret(API_TOKEN_PREFIX);
    em.create(ApiToken, { workspace, user, label: 'test', displayPrefix: token.slice(0, 10), tokenHash: hashSecret(token) } as never);
    return { role, email, user, token };
  });
  // Ids are assigned on flush.
  await em.flush();
  await addStarterLibrary(em, workspace.id);
  await addDefaultAttributes(em, workspace.id);
  const people = {} as Record<Role, Person>;
  for (const c of created) {
    people[c.role] = { userId: c.user.id, email: c.email, role: c.role, token: c.token, sessionCookie: await sessionCookieFor(c.user.id) };
  }
  return { workspaceId: workspace.id, name: workspace.name, people };
}

/** One more person with the role in an existing workspace (for calls that end the caller's own sessions). */
export async function addPerson(fx: WorkspaceFixture, role: Role): Promise<Person> {
  const em = await getEm();
  const tag = randomUUID().slice(0, 8);
  const email = `${role}.extra.${tag}@test.example`;
  const user = em.create(User, { email, name: `${role} extra ${tag}`, passwordHash: await hashPassword(TEST_PASSWORD) } as never) as unknown as { id: string };
  em.create(Membership, { workspace: fx.workspaceId, user, role } as never);
  const token = newSecret(API_TOKEN_PREFIX);
  em.create(ApiToken, { workspace: fx.workspaceId, user, label: 'test', displayPrefix: token.slice(0, 10), tokenHash: hashSecret(token) } as never);
  await em.flush();
  return { userId: user.id, email, role, token, sessionCookie: await sessionCookieFor(user.id) };
}

export type Caller = { kind: 'outsider' } | { kind: 'session'; person: Person } | { kind: 'token'; person: Person };

export function authHeaders(caller: Caller, write = false): Headers {
  const h = new Headers();
  if (caller.kind === 'session') {
    h.set('cookie', caller.person.sessionCookie);
    if (write) h.set('origin', APP_ORIGIN);
  }
  if (caller.kind === 'token') h.set('authorization', `Bearer ${caller.person.token}`);
  return h;
}

type Handler = (req: Request, ctx: { params: Promise<any> }) => Promise<Response>;

/** Calls a route handler the way Next.js does, and returns status + parsed JSON. A FormData body is sent as multipart (its own content-type). */
export async function callRoute(
  handler: Handler,
  opts: {
    method: string;
    path: string;
    caller: Caller;
    params?: Record<string, string>;
    body?: unknown;
    /** Extra headers; null removes one the caller would send (e.g. origin). */
    headers?: Record<string, string | null>;
    /** Exact body bytes with exactly this content-type (null: no content-type header at all). */
    raw?: { text: string; contentType: string | null };
  },
): Promise<{ status: number; body: any }> {
  const write = opts.method !== 'GET';
  const headers = authHeaders(opts.caller, write);
  const multipart = opts.body instanceof FormData;
  if (opts.body !== undefined && !multipart) headers.set('content-type', 'application/json');
  if (opts.raw?.contentType) headers.set('content-type', opts.raw.contentType);
  for (const [k, v] of Object.entries(opts.headers ?? {})) {
    if (v === null) headers.delete(k);
    else headers.set(k, v);
  }
  const req = new Request(`${APP_ORIGIN}${opts.path}`, {
    method: opts.method,
    headers,
    // Bytes, not a string, so that Request adds no text/plain content-type of its own.
    body: opts.raw
      ? new TextEncoder().encode(opts.raw.text)
      : opts.body === undefined ? undefined : multipart ? (opts.body as FormData) : typeof opts.body === 'string' ? opts.body : JSON.stringify(opts.body),
  });
  const res = await handler(req, { params: Promise.resolve(opts.params ?? {}) });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON */
  }
  return { status: res.status, body };
}

/** Runs a server action as the given caller (session cookie, as a browser would send). */
export async function asCaller<T>(caller: Caller, fn: () => Promise<T>, extra: Record<string, string | null> = {}): Promise<T> {
  requestState.headers = authHeaders(caller, true);
  for (const [k, v] of Object.entries(extra)) {
    if (v === null) requestState.headers.delete(k);
    else requestState.headers.set(k, v);
  }
  requestState.setCookies = [];
  try {
    return await fn();
  } finally {
    requestState.headers = new Headers();
  }
}

export function lastSetCookies() {
  return requestState.setCookies;
}

/** The local SMTP fake's received messages (newest first). */
export async function outbox(): Promise<Array<{ id: string; to: string[]; subject: string; text: string; html: string }>> {
  const res = await fetch(`${process.env.MAIL_OUTBOX_URL}/messages`);
  return res.json();
}

export async function waitForMail(to: string, timeoutMs = 5000, subject?: string) {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const found = (await outbox()).find((m) => m.to.includes(to) && (subject === undefined || m.subject === subject));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
}

/** The actor a feature function would receive for this person (for setting up records directly). */
export function actorOf(fx: WorkspaceFixture, role: Role): Actor {
  const p = fx.people[role];
  return {
    userId: p.userId, email: p.email, name: `${role} person`, workspaceId: fx.workspaceId, workspaceName: fx.name,
    role, via: 'session', massUnits: 'metric', temperatureUnit: 'C',
  };
}

export type AuthCookie = { name: string; value: string; options: { httpOnly?: boolean; sameSite?: string; secure?: boolean; path?: string } };
type AuthResponse = { status?: number; redirect?: string; cookies?: AuthCookie[]; body?: unknown };
// next-auth's framework-free core, which its Next.js handler wraps (not in the package's export map,
// so it is loaded by file; next-auth is pinned to 4.24.15).
const { AuthHandler } = createRequire(__filename)(path.resolve(__dirname, '../../node_modules/next-auth/core/index.js')) as {
  AuthHandler: (params: { req: Record<string, unknown>; options: ReturnType<typeof authOptions> }) => Promise<AuthResponse>;
};

/** Signs in through next-auth's own handler with our options, as the sign-in form does; returns its answer (redirect, cookies). */
export async function signInThroughNextAuth(
  options: ReturnType<typeof authOptions>,
  credentials: { email: string; password: string },
  headers: Record<string, string> = { 'x-forwarded-for': '192.0.2.10' },
): Promise<AuthResponse & { cookies: AuthCookie[] }> {
  const origin = new URL(process.env.NEXTAUTH_URL!).origin;
  const csrf = await AuthHandler({ req: { action: 'csrf', method: 'GET', origin, headers: {}, cookies: {} }, options });
  const csrfCookie = csrf.cookies!.find((c) => c.name.endsWith('next-auth.csrf-token'))!;
  const res = await AuthHandler({
    req: {
      action: 'callback',
      providerId: 'credentials',
      method: 'POST',
      origin,
      headers,
      cookies: { [csrfCookie.name]: csrfCookie.value },
      body: { csrfToken: (csrf.body as { csrfToken: string }).csrfToken, ...credentials, json: 'true' },
    },
    options,
  });
  return { ...res, cookies: res.cookies ?? [] };
}

/** The session cookie a real sign-in sets, as a Cookie header value. */
export async function signedInCookie(options: ReturnType<typeof authOptions>, email: string, password = TEST_PASSWORD): Promise<string> {
  const res = await signInThroughNextAuth(options, { email, password }, { 'x-forwarded-for': `192.0.2.${Math.floor(Math.random() * 200) + 20}` });
  const session = res.cookies.find((c) => c.name.endsWith('next-auth.session-token'));
  if (!session) throw new Error(`sign-in of ${email} set no session cookie (${res.redirect ?? res.status})`);
  return `${session.name}=${session.value}`;
}
