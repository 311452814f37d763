/**
 * Who may do what. This module is the one place that decides it: every layout, page,
 * server action and route handler calls `authorize` (through the adapters in
 * lib/auth.ts, lib/api/route.ts and lib/actions.ts). Middleware is never relied on.
 */
import { ROLES, type Role } from '@/lib/roles';

export { ROLES, type Role };

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  developer: 'Product developer',
  head_of_product: 'Head of product',
  production: 'Production lead',
  taster: 'Taster',
};

const STAFF: Role[] = ['admin', 'developer', 'head_of_product', 'production'];
const EVERYONE: Role[] = [...ROLES];

/** Each permission lists the roles that hold it. Add a permission here, never a role check in a page. */
const GRANTS = {
  'account.self': EVERYONE,
  'tastings.own': EVERYONE,
  'members.manage': ['admin'],
  'outbox.read': ['admin'],
  'tokens.manage': STAFF,
  'ingredients.read': ['admin', 'developer', 'head_of_product'],
  'ingredients.write': ['admin', 'developer'],
  'formulas.read': ['admin', 'developer', 'head_of_product'],
  'formulas.write': ['admin', 'developer'],
  'calc.run': STAFF,
  'trials.read': ['admin', 'developer', 'head_of_product'],
  'trials.write': ['admin', 'developer'],
  'tastings.read': ['admin', 'developer', 'head_of_product'],
  /** Response-surface models of the workspace's trials: data sets, fits, predictions, proposals. */
  'models.read': ['admin', 'developer', 'head_of_product'],
  'tastings.run': ['admin', 'developer'],
  'promotion.read': ['admin', 'developer', 'head_of_product'],
  'promotion.request': ['admin', 'developer'],
  'promotion.decide': ['head_of_product'],
  'production.read': STAFF,
  'batches.record': ['production'],
  'audit.read': ['admin', 'head_of_product'],
  /** Prices, packaging and costs: staff only, never tasters or guests. */
  'prices.read': STAFF,
  'prices.write': ['admin', 'developer', 'production'],
  /** The workspace's currency, overfill and cost-warning threshold. */
  'costs.settings': ['admin'],
} satisfies Record<string, Role[]>;

export type Permission = keyof typeof GRANTS;

export function can(role: Role, permission: Permission): boolean {
  return (GRANTS[permission] as Role[]).includes(role);
}

export function rolesWith(permission: Permission): Role[] {
  return [...(GRANTS[permission] as Role[])];
}

/** The signed-in person acting in one workspace, as every feature module receives them. */
export interface Actor {
  userId: string;
  email: string;
  name: string;
  workspaceId: string;
  workspaceName: string;
  role: Role;
  via: 'session' | 'token';
  massUnits: 'metric' | 'imperial';
  temperatureUnit: 'C' | 'F';
}

/** 401: nobody is signed in; 403: signed in without the permission; 404: not in this workspace. */
export class AccessDenied extends Error {
  constructor(
    readonly status: 401 | 403 | 404,
    message: string,
  ) {
    super(message);
    this.name = 'AccessDenied';
  }
}

export function authorize(actor: Actor | null, permission: Permission): Actor {
  if (!actor) throw new AccessDenied(401, 'Sign in to continue.');
  if (!can(actor.role, permission)) {
    throw new AccessDenied(403, `Your role (${ROLE_LABELS[actor.role]}) does not allow this.`);
  }
  return actor;
}

/** Staff work in the lab; a taster only takes part in tastings. */
export function isStaff(role: Role): boolean {
  return STAFF.includes(role);
}

/** A promotion request as the rules below need it. */
export interface RequestParties {
  requestedById: string;
}

/**
 * The four-eyes rule of promotion: only the head of product decides, and never on a request they
 * made themselves (an admin who also holds the role is no exception).
 */
export function mayDecide(actor: Actor, request: RequestParties): boolean {
  return can(actor.role, 'promotion.decide') && request.requestedById !== actor.userId;
}

/** The four-eyes rule seen from the requester: they hold the role but must leave this one to another. */
export function awaitsAnotherDecider(actor: Actor, request: RequestParties): boolean {
  return can(actor.role, 'promotion.decide') && request.requestedById === actor.userId;
}

export function authorizeDecision(actor: Actor | null, request: RequestParties): Actor {
  const decider = authorize(actor, 'promotion.decide');
  if (!mayDecide(decider, request)) {
    throw new AccessDenied(403, 'Nobody approves their own request: another head of product must decide it.');
  }
  return decider;
}

/** Only the person who made a request may take it back. */
export function mayWithdraw(actor: Actor, request: RequestParties): boolean {
  return request.requestedById === actor.userId;
}

export function authorizeWithdrawal(actor: Actor, request: RequestParties): Actor {
  if (!mayWithdraw(actor, request)) throw new AccessDenied(403, 'Only the person who made the request can withdraw it.');
  return actor;
}

/** The where-clause fragment every query starts from: nothing is read across workspaces. */
export function inWorkspace(actor: Pick<Actor, 'workspaceId'>): { workspace: string } {
  return { workspace: actor.workspaceId };
}

/** A record that is absent or belongs to another workspace looks the same: 404, never 403. */
export function notFound(what = 'record'): AccessDenied {
  return new AccessDenied(404, `No such ${what}.`);
}
