/**
 * Fuzzed input against every JSON API operation in API_OPERATIONS (lib/api/openapi.ts), every
 * server action in the access table, and the query parameters of every page that reads them, so
 * an operation, action or page added there is fuzzed without touching this file. Callers are
 * allowed to use the operation (a role from the access table, or no one for the public routes),
 * so what is exercised is parsing and validation, not authorisation.
 *
 * For every bad request: a 4xx status (never 5xx), the one error shape of lib/api/errors.ts,
 * and not one row changed in any table (checked around each batch of requests of one kind; set
 * FUZZ_EACH=1 to check around every request and name the one that wrote). Seeded, with a fixed
 * number of runs per operation.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import fc from 'fast-check';
import { getEm } from '@/lib/db';
import { API_OPERATIONS, type ApiOperation } from '@/lib/api/openapi';
import { MAX_BODY_BYTES } from '@/lib/api/route';
import path from 'node:path';
import { createWorkspace, callRoute, asCaller, type Caller, type WorkspaceFixture } from './harness';
import { ROUTE_CASES, ACTION_CASES, type ActionCase, type CallSpec, type RouteCase } from './access-table';
import { discoverActions, discoverRoutes, operationKey, pagesReadingSearchParams, ROOT, routesReadingJsonBody, type RouteHandler, type ServerAction } from './routes';
import {
  badInputClasses,
  badParam,
  describeSample,
  encodeQuery,
  getAt,
  isWellFormedText,
  hostileQuery,
  leafPaths,
  malformedBodies,
  mustBeRefused,
  poisonedString,
  POISON_NUMBERS,
  PROTOTYPE_KEYS,
  queryPairs,
  searchParamsOf,
  setAt,
  structuredBodies,
  wrongContentTypes,
  type BodySample,
  type Path,
} from './fuzz-inputs';

const SEED = 20261202;
const RUNS = { structured: 48, malformed: 12, contentType: 6, param: 40, query: 60, action: 140, page: 150 } as const;
/** Snapshot around every request instead of around every batch (slower; names the request that wrote). */
const EACH = process.env.FUZZ_EACH === '1';
/** A batch of a hundred-odd requests; on a loaded two-core machine that can pass the default 30 s. */
const BATCH_TIMEOUT_MS = 240_000;

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
let actions: Map<string, ServerAction>;
const casesByRoute = new Map<string, RouteCase>(ROUTE_CASES.map((c) => [c.route, c]));
const counts = new Map<string, Record<string, number>>();

function count(op: ApiOperation | string, category: string) {
  const key = typeof op === 'string' ? op : operationKey(op);
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
  const before = EACH ? (lastSnapshot ?? (await snapshot())) : undefined;
  const headers: Record<string, string> = op.path.endsWith('/join') ? { 'x-forwarded-for': fuzzAddress() } : {};
  const res = await callRoute(routes.get(operationKey(op))!, {
    method: op.method.toUpperCase(),
    path: pathWith(op, req.params) + (req.query ? `?${req.query}` : ''),
    caller,
    params: req.params,
    raw: req.raw ? { text: req.raw.text, contentType: req.raw.contentType } : undefined,
    body: req.body,
    headers,
  });
  const where = `${operationKey(op)} — ${context} → ${res.status} ${JSON.stringify(res.body)?.slice(0, 300)}`;
  expect(res.status, where).toBeLessThan(500);
  if (refusalRequired) expect(res.status, where).toBeGreaterThanOrEqual(400);
  if (res.status >= 400) expectErrorShape(res.body, where);
  if (before) {
    const after = await snapshot();
    lastSnapshot = after;
    expect(changedTables(before, after), where).toEqual([]);
  }
}

/** Runs a batch of requests that must all change nothing, and checks the whole database before and after it. */
async function expectNoWrites(where: string, run: () => Promise<void>) {
  const before = await snapshot();
  await run();
  const after = await snapshot();
  lastSnapshot = after;
  expect(changedTables(before, after), `${where}: a refused or read-only request wrote (rerun with FUZZ_EACH=1 to name it)`).toEqual([]);
}

const bodyOps = API_OPERATIONS.filter((op) => op.request);
const paramOps = API_OPERATIONS.filter((op) => /\{\w+\}/.test(op.path));
const getOps = API_OPERATIONS.filter((op) => op.method === 'get');

beforeAll(async () => {
  ws = await createWorkspace('Fuzz kitchen');
  routes = await discoverRoutes();
  actions = await discoverActions();
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
  console.log(`fuzz: ${total} requests over ${counts.size} operations, actions and pages (seed ${SEED})\n${lines.join('\n')}`);
  // The promise the test command makes: at least this many hostile requests per run.
  if (counts.size >= 100) expect(total).toBeGreaterThanOrEqual(10_000);
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
    expectNoWrites(`${operationKey(op)} ${category}`, () => fc.assert(
      fc.asyncProperty(arb(ctx.spec.body as never), async (sample) => {
        fc.pre(mustBeRefused(sample, op.request!, MAX_BODY_BYTES));
        count(op, category);
        await sendAndCheck(op, ctx.caller, { params: ctx.spec.params ?? {}, raw: sample }, describeSample(sample));
      }),
      { seed: SEED, numRuns: RUNS[category], endOnFailure: true, maxSkipsPerRun: 200 },
    ));

  it('refuses wrong types, hostile values, missing and unknown fields, deep nesting', () => run('structured', structuredBodies), BATCH_TIMEOUT_MS);
  it('refuses malformed, deeply nested and oversized JSON text', () => run('malformed', malformedBodies), BATCH_TIMEOUT_MS);
  it('refuses a body that is not sent as application/json', () => run('contentType', wrongContentTypes), BATCH_TIMEOUT_MS);
});

describe.each(paramOps.map((op) => ({ op, name: operationKey(op) })))('$name path parameters', ({ op }) => {
  it('answers a malformed or unknown id with a 4xx and changes nothing', async () => {
    const ctx = await prepared(op);
    const names = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
    await expectNoWrites(`${operationKey(op)} path parameters`, () => fc.assert(
      fc.asyncProperty(fc.constantFrom(...names).chain((name) => badParam(name).map((value) => ({ name, value }))), async ({ name, value }) => {
        const valid = ctx.spec.params ?? {};
        // Only the chosen parameter is bad; a real one that happens to be drawn is skipped.
        fc.pre(value !== valid[name]);
        count(op, 'param');
        await sendAndCheck(op, ctx.caller, { params: { ...valid, [name]: value }, body: ctx.spec.body }, `${name}=${JSON.stringify(value)}`);
      }),
      { seed: SEED, numRuns: RUNS.param, endOnFailure: true },
    ));
  }, BATCH_TIMEOUT_MS);
});

describe.each(getOps.map((op) => ({ op, name: operationKey(op) })))('$name query', ({ op }) => {
  // Unknown query keys are ignored and a hostile search text is a valid search, so a 200 is
  // allowed here; what is not allowed is a 5xx, a malformed error, or a write.
  it('never fails on hostile query strings and changes nothing', async () => {
    const ctx = await prepared(op);
    await expectNoWrites(`${operationKey(op)} query`, () => fc.assert(
      fc.asyncProperty(hostileQuery, async (query) => {
        count(op, 'query');
        await sendAndCheck(op, ctx.caller, { params: ctx.spec.params ?? {}, query }, `?${query.slice(0, 200)}`, false);
      }),
      { seed: SEED, numRuns: RUNS.query, endOnFailure: true },
    ));
  }, BATCH_TIMEOUT_MS);
});

// ---------------------------------------------------------------------------------------------
// Server actions: called as the app calls them (the access table's arguments, a session cookie
// and our Origin), each argument in turn given the wrong shape or a poisoned value. All of it must
// be refused with a 4xx result (never a throw, never a 5xx) and change nothing.

const kindOf = (v: unknown) => (v instanceof FormData ? 'form' : v === null ? 'null' : Array.isArray(v) ? 'array' : typeof v);

function shapeLabel(v: unknown): string {
  if (v instanceof FormData) return 'FormData';
  if (typeof v === 'number' || v === undefined) return String(v);
  return JSON.stringify(v)?.slice(0, 80) ?? String(v);
}

/** Values of every shape an action argument could arrive as; those of the original's own kind are left out (an empty object can be a valid input). */
function wrongShapes(original: unknown): unknown[] {
  const form = new FormData();
  form.set('name', 'Quince');
  const shapes: unknown[] = [undefined, null, 'text', '', 42, Number.NaN, -0, true, [], ['a', 1], { name: 'Quince' }, form, new Date(0), JSON.parse('{"__proto__":{"polluted":true},"constructor":{"prototype":{"polluted":true}}}')];
  return shapes.filter((v) => kindOf(v) !== kindOf(original));
}

function withField(form: FormData, key: string, value: string): FormData {
  const copy = new FormData();
  for (const [k, v] of form.entries()) copy.append(k, k === key ? value : v);
  return copy;
}

interface ActionSample {
  args: unknown[];
  what: string;
  category: string;
}

function actionSamples(args: unknown[]): fc.Arbitrary<ActionSample> {
  const arbs: Array<fc.Arbitrary<ActionSample>> = [];
  args.forEach((arg, i) => {
    // The form state (always null) and an optional id left out: nothing to refuse there.
    if (arg === null || arg === undefined) return;
    const put = (value: unknown, category: string, what: string): ActionSample => ({ args: args.map((a, j) => (j === i ? value : a)), category, what: `argument ${i}: ${what}` });
    arbs.push(fc.constantFrom(...wrongShapes(arg)).map((v) => put(v, 'wrong shape', shapeLabel(v))));
    if (arg instanceof FormData) {
      const fields = Object.fromEntries([...arg.entries()].map(([k, v]) => [k, String(v)]));
      arbs.push(fc.constant(put(fields, 'wrong shape', 'a plain object instead of the form')));
      const keys = Object.keys(fields);
      // FormData holds USVStrings (a lone surrogate turns into U+FFFD on the way in), so those poisons cannot arrive in a form.
      if (keys.length) arbs.push(fc.constantFrom(...keys).chain((k) => poisonedString(fields[k]).filter(isWellFormedText).map((v) => put(withField(arg, k, v), 'poisoned field', `${k}=${JSON.stringify(v)}`))));
    } else if (typeof arg === 'string') {
      arbs.push(poisonedString(arg.slice(0, 2000)).map((v) => put(arg.length > 2000 ? v + arg.slice(2000) : v, 'poisoned text', JSON.stringify(v).slice(0, 120))));
    } else if (typeof arg === 'object') {
      const texts = leafPaths(arg, 'string');
      const numbers = leafPaths(arg, 'number');
      const label = (p: Path) => p.join('.') || '(root)';
      if (texts.length) {
        arbs.push(fc.constantFrom(...texts).chain((p) => poisonedString(getAt(arg, p) as string).map((v) => put(setAt(arg as never, p, v), 'poisoned text', `${label(p)}=${JSON.stringify(v).slice(0, 80)}`))));
      }
      if (numbers.length) {
        arbs.push(fc.tuple(fc.constantFrom(...numbers), fc.constantFrom(...POISON_NUMBERS)).map(([p, v]) => put(setAt(arg as never, p, v), 'poison number', `${label(p)}=${v}`)));
      }
    }
  });
  // An action that takes nothing is sent something: it must refuse it, not act on it.
  if (!args.length) arbs.push(fc.constantFrom(...wrongShapes(undefined)).map((v) => ({ args: [v], category: 'wrong shape', what: `an argument where none is taken: ${shapeLabel(v)}` })));
  return fc.oneof(...arbs);
}

function actionCaller(c: ActionCase): Caller {
  return c.allowed === 'public' ? { kind: 'outsider' } : { kind: 'session', person: ws.people[c.allowed[0]] };
}

async function actionArgs(c: ActionCase): Promise<unknown[]> {
  const args = c.argsAsync ? await c.argsAsync(ws) : c.args!(ws);
  lastSnapshot = undefined;
  return args;
}

/** Calls the action; a throw is what the browser would see as a 500. */
async function callAction(c: ActionCase, caller: Caller, args: unknown[]): Promise<{ ok: boolean; status?: number; threw?: string }> {
  try {
    const res = await asCaller(caller, () => actions.get(c.action)!(...args));
    return res && typeof res === 'object' ? res : { ok: false, threw: `returned ${String(res)}` };
  } catch (err) {
    return { ok: false, threw: err instanceof Error ? `${err.name}: ${err.message}` : String(err) };
  }
}

describe('server action coverage', () => {
  it('every server action has a row (with arguments) to fuzz', () => {
    const listed = new Set(ACTION_CASES.map((c) => c.action));
    expect([...actions.keys()].filter((k) => !listed.has(k))).toEqual([]);
    expect(ACTION_CASES.filter((c) => !c.args && !c.argsAsync).map((c) => c.action)).toEqual([]);
  });
});

describe.each(ACTION_CASES.map((c) => ({ c, name: c.action })))('$name (server action)', ({ c }) => {
  it('refuses wrong shapes, poisoned text and impossible numbers with a 4xx result, and changes nothing', async () => {
    const caller = actionCaller(c);
    const args = await actionArgs(c);
    await expectNoWrites(`${c.action}`, () =>
      fc.assert(
        fc.asyncProperty(actionSamples(args), async (sample) => {
          count(c.action, sample.category);
          const before = EACH ? (lastSnapshot ?? (await snapshot())) : undefined;
          const res = await callAction(c, caller, sample.args);
          const where = `${c.action} — ${sample.category}, ${sample.what} → ${JSON.stringify(res).slice(0, 300)}`;
          expect(res.threw, where).toBeUndefined();
          expect(res.ok, where).toBe(false);
          expect(res.status, where).toBeGreaterThanOrEqual(400);
          expect(res.status, where).toBeLessThan(500);
          if (before) {
            lastSnapshot = await snapshot();
            expect(changedTables(before, lastSnapshot), where).toEqual([]);
          }
        }),
        { seed: SEED, numRuns: RUNS.action, endOnFailure: true },
      ),
    );
  }, BATCH_TIMEOUT_MS);

  it('takes prototype-named fields as plain data: no crash, no polluted prototype', async () => {
    const caller = actionCaller(c);
    const args = (await actionArgs(c)).map((arg) => {
      if (arg instanceof FormData) {
        const f = withField(arg, '', '');
        for (const k of PROTOTYPE_KEYS) f.append(k, 'polluted');
        return f;
      }
      if (arg && typeof arg === 'object' && !Array.isArray(arg)) {
        const copy = { ...(arg as Record<string, unknown>) };
        for (const k of PROTOTYPE_KEYS) Object.defineProperty(copy, k, { value: { polluted: true }, enumerable: true, writable: true, configurable: true });
        return copy;
      }
      return arg;
    });
    // Only forms and object inputs carry field names.
    if (!args.some((arg) => arg instanceof FormData || (arg && typeof arg === 'object' && !Array.isArray(arg)))) return;
    count(c.action, 'prototype keys');
    const res = await callAction(c, caller, args);
    expect(res.threw, JSON.stringify(res)).toBeUndefined();
    expect(res.status ?? 200, JSON.stringify(res)).toBeLessThan(500);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });
});

// ---------------------------------------------------------------------------------------------
// Page query parameters: the page component is called as Next.js calls it (params and
// searchParams as promises, the session from the request headers). A redirect or not-found is
// a fine answer; a throw of anything else is a 500 page.

interface PageCase {
  /** The page file under app/. */
  page: string;
  caller: 'outsider' | 'developer' | 'production';
  /** The query keys the page reads. */
  keys: string[];
  /** A route row whose prepare() gives the page's path parameters. */
  paramsFrom?: string;
}

const PAGE_CASES: PageCase[] = [
  { page: '(taster)/join/page.tsx', caller: 'outsider', keys: ['code'] },
  { page: '(auth)/sign-in/page.tsx', caller: 'outsider', keys: ['error', 'reset', 'joined'] },
  { page: '(lab)/formulas/page.tsx', caller: 'developer', keys: ['q'] },
  { page: '(lab)/formulas/[formulaId]/history/page.tsx', caller: 'developer', keys: ['a', 'b'], paramsFrom: 'GET /api/v1/formulas/[formulaId]' },
  { page: '(lab)/trials/page.tsx', caller: 'developer', keys: ['status', 'owner', 'product', 'from', 'to', 'q'] },
  { page: '(lab)/trials/new/page.tsx', caller: 'developer', keys: ['formula'] },
  { page: '(lab)/ingredients/page.tsx', caller: 'developer', keys: ['q', 'kind', 'sort', 'dir', 'archived'] },
  { page: '(lab)/tastings/page.tsx', caller: 'developer', keys: ['state', 'trial'] },
  { page: '(lab)/tastings/[tastingId]/results/page.tsx', caller: 'developer', keys: ['penalty'], paramsFrom: 'GET /api/v1/tastings/[tastingId]/results' },
  { page: '(lab)/formulas/[formulaId]/label/page.tsx', caller: 'developer', keys: ['reference'], paramsFrom: 'GET /api/v1/formulas/[formulaId]/label' },
  { page: '(lab)/trials/[trialId]/variants/[variantId]/label/page.tsx', caller: 'developer', keys: ['reference'], paramsFrom: 'GET /api/v1/trials/[trialId]/variants/[variantId]/label' },
  { page: '(lab)/models/[family]/page.tsx', caller: 'developer', keys: ['response', 'kind', 'x', 'y', 'trials'], paramsFrom: 'GET /api/v1/models/[family]/dataset' },
  { page: '(lab)/production/versions/[versionId]/sheet/page.tsx', caller: 'production', keys: ['target', 'amount', 'unit', 'step', 'stepUnit', 'altitudeM', 'paper'], paramsFrom: 'GET /api/v1/production-versions/[versionId]/batch-sheet' },
];

/** Next.js's answers that are not errors: redirect, not found, forbidden. */
function isNavigation(err: unknown): boolean {
  const digest = (err as { digest?: unknown } | null)?.digest;
  return typeof digest === 'string' && (digest.startsWith('NEXT_REDIRECT') || digest.startsWith('NEXT_HTTP_ERROR_FALLBACK;'));
}

describe('page coverage', () => {
  it('every page that reads searchParams is fuzzed here', () => {
    const listed = new Set(PAGE_CASES.map((p) => p.page));
    expect(pagesReadingSearchParams().filter((p) => !listed.has(p)), 'add the page to PAGE_CASES in tests/integration/fuzz.test.ts').toEqual([]);
  });
});

describe.each(PAGE_CASES.map((p) => ({ p, name: p.page })))('$name query', ({ p }) => {
  it('never fails on hostile query parameters and changes nothing', async () => {
    const mod = (await import(path.join(ROOT, 'app', p.page))) as { default: (props: { params: Promise<unknown>; searchParams: Promise<unknown> }) => Promise<unknown> };
    const caller: Caller = p.caller === 'outsider' ? { kind: 'outsider' } : { kind: 'session', person: ws.people[p.caller] };
    const params = p.paramsFrom ? ((await casesByRoute.get(p.paramsFrom)!.prepare!(ws, caller.kind === 'session' ? caller.person : null)).params ?? {}) : {};
    lastSnapshot = undefined;
    await expectNoWrites(`${p.page} query`, () =>
      fc.assert(
        fc.asyncProperty(queryPairs(p.keys), async (pairs) => {
          count(`page ${p.page}`, 'query');
          const where = `${p.page} ?${encodeQuery(pairs).slice(0, 200)}`;
          let failure: unknown;
          try {
            await asCaller(caller, () => mod.default({ params: Promise.resolve(params), searchParams: Promise.resolve(searchParamsOf(pairs)) }));
          } catch (err) {
            if (!isNavigation(err)) failure = err;
          }
          expect(failure, where).toBeUndefined();
        }),
        { seed: SEED, numRuns: RUNS.page, endOnFailure: true },
      ),
    );
  }, BATCH_TIMEOUT_MS);

  it('takes each class of bad input in each key it reads, alone and repeated, and changes nothing', async () => {
    const mod = (await import(path.join(ROOT, 'app', p.page))) as { default: (props: { params: Promise<unknown>; searchParams: Promise<unknown> }) => Promise<unknown> };
    const caller: Caller = p.caller === 'outsider' ? { kind: 'outsider' } : { kind: 'session', person: ws.people[p.caller] };
    const params = p.paramsFrom ? ((await casesByRoute.get(p.paramsFrom)!.prepare!(ws, caller.kind === 'session' ? caller.person : null)).params ?? {}) : {};
    lastSnapshot = undefined;
    await expectNoWrites(`${p.page} query classes`, async () => {
      for (const key of p.keys) {
        for (const [what, value] of badInputClasses('1')) {
          for (const pairs of [[[key, value]], [[key, value], [key, value]]] as Array<Array<[string, string]>>) {
            count(`page ${p.page}`, 'query classes');
            let failure: unknown;
            try {
              await asCaller(caller, () => mod.default({ params: Promise.resolve(params), searchParams: Promise.resolve(searchParamsOf(pairs)) }));
            } catch (err) {
              if (!isNavigation(err)) failure = err;
            }
            expect(failure, `${p.page} ?${key}= ${what}${pairs.length > 1 ? ' (twice)' : ''}`).toBeUndefined();
          }
        }
      }
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    });
  }, BATCH_TIMEOUT_MS);
});
