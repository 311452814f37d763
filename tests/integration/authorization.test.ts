/**
 * The authorisation matrix: every route handler and every server action, tried as an
 * outsider, as a guest taster (a seat token and no session), as each role of workspace A, and as a
 * member of workspace B. Expected: outsider and guest 401; a role without the permission 403;
 * workspace B 404 on A's records.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, asCaller, addPerson, type WorkspaceFixture, type Caller, type Person } from './harness';
import { ROUTE_CASES, EXEMPT_ROUTES, BENCH_ONLY_ROUTES, ACTION_CASES, type RouteCase } from './access-table';
import { discoverActions, discoverRoutes, operationKey } from './routes';
import { API_OPERATIONS } from '@/lib/api/openapi';
import { DEPRECATED_API_PATHS } from '@/lib/api/deprecated-paths';
import { ROLES } from '@/lib/permissions';
import { seatFixture } from './access-tastings';

let a: WorkspaceFixture;
let b: WorkspaceFixture;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
let actions: Awaited<ReturnType<typeof discoverActions>>;
/** A guest taster's seat token: it opens the phone flow of one seat and nothing else. */
let guestSeatToken: string;

beforeAll(async () => {
  a = await createWorkspace('Matrix A');
  b = await createWorkspace('Matrix B');
  routes = await discoverRoutes();
  actions = await discoverActions();
  guestSeatToken = (await seatFixture(a)).seatToken;
});

describe('the table covers everything that exists', () => {
  it('lists every route handler', () => {
    const listed = new Set([...ROUTE_CASES.map((c) => c.route), ...EXEMPT_ROUTES, ...BENCH_ONLY_ROUTES]);
    const missing = [...routes.keys()].filter((k) => !listed.has(k));
    const stale = [...listed].filter((k) => !routes.has(k));
    expect(missing, 'routes missing from tests/integration/access-table.ts').toEqual([]);
    expect(stale, 'table rows for routes that no longer exist').toEqual([]);
    expect(routes.size).toBeGreaterThanOrEqual(ROUTE_CASES.length);
  });

  it('lists every server action', () => {
    const listed = new Set(ACTION_CASES.map((c) => c.action));
    const missing = [...actions.keys()].filter((k) => !listed.has(k));
    const stale = [...listed].filter((k) => !actions.has(k));
    expect(missing, 'server actions missing from the table').toEqual([]);
    expect(stale).toEqual([]);
  });

  it('answers each deprecated alias with the very handlers of the path it names, marked deprecated in the OpenAPI document', () => {
    expect(DEPRECATED_API_PATHS.length).toBeGreaterThan(0);
    for (const { old, now } of DEPRECATED_API_PATHS) {
      const nowOps = API_OPERATIONS.filter((op) => op.path === now && !op.deprecated);
      expect(nowOps.length, now).toBeGreaterThan(0);
      for (const op of nowOps) {
        const alias = API_OPERATIONS.find((o) => o.path === old && o.method === op.method);
        expect(alias?.deprecated, `${op.method} ${old}`).toBe(true);
        const handler = routes.get(operationKey(op));
        expect(handler, operationKey(op)).toBeTypeOf('function');
        expect(routes.get(operationKey({ method: op.method, path: old })), `${op.method} ${old}`).toBe(handler);
      }
    }
  });

  it('describes every /api/v1 route in the OpenAPI document', () => {
    const documented = new Set(API_OPERATIONS.map(operationKey));
    const undocumented = [...routes.keys()].filter((k) => k.includes('/api/v1/') && !documented.has(k));
    expect(undocumented).toEqual([]);
  });
});

async function call(c: RouteCase, caller: Caller, callerPerson: Person | null, headers?: Record<string, string>) {
  const [method, route] = c.route.split(' ');
  const spec = (await c.prepare?.(a, callerPerson)) ?? {};
  let p = route;
  for (const [k, v] of Object.entries(spec.params ?? {})) p = p.replace(`[${k}]`, v);
  return callRoute(routes.get(c.route)!, { method, path: p, caller, params: spec.params, body: spec.body, headers });
}

describe.each(ROUTE_CASES)('$route', (c) => {
  it('answers an outsider with 401 (or serves a public route)', async () => {
    const res = await call(c, { kind: 'outsider' }, null);
    if (c.allowed === 'public') expect([200, 201], JSON.stringify(res.body)).toContain(res.status);
    else {
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('unauthenticated');
    }
  });

  it('answers a guest taster who presents their seat token as a bearer token with 401', async () => {
    if (c.allowed === 'public') return;
    const res = await call(c, { kind: 'outsider' }, null, { authorization: `Bearer ${guestSeatToken}` });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it.each([...ROLES])('as %s: allowed, or 403', async (role) => {
    if (c.allowed === 'public') return;
    const person = a.people[role];
    const res = await call(c, { kind: 'session', person }, person);
    if (c.allowed.includes(role) && c.allowedStatus) expect(res.status, JSON.stringify(res.body)).toBe(c.allowedStatus);
    else if (c.allowed.includes(role)) {
      expect(res.status, JSON.stringify(res.body)).toBeGreaterThanOrEqual(200);
      expect(res.status, JSON.stringify(res.body)).toBeLessThan(300);
    } else {
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
  });

  it("as a member of another workspace: 404 for workspace A's records", async () => {
    if (c.otherWorkspace === 'public') return;
    const other = b.people[c.otherWorkspaceRole ?? 'admin'];
    const res = await call(c, { kind: 'session', person: other }, other);
    if (c.otherWorkspace === 404) expect(res.status).toBe(404);
    else if (c.otherWorkspace === 422) {
      expect(res.status).toBe(422);
      expect(JSON.stringify(res.body)).not.toContain(a.name);
    } else if ((c.allowed as string[]).includes('admin')) expect(res.status).toBeLessThan(300);
    else expect(res.status).toBe(403);
  });

  it('treats an API token like the session of its owner', async () => {
    if (c.allowed === 'public') return;
    const role = c.allowed[0];
    const person = a.people[role];
    const res = await call(c, { kind: 'token', person }, person);
    if (c.allowedStatus) expect(res.status, JSON.stringify(res.body)).toBe(c.allowedStatus);
    else expect(res.status, JSON.stringify(res.body)).toBeLessThan(300);
  });
});

describe.each(BENCH_ONLY_ROUTES)('%s (benchmark only)', (route) => {
  it('does not exist without the benchmark flag: 404 for an outsider and for an admin', async () => {
    expect(process.env.SETWELL_BENCH_FLOOR).not.toBe('1');
    const [method, p] = route.split(' ');
    for (const caller of [{ kind: 'outsider' } as const, { kind: 'session', person: a.people.admin } as const]) {
      const res = await callRoute(routes.get(route)!, { method, path: p, caller, body: { seat: 'x' } });
      expect(res.status).toBe(404);
    }
  });
});

describe.each(ACTION_CASES)('$action', (c) => {
  const run = async (caller: Caller) => {
    const args = c.argsAsync ? await c.argsAsync(a) : c.args!(a);
    return asCaller(caller, () => actions.get(c.action)!(...args));
  };

  it('refuses an outsider with 401 unless it is a signed-out flow', async () => {
    const res = await run({ kind: 'outsider' });
    if (c.allowed === 'public') {
      // Public flows still validate: the deliberately bad input is refused with field errors.
      expect(res.ok).toBe(false);
      expect(res.status).toBe(422);
    } else expect(res).toMatchObject({ ok: false, status: 401 });
  });

  it.each([...ROLES])('as %s: allowed, or 403', async (role) => {
    if (c.allowed === 'public') return;
    const person = c.endsCallersSessions ? await addPerson(a, role) : a.people[role];
    const res = await run({ kind: 'session', person });
    if (c.allowed.includes(role)) expect(res.ok, JSON.stringify(res)).toBe(true);
    else expect(res).toMatchObject({ ok: false, status: 403 });
  });

  it('as a member of another workspace: 404 (or 422 for references) on workspace A', async () => {
    if (c.otherWorkspace !== 404 && c.otherWorkspace !== 422) return;
    const res = await run({ kind: 'session', person: b.people[c.otherWorkspaceRole ?? 'admin'] });
    expect(res).toMatchObject({ ok: false, status: c.otherWorkspace });
  });
});

describe('cookie-authenticated writes', () => {
  it('refuse a request from another origin', async () => {
    const create = routes.get('POST /api/v1/tokens')!;
    const res = await callRoute(create, {
      method: 'POST',
      path: '/api/v1/tokens',
      caller: { kind: 'session', person: a.people.developer },
      body: { label: 'cross-site' },
      headers: { origin: 'https://evil.example' },
    });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
  });
});
