/**
 * Hostile input classes against the real routes and server actions (issue 13, part 4). Each
 * describe block is one class; each case answered 500 (or was stored) before lib/input.ts. The
 * valid requests come from the access table's rows, so only the named field is bad.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { getEm } from '@/lib/db';
import { asCaller, callRoute, createWorkspace, type Caller, type WorkspaceFixture } from './harness';
import { ACTION_CASES, ROUTE_CASES } from './access-table';
import { discoverActions, discoverRoutes, type RouteHandler, type ServerAction } from './routes';
import type { Role } from '@/lib/permissions';

let ws: WorkspaceFixture;
let routes: Map<string, RouteHandler>;
let actions: Map<string, ServerAction>;

beforeAll(async () => {
  ws = await createWorkspace('Input kitchen');
  routes = await discoverRoutes();
  actions = await discoverActions();
});

/** Total rows in the tables a refused request could have written to. */
async function rowCounts(): Promise<Record<string, number>> {
  const conn = (await getEm()).getConnection();
  const tables = ['measurements', 'batch_records', 'formula_revisions', 'panel_seats', 'trials', 'users', 'formulas', 'ingredients', 'ingredient_prices', 'packaging_items'];
  const rows = (await conn.execute(tables.map((t) => `select '${t}' as t, count(*)::int as n from "${t}"`).join(' union all '))) as Array<{ t: string; n: number }>;
  return Object.fromEntries(rows.map((r) => [r.t, r.n]));
}

/** Calls a route with its access-table example, changed by `edit`; expects a 4xx in the error shape and no new rows. */
async function refused(route: string, edit: (spec: { params: Record<string, string>; body: any; query: string }) => void, role?: Role) {
  const row = ROUTE_CASES.find((c) => c.route === route)!;
  const who = role ?? (row.allowed === 'public' ? null : row.allowed[0]);
  const caller: Caller = who ? { kind: 'session', person: ws.people[who] } : { kind: 'outsider' };
  const prepared = (await row.prepare?.(ws, who ? ws.people[who] : null)) ?? {};
  const spec = { params: prepared.params ?? {}, body: structuredClone(prepared.body), query: '' };
  edit(spec);
  const [method, pattern] = route.split(' ');
  const path = pattern.replace(/\[(\w+)\]/g, (_, k: string) => spec.params[k]) + (spec.query ? `?${spec.query}` : '');
  const before = await rowCounts();
  const headers = route === 'POST /api/v1/tastings/join' ? { 'x-forwarded-for': '198.51.100.77' } : undefined;
  const res = await callRoute(routes.get(route)!, { method, path, caller, params: spec.params, body: spec.body, headers });
  expect(res.status, JSON.stringify(res.body)).toBeGreaterThanOrEqual(400);
  expect(res.status, JSON.stringify(res.body)).toBeLessThan(500);
  expect(res.body.error.code).toEqual(expect.any(String));
  expect(await rowCounts()).toEqual(before);
  return res;
}

describe('NUL and control characters', () => {
  it('a NUL in the display name of the unauthenticated tasting join is a 422, not a 500', async () => {
    const res = await refused('POST /api/v1/tastings/join', (s) => (s.body.displayName = 'Ann\u0000'));
    expect(res.status).toBe(422);
  });

  it.each(['GET /api/v1/formulas', 'GET /api/v1/trials', 'GET /api/v1/ingredients', 'GET /api/v1/ingredients/export'])('a NUL in the search query of %s is a 422', async (route) => {
    const res = await refused(route, (s) => (s.query = 'q=jam%00'));
    expect(res.status).toBe(422);
  });

  it('a bidi override in a cook note is refused', async () => {
    await refused('POST /api/v1/trials/[trialId]/cooks', (s) => (s.body.notes = 'fine\u202Eenif'));
  });
});

describe('names that show nothing', () => {
  // Each answered 201 and listed a blank row or option (user walk). Default-ignorable code points: Unicode §5.21.
  it.each([
    ['POST /api/v1/ingredients', 'name', 'Give the ingredient a name.'],
    ['PATCH /api/v1/ingredients/[ingredientId]', 'name', 'Give the ingredient a name.'],
    ['POST /api/v1/packaging-items', 'name', 'Give the packaging item a name.'],
    ['POST /api/v1/formulas', 'name', 'Give the formula a name.'],
    ['POST /api/v1/prices', 'supplier', 'This holds only invisible characters: type the text, or leave it empty.'],
  ])('%s with a %s of zero-width characters is a 422 naming the field', async (route, field, message) => {
    const res = await refused(route, (s) => (s.body[field] = '\u200B\u2060\uFEFF'));
    expect(res.status).toBe(422);
    expect(res.body.error.fields[field]).toEqual([message]);
  });
});

describe('impossible calendar dates', () => {
  it.each(['2026-02-30', '2026-04-31', '0000-01-01'])('a cook dated %s is a 422', async (date) => {
    const res = await refused('POST /api/v1/trials/[trialId]/cooks', (s) => (s.body.cookDate = date));
    expect(res.body.error.fields.cookDate).toBeDefined();
  });

  it('a CSV import with a cook dated 30 February names the row and the column', async () => {
    const res = await refused('POST /api/v1/trials/[trialId]/cooks/import', (s) => (s.body.csv = 'variant,cook_date,ph\nB,2026-02-30,3.2\n'));
    expect(Object.keys(res.body.error.fields)).toEqual(['row 2, cook_date']);
  });

  it('a batch record dated 31 April is a 422', async () => {
    const res = await refused('POST /api/v1/production-versions/[versionId]/batches', (s) => (s.body.batchDate = '2026-04-31'));
    expect(res.body.error.fields.batchDate).toBeDefined();
  });
});

describe('integers past 2^31 and 2^53', () => {
  it.each([2 ** 31, 2 ** 53 + 2])('a formula revision based on revision %d is a 422', async (n) => {
    const res = await refused('POST /api/v1/formulas/[formulaId]/revisions', (s) => (s.body.baseRevision = n));
    expect(res.status).toBe(422);
  });
});

describe('tiny and huge floats', () => {
  it('a batch sheet for 0.4 jars is a 422', async () => {
    const res = await refused('GET /api/v1/production-versions/[versionId]/batch-sheet', (s) => (s.query = 'target=jar_count&amount=0.4'));
    expect(res.body.error.fields.amount).toBeDefined();
  });

  it('a batch sheet rounded to steps of 1e-300 is a 422', async () => {
    const res = await refused('GET /api/v1/production-versions/[versionId]/batch-sheet', (s) => (s.query = 'step=1e-300'));
    expect(res.body.error.fields.step).toBeDefined();
  });
});

describe('server actions given the wrong shape', () => {
  const callAs = async (name: string, caller: Caller, args: unknown[]) => {
    const before = await rowCounts();
    const res = await asCaller(caller, () => actions.get(name)!(...args));
    expect(await rowCounts()).toEqual(before);
    return res as { ok: boolean; status?: number; error?: string };
  };

  it('a plain object instead of the form is a 400 result, not a crash', async () => {
    const res = await callAs('lib/account/actions.ts#updatePreferencesAction', { kind: 'session', person: ws.people.developer }, [null, { name: 'X', massUnits: 'metric', temperatureUnit: 'C' }]);
    expect(res).toMatchObject({ ok: false, status: 400 });
    expect(res.error).toMatch(/shape/);
    const open = await callAs('lib/account/actions.ts#requestPasswordResetAction', { kind: 'outsider' }, [null, { email: 'a@b.example' }]);
    expect(open).toMatchObject({ ok: false, status: 400 });
  });

  it('form data where an object is expected is refused with a 4xx result', async () => {
    const form = new FormData();
    form.set('title', 'T');
    const res = await callAs('lib/trials/actions.ts#createTrialAction', { kind: 'session', person: ws.people.developer }, [form]);
    expect(res.ok).toBe(false);
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
  });
});

describe('prototype-named keys', () => {
  it('form fields named __proto__, constructor and prototype neither crash an action nor reach Object.prototype', async () => {
    const row = ACTION_CASES.find((c) => c.action === 'lib/account/actions.ts#updatePreferencesAction')!;
    const [, form] = row.args!(ws) as [null, FormData];
    for (const k of ['__proto__', 'constructor', 'prototype']) form.append(k, 'polluted');
    const res = (await asCaller({ kind: 'session', person: ws.people.developer }, () => actions.get(row.action)!(null, form))) as { ok: boolean };
    expect(res.ok).toBe(true);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('a JSON body with a __proto__ key is refused (API bodies are strict)', async () => {
    await refused('POST /api/v1/tokens', (s) => (s.body = JSON.parse('{"label":"x","__proto__":{"isAdmin":true}}')));
  });
});

describe('values of the wrong JSON type', () => {
  // Each answered "Enter text here." or zod's "Invalid input: expected array, received object"; now the field and the type (JSON types: RFC 8259 §3).
  it('a number as the formula name and an object as its lines: 422 naming both, nothing stored', async () => {
    const res = await refused('POST /api/v1/formulas', (s) => {
      s.body.name = 12;
      s.body.lines = { first: s.body.lines[0] };
    });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.name).toEqual(['"name" must be text, not a number.']);
    expect(res.body.error.fields.lines).toEqual(['"lines" must be a list, not an object.']);
  });

  it("a list as the formula settings; text as a line quantity keeps the quantity's own words", async () => {
    const res = await refused('POST /api/v1/formulas', (s) => {
      s.body.settings = [];
      s.body.lines[0].quantity = '1000';
    });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.settings).toEqual(['"settings" must be an object, not a list.']);
    expect(res.body.error.fields['lines.0.quantity']).toEqual(['Quantity must be a number.']);
  });

  it('a number as an ingredient name', async () => {
    const res = await refused('POST /api/v1/ingredients', (s) => (s.body.name = 42));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.name).toEqual(['"name" must be text, not a number.']);
  });

  it("a number as a price's supplier", async () => {
    const res = await refused('POST /api/v1/prices', (s) => (s.body.supplier = 7));
    expect(res.status).toBe(422);
    expect(res.body.error.fields.supplier).toEqual(['"supplier" must be text, not a number.']);
  });
});
