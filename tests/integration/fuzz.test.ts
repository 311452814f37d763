/**
 * Fuzzed input against every JSON API operation in API_OPERATIONS (lib/api/openapi.ts), so an
 * operation added there is fuzzed without touching this file. Callers are allowed to use the
 * operation (a role from the access table, or no one for the public tasting routes), so what is
 * exercised is parsing and validation, not authorisation.
 *
 * For every bad request: a 4xx status (never 5xx), the one error shape of lib/api/errors.ts,
 * and not one row changed in any table. Seeded, with a fixed number of runs per operation.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import fc from 'fast-check';
import { getEm } from '@/lib/db';
import { API_OPERATIONS, type ApiOperation } from '@/lib/api/openapi';
import { MAX_BODY_BYTES } from '@/lib/api/route';
import { createWorkspace, callRoute, type Caller, type WorkspaceFixture } from './harness';
import { ROUTE_CASES, type CallSpec, type RouteCase } from './access-table';
import { discoverRoutes, operationKey, routesReadingJsonBody, type RouteHandler } from './routes';
import {
  badParam,
  describeSample,
  hostileQuery,
  malformedBodies,
  mustBeRefused,
  structuredBodies,
  wrongContentTypes,
  type BodySample,
} from './fuzz-inputs';

const SEED = 20261202;
const RUNS = { structured: 24, malformed: 8, contentType: 4, param: 25, query: 25 } as const;

/**
 * Left out of the before/after comparison, and why:
 * - rate_limits: every join attempt is counted against the caller's address by design (the
 *   counter must move on bad input too, or guessing codes would be free).
 * - panel_seats.last_seen_at: a taster's successful view of their own seat records the visit;
 *   the query fuzz sends valid seat views with junk query strings, which is such a visit.
 */
const BOOKKEEPING_TABLES = new Set(['rate_limits']);
const BOOKKEEPING_COLUMNS: Record<string, string[]> = { panel_seats: ['last_seen_at'] };

/** Addresses from the documentation range (RFC 5737), one per tasting-join attempt, so the join limit never answers before validation does. */
let addressCounter = 0;
const fuzzAddress = () => `198.51.100.${(addressCounter++ % 250) + 1}`;

type Snapshot = Map<string, string>;
let tableNames: string[] = [];

/** Row count and an order-independent hash of every row, per table. */
async function snapshot(): Promise<Snapshot> {
  const conn = (await getEm()).getConnection();
  const parts = tableNames.map((t) => {
    const skip = BOOKKEEPING_COLUMNS[t];
    const row = skip ? `(to_jsonb(x)${skip.map((c) => ` - '${c}'`).join('')})::text` : 'x::text';
    return `select '${t}' as t, count(*)::text || ':' || coalesce(sum(hashtextextended(${row}, 7)), 0)::text as h from "${t}" x`;
  });
  const rows = (await conn.execute(parts.join(' union all '))) as Array<{ t: string; h: string }>;
  return new Map(rows.map((r) => [r.t, r.h]));
}

/** Invalidated whenever a fixture is prepared (fixtures write on purpose). */
let lastSnapshot: Snapshot | undefined;

function changedTables(before: Snapshot, after: Snapshot): string[] {
  return [...after.keys()].filter((t) => before.get(t) !== after.get(t));
}

function expectErrorShape(body: unknown, context: string) {
  expect(body, context).toMatchObject({ error: { code: expect.any(String), message: expect.any(String) } });
  const error = (body as { error: Record<string, unknown> }).error;
  expect(Object.keys(body as object), context).toEqual(['error']);
  expect(Object.keys(error).filter((k) => !['code', 'message', 'fields'].includes(k)), context).toEqual([]);
  if (error.fields !== undefined) {
    for (const messages of Object.values(error.fields as Record<string, unknown>)) {
      expect(Array.isArray(messages) && messages.every((m) => typeof m === 'string'), context).toBe(true);
    }
  }
}

let ws: WorkspaceFixture;
let routes: Map<string, RouteHandler>;
const casesByRoute = new Map<string, RouteCase>(ROUTE_CASES.map((c) => [c.route, c]));
const counts = new Map<string, Record<string, number>>();

function count(op: ApiOperation, category: string) {
  const key = operationKey(op);
  const row = (counts.get(key) ?? counts.set(key, {}).get(key))!;
  row[category] = (row[category] ?? 0) + 1;
}

function callerFor(c: RouteCase): Caller {
  if (c.allowed === 'public') return { kind: 'outsider' };
  return { kind: 'session', person: ws.people[c.allowed[0]] };
}

function pathWith(op: ApiOperation, params: Record<string, string>): string {
  return op.path.replace(/\{(\w+)\}/g, (_, name: string) => encodeURIComponent(params[name] ?? ''));
}

async function prepared(op: ApiOperation): Promise<{ c: RouteCase; spec: CallSpec; caller: Caller }> {
  const c = casesByRoute.get(operationKey(op));
  if (!c) throw new Error(`${operationKey(op)} has no row in tests/integration/access-table.ts`);
  const caller = callerFor(c);
  const spec = (await c.prepare?.(ws, caller.kind === 'outsider' ? null : caller.person)) ?? {};
  lastSnapshot = undefined;
  return { c, spec, caller };
}

/** Sends one request and checks the three promises: 4xx (or, where noted, any non-5xx), the error shape, no change. */
async function sendAndCheck(
  op: ApiOperation,
  caller: Caller,
  req: { params: Record<string, string>; query?: string; raw?: BodySample; body?: unknown },
  context: string,
  refusalRequired = true,
) {
  // The state after one request is the state before the next (nothing else writes meanwhile).
  const before = lastSnapshot ?? (await snapshot());
  const headers: Record<string, string> = op.path === '/api/v1/tasting/join' ? { 'x-forwarded-for': fuzzAddress() } : {};
  const res = await callRoute(routes.get(operationKey(op))!, {
    method: op.method.toUpperCase(),
    path: pathWith(op, req.params) + (req.query ? `?${req.query}` : ''),
    caller,
    params: req.params,
    raw: req.raw ? { text: req.raw.text, contentType: req.raw.contentType } : undefined,
    body: req.body,
    headers,
  });
  const after = await snapshot();
  lastSnapshot = after;
  const where = `${operationKey(op)} — ${context} → ${res.status} ${JSON.stringify(res.body)?.slice(0, 300)}`;
  expect(res.status, where).toBeLessThan(500);
  if (refusalRequired) expect(res.status, where).toBeGreaterThanOrEqual(400);
  if (res.status >= 400) expectErrorShape(res.body, where);
  expect(changedTables(before, after), where).toEqual([]);
}

const bodyOps = API_OPERATIONS.filter((op) => op.request);
const paramOps = API_OPERATIONS.filter((op) => /\{\w+\}/.test(op.path));
const getOps = API_OPERATIONS.filter((op) => op.method === 'get');

beforeAll(async () => {
  ws = await createWorkspace('Fuzz kitchen');
  routes = await discoverRoutes();
  const conn = (await getEm()).getConnection();
  const rows = (await conn.execute(
    "select table_name from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by table_name",
  )) as Array<{ table_name: string }>;
  tableNames = rows.map((r) => r.table_name).filter((t) => !BOOKKEEPING_TABLES.has(t));
});

afterAll(async () => {
  // The fuzz addresses' join counters are test debris; nothing else reads them.
  await (await getEm()).getConnection().execute("delete from rate_limits where key like 'join-ip:198.51.100.%'");
  const lines = [...counts.entries()].map(([op, c]) => `  ${op}: ${Object.values(c).reduce((s, n) => s + n, 0)} (${Object.entries(c).map(([k, n]) => `${k} ${n}`).join(', ')})`);
  const total = [...counts.values()].reduce((s, c) => s + Object.values(c).reduce((x, n) => x + n, 0), 0);
  console.log(`fuzz: ${total} requests over ${counts.size} operations (seed ${SEED})\n${lines.join('\n')}`);
});

describe('coverage', () => {
  it('every handler that reads a JSON body documents its schema in API_OPERATIONS, so it is fuzzed', () => {
    const documented = new Set(bodyOps.map(operationKey));
    expect(routesReadingJsonBody().filter((k) => !documented.has(k)), 'add `request: <schema>` to the operation in lib/api/openapi.ts').toEqual([]);
  });

  it('every operation with a JSON body has a valid example in the access table to mutate', () => {
    const missing = bodyOps.filter((op) => !casesByRoute.get(operationKey(op))?.prepare).map(operationKey);
    expect(missing, 'give the row in tests/integration/access-table.ts a prepare() with a valid body').toEqual([]);
  });

  it('the table stayed in step with the operations', () => {
    expect(tableNames.length).toBeGreaterThan(10);
    expect(bodyOps.length).toBeGreaterThan(15);
  });
});

describe.each(bodyOps.map((op) => ({ op, name: operationKey(op) })))('$name body', ({ op }) => {
  let ctx: Awaited<ReturnType<typeof prepared>>;
  beforeAll(async () => {
    ctx = await prepared(op);
  });

  it('the access-table example is valid for the documented schema (so mutations of it mean something)', () => {
    const parsed = op.request!.safeParse(ctx.spec.body);
    expect(parsed.success, JSON.stringify(parsed.error?.issues ?? null)).toBe(true);
  });

  const run = (category: keyof typeof RUNS, arb: (base: never) => fc.Arbitrary<BodySample>) =>
    fc.assert(
      fc.asyncProperty(arb(ctx.spec.body as never), async (sample) => {
        fc.pre(mustBeRefused(sample, op.request!, MAX_BODY_BYTES));
        count(op, category);
        await sendAndCheck(op, ctx.caller, { params: ctx.spec.params ?? {}, raw: sample }, describeSample(sample));
      }),
      { seed: SEED, numRuns: RUNS[category], endOnFailure: true, maxSkipsPerRun: 200 },
    );

  it('refuses wrong types, hostile values, missing and unknown fields, deep nesting', () => run('structured', structuredBodies));
  it('refuses malformed, deeply nested and oversized JSON text', () => run('malformed', malformedBodies));
  it('refuses a body that is not sent as application/json', () => run('contentType', wrongContentTypes));
});

describe.each(paramOps.map((op) => ({ op, name: operationKey(op) })))('$name path parameters', ({ op }) => {
  it('answers a malformed or unknown id with a 4xx and changes nothing', async () => {
    const ctx = await prepared(op);
    const names = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...names).chain((name) => badParam(name).map((value) => ({ name, value }))), async ({ name, value }) => {
        const valid = ctx.spec.params ?? {};
        // Only the chosen parameter is bad; a real one that happens to be drawn is skipped.
        fc.pre(value !== valid[name]);
        count(op, 'param');
        await sendAndCheck(op, ctx.caller, { params: { ...valid, [name]: value }, body: ctx.spec.body }, `${name}=${JSON.stringify(value)}`);
      }),
      { seed: SEED, numRuns: RUNS.param, endOnFailure: true },
    );
  });
});

describe.each(getOps.map((op) => ({ op, name: operationKey(op) })))('$name query', ({ op }) => {
  // Unknown query keys are ignored and a hostile search text is a valid search, so a 200 is
  // allowed here; what is not allowed is a 5xx, a malformed error, or a write.
  it('never fails on hostile query strings and changes nothing', async () => {
    const ctx = await prepared(op);
    await fc.assert(
      fc.asyncProperty(hostileQuery, async (query) => {
        count(op, 'query');
        await sendAndCheck(op, ctx.caller, { params: ctx.spec.params ?? {}, query }, `?${query.slice(0, 200)}`, false);
      }),
      { seed: SEED, numRuns: RUNS.query, endOnFailure: true },
    );
  });
});
