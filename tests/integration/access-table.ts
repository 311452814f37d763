/**
 * The authorisation table: every route handler and server action, who may use it, and how
 * to build a call against a record of workspace A. authorization.test.ts fails when a route
 * or action exists that is not listed here. Extend it with every new route or action.
 */
import { getEm } from '@/lib/db';
import { Invitation, ApiToken } from '@/entities';
import { hashSecret, newSecret } from '@/lib/secrets';
import { API_TOKEN_PREFIX } from '@/lib/auth';
import type { Role } from '@/lib/permissions';
import type { Person, WorkspaceFixture } from './harness';
import { createFixtureFormula, starterIds, strawberryJamInput } from './fixtures';

export type CallSpec = { params?: Record<string, string>; body?: unknown };

export interface RouteCase {
  /** "METHOD /app/path/[param]" as the file system names it. */
  route: string;
  /** 'public' routes need no sign-in. */
  allowed: Role[] | 'public';
  /**
   * What a member of another workspace (an admin there) gets: 404 for a record of
   * workspace A, 422 when the body names workspace A's records (they match nothing, with
   * the same message as an unknown id), 'own-data' where the route only ever shows the
   * caller's own workspace.
   */
  otherWorkspace: 404 | 422 | 'own-data' | 'public';
  /** The role the member of the other workspace holds there (default admin), for routes admin may not use. */
  otherWorkspaceRole?: Role;
  /** What an allowed caller gets when it is not a 2xx: the version routes answer every change with 409. */
  allowedStatus?: number;
  /** Builds the call for a caller (null for the outsider) against workspace A's records. */
  prepare?: (a: WorkspaceFixture, caller: Person | null) => Promise<CallSpec> | CallSpec;
}

const STAFF: Role[] = ['admin', 'developer', 'head_of_product', 'production'];
const ALL: Role[] = [...STAFF, 'taster'];

async function openInvitation(a: WorkspaceFixture): Promise<string> {
  const em = await getEm();
  const inv = em.create(Invitation, {
    workspace: a.workspaceId,
    email: `invitee.${Math.random().toString(36).slice(2)}@test.example`,
    role: 'taster',
    tokenHash: hashSecret(newSecret()),
    invitedBy: a.people.admin.userId,
    expiresAt: new Date(Date.now() + 3600_000),
  } as never) as unknown as { id: string };
  await em.flush();
  return inv.id;
}

async function tokenOf(a: WorkspaceFixture, owner: Person): Promise<string> {
  const em = await getEm();
  const secret = newSecret(API_TOKEN_PREFIX);
  const t = em.create(ApiToken, { workspace: a.workspaceId, user: owner.userId, label: 'matrix', displayPrefix: secret.slice(0, 10), tokenHash: hashSecret(secret) } as never) as unknown as { id: string };
  await em.flush();
  return t.id;
}

async function membershipIdOf(a: WorkspaceFixture, role: Role): Promise<string> {
  const em = await getEm();
  const { Membership } = await import('@/entities');
  const m = await em.findOneOrFail(Membership, { workspace: a.workspaceId, user: a.people[role].userId });
  return m.id;
}

export const ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/health', allowed: 'public', otherWorkspace: 'public' },
  { route: 'GET /api/v1/openapi.json', allowed: 'public', otherWorkspace: 'public' },
  { route: 'GET /api/v1/me', allowed: ALL, otherWorkspace: 'own-data' },
  { route: 'GET /api/v1/members', allowed: ['admin'], otherWorkspace: 'own-data' },
  {
    route: 'POST /api/v1/members',
    allowed: ['admin'],
    otherWorkspace: 'own-data',
    prepare: () => ({ body: { email: `matrix.${Math.random().toString(36).slice(2)}@test.example`, role: 'taster' } }),
  },
  {
    route: 'PATCH /api/v1/members/[membershipId]',
    allowed: ['admin'],
    otherWorkspace: 404,
    // Setting the developer's role to what it already is: allowed callers change nothing.
    prepare: async (a) => ({ params: { membershipId: await membershipIdOf(a, 'developer') }, body: { role: 'developer' } }),
  },
  {
    route: 'DELETE /api/v1/invitations/[invitationId]',
    allowed: ['admin'],
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { invitationId: await openInvitation(a) } }),
  },
  { route: 'GET /api/v1/tokens', allowed: STAFF, otherWorkspace: 'own-data' },
  { route: 'POST /api/v1/tokens', allowed: STAFF, otherWorkspace: 'own-data', prepare: () => ({ body: { label: 'matrix token' } }) },
  {
    route: 'DELETE /api/v1/tokens/[tokenId]',
    allowed: STAFF,
    otherWorkspace: 404,
    // Allowed callers revoke a token of their own; everyone else aims at the developer's.
    prepare: async (a, caller) => ({
      params: { tokenId: await tokenOf(a, caller && caller.role !== 'taster' ? caller : a.people.developer) },
    }),
  },
];

const READ_FORMULAS: Role[] = ['admin', 'developer', 'head_of_product'];
const WRITE_FORMULAS: Role[] = ['admin', 'developer'];
const CUSTOM_INGREDIENT = { name: 'Matrix rhubarb', kind: 'fruit', solidsPct: 5, pectinLevel: 'low', euFruitGroup: 'general' };
/** With label data, so the fuzz test reaches the nested nutrient, allergen and additive fields. */
const CUSTOM_INGREDIENT_WITH_LABEL = {
  ...CUSTOM_INGREDIENT,
  labelData: {
    labelName: 'rhubarb', nutrients: { waterG: 93, proteinG: 0.9, fatG: 0.2, carbohydrateG: 4.5, sodiumMg: 4 },
    euAllergens: ['celery'], usAllergens: ['milk'], sulphiteMgPerKg: 0, additive: { eNumber: 'E440', functionalClass: 'gelling_agent' },
    isAddedWater: false, source: 'Supplier sheet 7',
  },
};

async function ingredientIdOf(a: WorkspaceFixture): Promise<string> {
  return (await starterIds(a)).strawberry;
}

ROUTE_CASES.push(
  { route: 'GET /api/v1/ingredients', allowed: READ_FORMULAS, otherWorkspace: 'own-data' },
  { route: 'POST /api/v1/ingredients', allowed: WRITE_FORMULAS, otherWorkspace: 'own-data', prepare: () => ({ body: CUSTOM_INGREDIENT_WITH_LABEL }) },
  { route: 'GET /api/v1/ingredients/export', allowed: READ_FORMULAS, otherWorkspace: 'own-data' },
  {
    route: 'POST /api/v1/ingredients/import',
    allowed: WRITE_FORMULAS,
    otherWorkspace: 'own-data',
    prepare: () => ({ body: { csv: 'name,kind,soluble_solids_pct,water_g,eu_allergens\nMatrix damson,fruit,14,80,sulphites\n' } }),
  },
  { route: 'GET /api/v1/ingredients/[ingredientId]', allowed: READ_FORMULAS, otherWorkspace: 404, prepare: async (a) => ({ params: { ingredientId: await ingredientIdOf(a) } }) },
  {
    route: 'PATCH /api/v1/ingredients/[ingredientId]',
    allowed: WRITE_FORMULAS,
    otherWorkspace: 404,
    prepare: async (a) => {
      const ids = await starterIds(a);
      return { params: { ingredientId: ids.water }, body: { name: 'Water', kind: 'water', solidsPct: 0 } };
    },
  },
  {
    route: 'DELETE /api/v1/ingredients/[ingredientId]',
    allowed: WRITE_FORMULAS,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { ingredientId: (await starterIds(a)).honey } }),
  },
  { route: 'GET /api/v1/formulas', allowed: READ_FORMULAS, otherWorkspace: 'own-data' },
  { route: 'POST /api/v1/formulas', allowed: WRITE_FORMULAS, otherWorkspace: 422, prepare: async (a) => ({ body: await strawberryJamInput(a) }) },
  { route: 'GET /api/v1/formulas/[formulaId]', allowed: READ_FORMULAS, otherWorkspace: 404, prepare: async (a) => ({ params: { formulaId: await createFixtureFormula(a) } }) },
  { route: 'GET /api/v1/formulas/[formulaId]/label', allowed: READ_FORMULAS, otherWorkspace: 404, prepare: async (a) => ({ params: { formulaId: await createFixtureFormula(a) } }) },
  { route: 'GET /api/v1/formulas/[formulaId]/revisions', allowed: READ_FORMULAS, otherWorkspace: 404, prepare: async (a) => ({ params: { formulaId: await createFixtureFormula(a) } }) },
  {
    route: 'POST /api/v1/formulas/[formulaId]/revisions',
    allowed: WRITE_FORMULAS,
    otherWorkspace: 404,
    prepare: async (a) => {
      const input = await strawberryJamInput(a);
      return { params: { formulaId: await createFixtureFormula(a) }, body: { baseRevision: 1, settings: input.settings, lines: input.lines, note: 'matrix' } };
    },
  },
  {
    route: 'GET /api/v1/formulas/[formulaId]/revisions/[number]',
    allowed: READ_FORMULAS,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { formulaId: await createFixtureFormula(a), number: '1' } }),
  },
  {
    route: 'POST /api/v1/calc/batch',
    allowed: STAFF,
    // Workspace A's ingredient ids mean nothing elsewhere: 422 naming the line, never A's data.
    otherWorkspace: 422,
    prepare: async (a) => {
      const input = await strawberryJamInput(a);
      return { body: { settings: input.settings, lines: input.lines } };
    },
  },
);

/** next-auth's own endpoints: public by nature, and tested through sign-in. */
export const EXEMPT_ROUTES = ['GET /api/auth/[...nextauth]', 'POST /api/auth/[...nextauth]'];

/** Routes that exist only on a benchmark server (SETWELL_BENCH_FLOOR=1); everywhere else they are 404 for everyone. */
export const BENCH_ONLY_ROUTES = ['POST /api/bench/floor'];

export interface ActionCase {
  /** "lib/<feature>/actions.ts#exportName" */
  action: string;
  allowed: Role[] | 'public';
  otherWorkspace: 404 | 422 | 'own-data' | 'public';
  otherWorkspaceRole?: Role;
  /** Arguments for a call against workspace A. */
  args?: (a: WorkspaceFixture) => unknown[];
  /** The same, when building them needs the database. */
  argsAsync?: (a: WorkspaceFixture) => Promise<unknown[]>;
  /** Run each role's call as a new person of that role: the action ends the caller's own sessions. */
  endsCallersSessions?: boolean;
}

function form(fields: Record<string, string>): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

export const ACTION_CASES: ActionCase[] = [
  // The signed-out flows are public: the single-use token in the link is their authorisation.
  { action: 'lib/account/actions.ts#acceptInvitationAction', allowed: 'public', otherWorkspace: 'public', args: () => [null, form({ token: 'x'.repeat(43), name: 'A', password: 'no', confirm: 'no' })] },
  { action: 'lib/account/actions.ts#requestPasswordResetAction', allowed: 'public', otherWorkspace: 'public', args: () => [null, form({ email: 'not-an-email' })] },
  { action: 'lib/account/actions.ts#resetPasswordAction', allowed: 'public', otherWorkspace: 'public', args: () => [null, form({ token: 'x'.repeat(43), password: 'no', confirm: 'no' })] },
  {
    action: 'lib/account/actions.ts#updatePreferencesAction',
    allowed: ALL,
    otherWorkspace: 'own-data',
    args: () => [null, form({ name: 'Same Name', massUnits: 'metric', temperatureUnit: 'C' })],
  },
  { action: 'lib/workspaces/actions.ts#switchWorkspaceAction', allowed: ALL, otherWorkspace: 404, args: (a) => [a.workspaceId] },
  { action: 'lib/account/actions.ts#signOutEverywhereAction', allowed: ALL, otherWorkspace: 'own-data', args: () => [], endsCallersSessions: true },
];

ACTION_CASES.push(
  { action: 'lib/ingredients/actions.ts#importIngredientsAction', allowed: WRITE_FORMULAS, otherWorkspace: 'own-data', args: () => ['name,kind,soluble_solids_pct\nMatrix plum,fruit,12\n'] },
  { action: 'lib/ingredients/actions.ts#saveIngredientAction', allowed: WRITE_FORMULAS, otherWorkspace: 'own-data', args: () => [null, CUSTOM_INGREDIENT_WITH_LABEL] },
  {
    action: 'lib/ingredients/actions.ts#archiveIngredientAction',
    allowed: WRITE_FORMULAS,
    otherWorkspace: 404,
    argsAsync: async (a) => [(await starterIds(a)).invert_syrup, true],
  },
  { action: 'lib/formulas/actions.ts#createFormulaAction', allowed: WRITE_FORMULAS, otherWorkspace: 422, argsAsync: async (a) => [await strawberryJamInput(a)] },
  {
    action: 'lib/formulas/actions.ts#reviseFormulaAction',
    allowed: WRITE_FORMULAS,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      const input = await strawberryJamInput(a);
      return [await createFixtureFormula(a), { baseRevision: 1, settings: input.settings, lines: input.lines }];
    },
  },
);

// Feature files keep their own rows; they are merged here so the matrix sees one table.
import { UPLOADS_ROUTE_CASES, UPLOADS_ACTION_CASES } from './access-uploads';
import { NOTEBOOK_ROUTE_CASES, NOTEBOOK_ACTION_CASES } from './access-notebook';
import { TRIALS_ROUTE_CASES, TRIALS_ACTION_CASES } from './access-trials';
import { TASTINGS_ROUTE_CASES, TASTINGS_ACTION_CASES } from './access-tastings';
import { PRODUCTION_ROUTE_CASES, PRODUCTION_ACTION_CASES } from './access-production';
import { PRICES_ROUTE_CASES, PRICES_ACTION_CASES } from './access-prices';
ROUTE_CASES.push(...UPLOADS_ROUTE_CASES, ...NOTEBOOK_ROUTE_CASES, ...TRIALS_ROUTE_CASES, ...TASTINGS_ROUTE_CASES, ...PRODUCTION_ROUTE_CASES, ...PRICES_ROUTE_CASES);
ACTION_CASES.push(...UPLOADS_ACTION_CASES, ...NOTEBOOK_ACTION_CASES, ...TRIALS_ACTION_CASES, ...TASTINGS_ACTION_CASES, ...PRODUCTION_ACTION_CASES, ...PRICES_ACTION_CASES);
import { COSTS_ROUTE_CASES } from './access-costs';
ROUTE_CASES.push(...COSTS_ROUTE_CASES);
import { MODELS_ROUTE_CASES } from './access-models';
ROUTE_CASES.push(...MODELS_ROUTE_CASES);

// A deprecated alias of a renamed path (lib/api/deprecated-paths.ts) gets the row of the path it names.
import { deprecatedAliasOf } from '@/lib/api/deprecated-paths';
ROUTE_CASES.push(
  ...ROUTE_CASES.flatMap((c): RouteCase[] => {
    const [method, route] = c.route.split(' ');
    const old = deprecatedAliasOf(route.replace(/\[(\w+)\]/g, '{$1}'));
    return old ? [{ ...c, route: `${method} ${old.replace(/\{(\w+)\}/g, '[$1]')}` }] : [];
  }),
);
