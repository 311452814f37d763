/**
 * A link to a record of another of the user's workspaces (an e-mail, a colleague's message) lands
 * on the not-found or forbidden page of the active workspace. This finds which of the user's OTHER
 * active workspaces holds the record, so that page can offer to switch. Someone who is not a member
 * of the record's workspace learns nothing: the look-up only searches their own memberships.
 */
import { cache } from 'react';
import { headers } from 'next/headers';
import { sql } from '@/lib/sql';
import { currentActor, currentWorkspaces } from '@/lib/auth';
import { isUuid } from '@/lib/ids';
import { can, ROLE_LABELS, type Actor, type Permission } from '@/lib/permissions';
import { BatchRecord, Formula, Ingredient, PackagingItem, Tasting, Product, ProductVersion, PromotionRequest, Trial } from '@/entities';
import { listMyWorkspaces } from './queries';
import type { WorkspaceChoice } from './schema';
import { REQUEST_PATH_HEADER } from './record-path';


/** The record pages a link can point to: the path's first id names the record. */
const RECORD_ROUTES = [
  { prefix: '/trials/', kind: 'trial', entity: Trial, permission: 'trials.read', opens: 'trials' },
  { prefix: '/formulas/', kind: 'formula', entity: Formula, permission: 'formulas.read', opens: 'formulas' },
  { prefix: '/tastings/', kind: 'tasting', entity: Tasting, permission: 'tastings.read', opens: 'tastings' },
  { prefix: '/production/reviews/', kind: 'promotion request', entity: PromotionRequest, permission: 'promotion.read', opens: 'promotion requests' },
  { prefix: '/production/products/', kind: 'product', entity: Product, permission: 'production.read', opens: 'products' },
  { prefix: '/production/batches/', kind: 'batch', entity: BatchRecord, permission: 'production.read', opens: 'batches' },
  { prefix: '/production/versions/', kind: 'production version', entity: ProductVersion, permission: 'production.read', opens: 'production versions' },
  { prefix: '/ingredients/', kind: 'ingredient', entity: Ingredient, permission: 'ingredients.write', opens: 'ingredient entries' },
  { prefix: '/prices/packaging/', kind: 'packaging item', entity: PackagingItem, permission: 'prices.read', opens: 'prices' },
  { prefix: '/prices/', kind: 'ingredient’s prices', entity: Ingredient, permission: 'prices.read', opens: 'prices' },
] as const satisfies ReadonlyArray<{ prefix: string; kind: string; entity: unknown; permission: Permission; opens: string }>;

type RecordRoute = (typeof RECORD_ROUTES)[number];

export interface RecordHome {
  /** "trial", "formula" … as the page names the record. */
  kind: string;
  workspaceId: string;
  workspaceName: string;
  roleLabel: string;
  /** False when the role held there cannot open the record: no switch is offered then. */
  canOpen: boolean;
  /** What the role would need to open, in plain words ("trials"). */
  opens: string;
  /** Where to go after switching: the same page, path only. */
  returnPath: string;
}

/** PURE: which record a path points at, or null. Only our own path shapes with a UUID are accepted. */
export function recordInPath(path: string): { route: RecordRoute; id: string; returnPath: string } | null {
  if (!/^\/[a-z0-9/-]{1,300}$/.test(path) || path.includes('//')) return null;
  for (const route of RECORD_ROUTES) {
    if (!path.startsWith(route.prefix)) continue;
    const id = path.slice(route.prefix.length).split('/')[0];
    if (id && isUuid(id)) return { route, id, returnPath: path };
  }
  return null;
}

/**
 * The user's other active workspace that holds the record the path points at, or null. `workspaces`
 * are the user's active memberships when the caller has read them already (the signed-in read).
 */
export async function findRecordHome(actor: Pick<Actor, 'userId' | 'workspaceId'>, path: string, workspaces?: WorkspaceChoice[]): Promise<RecordHome | null> {
  const target = recordInPath(path);
  if (!target) return null;
  const others = (workspaces ?? (await listMyWorkspaces(actor.userId))).filter((w) => w.workspaceId !== actor.workspaceId);
  if (others.length === 0) return null;
  // A plain statement (this runs on every staff page of a person with another workspace): the table
  // name is the route's entity's own, never taken from the path; the id is a checked UUID.
  const table = target.route.entity.meta.tableName;
  const [found] = await sql<{ workspace_id: string }>(
    `select workspace_id from "${table}" where id = $1 and workspace_id = any($2::uuid[]) limit 1`,
    [target.id, others.map((w) => w.workspaceId)],
    `record-home-${table}`,
  );
  const home = found && others.find((w) => w.workspaceId === found.workspace_id);
  if (!home) return null;
  return {
    kind: target.route.kind,
    workspaceId: home.workspaceId,
    workspaceName: home.name,
    roleLabel: ROLE_LABELS[home.role],
    canOpen: can(home.role, target.route.permission),
    opens: target.route.opens,
    returnPath: target.returnPath,
  };
}

/**
 * For the not-found and forbidden pages: the record home of this request, if the signed-in user has
 * one. Next.js renders every segment's not-found page with each page (ready in case the page calls
 * notFound()), so this runs on every staff page load: once per request (React `cache`), from the
 * memberships the signed-in read already holds, and a look-up only for someone with another workspace.
 */
export const recordHomeOfRequest = cache(async (): Promise<RecordHome | null> => {
  const path = (await headers()).get(REQUEST_PATH_HEADER);
  if (!path) return null;
  const actor = await currentActor();
  if (!actor) return null;
  return findRecordHome(actor, path, await currentWorkspaces());
});
