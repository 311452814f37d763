/** Authorisation-table rows for panels and the taster endpoints (merged into access-table.ts). */
import type { ActionCase, RouteCase } from './access-table';
import { trialWithVariants } from './access-trials';
import { actorOf, type WorkspaceFixture } from './harness';
import { createPanelSession, inviteStaffTasters, openPanelSession } from '@/lib/panels/mutations';
import { listAttributes } from '@/lib/panels/queries';
import { joinAsGuest } from '@/lib/panels/mutations';
import { recordConsent } from '@/lib/panels/taster';
import { randomUUID } from 'node:crypto';
import type { Role } from '@/lib/permissions';

const READ: Role[] = ['admin', 'developer', 'head_of_product'];
const RUN: Role[] = ['admin', 'developer'];

export async function panelFixture(a: WorkspaceFixture, open = true): Promise<{ trialId: string; sessionId: string; joinCode: string | null; attributeId: string; variantIds: string[] }> {
  const t = await trialWithVariants(a);
  const actor = actorOf(a, 'developer');
  const attrs = await listAttributes(actor);
  const liking = attrs.find((x) => x.libraryKey === 'overall-liking') ?? attrs[0];
  const { sessionId } = await createPanelSession(actor, t.trialId, {
    title: 'Thursday tasting', method: 'rated', variantIds: [t.baseId, t.otherId], attributeIds: [liking.id],
    notice: 'Contains fruit and sugar. Tell us about any allergy before you taste.',
  });
  const joinCode = open ? (await openPanelSession(actor, sessionId)).joinCode : null;
  return { trialId: t.trialId, sessionId, joinCode, attributeId: liking.id, variantIds: [t.baseId, t.otherId] };
}

export async function seatFixture(a: WorkspaceFixture) {
  const p = await panelFixture(a);
  const { seatToken } = await joinAsGuest({ joinCode: p.joinCode!, displayName: 'Guest taster' });
  return { ...p, seatToken };
}

export const PANELS_ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/v1/attributes', allowed: READ, otherWorkspace: 'own-data' },
  { route: 'POST /api/v1/attributes', allowed: RUN, otherWorkspace: 'own-data', prepare: () => ({ body: { name: 'Peel chewiness', instruction: 'Chew the peel.', scale: 'intensity', lowAnchor: 'Tender', highAnchor: 'Chewy' } }) },
  { route: 'GET /api/v1/trials/[trialId]/panels', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId } }) },
  {
    route: 'POST /api/v1/trials/[trialId]/panels',
    allowed: RUN,
    otherWorkspace: 404,
    prepare: async (a) => {
      const t = await trialWithVariants(a);
      const attrs = await listAttributes(actorOf(a, 'developer'));
      return { params: { trialId: t.trialId }, body: { title: 'Matrix tasting', method: 'rated', variantIds: [t.baseId, t.otherId], attributeIds: [attrs[0].id], notice: 'Fruit, sugar.' } };
    },
  },
  { route: 'GET /api/v1/panels/[sessionId]', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { sessionId: (await panelFixture(a)).sessionId } }) },
  {
    route: 'PATCH /api/v1/panels/[sessionId]',
    allowed: RUN,
    otherWorkspace: 404,
    prepare: async (a) => {
      const p = await panelFixture(a, false);
      return { params: { sessionId: p.sessionId }, body: { title: 'Friday tasting', method: 'rated', variantIds: p.variantIds, attributeIds: [p.attributeId], notice: 'Contains fruit and sugar.' } };
    },
  },
  { route: 'DELETE /api/v1/panels/[sessionId]', allowed: RUN, otherWorkspace: 404, prepare: async (a) => ({ params: { sessionId: (await panelFixture(a, false)).sessionId } }) },
  { route: 'POST /api/v1/panels/[sessionId]/open', allowed: RUN, otherWorkspace: 404, prepare: async (a) => ({ params: { sessionId: (await panelFixture(a, false)).sessionId } }) },
  { route: 'POST /api/v1/panels/[sessionId]/close', allowed: RUN, otherWorkspace: 404, prepare: async (a) => ({ params: { sessionId: (await panelFixture(a)).sessionId } }) },
  {
    route: 'POST /api/v1/panels/[sessionId]/invitations',
    allowed: RUN,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { sessionId: (await panelFixture(a)).sessionId }, body: { userIds: [a.people.taster.userId] } }),
  },
  { route: 'GET /api/v1/panels/[sessionId]/serving-sheet', allowed: RUN, otherWorkspace: 404, prepare: async (a) => ({ params: { sessionId: (await panelFixture(a)).sessionId } }) },
  { route: 'GET /api/v1/panels/[sessionId]/results', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { sessionId: (await panelFixture(a)).sessionId } }) },
  { route: 'GET /api/v1/panels/[sessionId]/answers.csv', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { sessionId: (await panelFixture(a)).sessionId } }) },
  { route: 'GET /api/v1/panels/[sessionId]/summary.csv', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { sessionId: (await panelFixture(a)).sessionId } }) },
  { route: 'GET /api/v1/trials/[trialId]/comparison', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await panelFixture(a)).trialId } }) },
  {
    route: 'PUT /api/v1/trials/[trialId]/recommendation',
    allowed: RUN,
    otherWorkspace: 404,
    prepare: async (a) => {
      const p = await panelFixture(a);
      return { params: { trialId: p.trialId }, body: { variantId: p.variantIds[1], rationale: 'Liked as much as the base with less sugar.' } };
    },
  },
  // The taster endpoints take no staff sign-in: the seat token in the path is the identity.
  { route: 'POST /api/v1/tasting/join', allowed: 'public', otherWorkspace: 'public', prepare: async (a) => ({ body: { joinCode: (await panelFixture(a)).joinCode, displayName: 'Matrix guest' } }) },
  { route: 'GET /api/v1/tasting/[seatToken]', allowed: 'public', otherWorkspace: 'public', prepare: async (a) => ({ params: { seatToken: (await seatFixture(a)).seatToken } }) },
  { route: 'POST /api/v1/tasting/[seatToken]/consent', allowed: 'public', otherWorkspace: 'public', prepare: async (a) => ({ params: { seatToken: (await seatFixture(a)).seatToken } }) },
  {
    route: 'PUT /api/v1/tasting/[seatToken]/answers',
    allowed: 'public',
    otherWorkspace: 'public',
    prepare: async (a) => {
      const s = await seatFixture(a);
      await recordConsent(s.seatToken);
      const { tasterView } = await import('@/lib/panels/taster');
      const view = await tasterView(s.seatToken);
      return { params: { seatToken: s.seatToken }, body: { idempotencyKey: randomUUID(), code: view.samples[0].code, attributeId: s.attributeId, value: 7 } };
    },
  },
  { route: 'POST /api/v1/tasting/[seatToken]/submit', allowed: 'public', otherWorkspace: 'public', prepare: async (a) => ({ params: { seatToken: (await seatFixture(a)).seatToken } }) },
];

/** An open tasting where every person of workspace A holds a staff seat, so each can ask for their own seat link. */
async function everyoneSeated(a: WorkspaceFixture): Promise<string> {
  const p = await panelFixture(a);
  await inviteStaffTasters(actorOf(a, 'developer'), p.sessionId, Object.values(a.people).map((person) => person.userId));
  return p.sessionId;
}

export const PANELS_ACTION_CASES: ActionCase[] = [
  {
    action: 'lib/panels/actions.ts#createTastingAction',
    allowed: RUN,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      const t = await trialWithVariants(a);
      const attrs = await listAttributes(actorOf(a, 'developer'));
      return [t.trialId, { title: 'Matrix tasting', method: 'rated', variantIds: [t.baseId, t.otherId], attributeIds: [attrs[0].id], notice: 'Fruit, sugar.' }];
    },
  },
  {
    action: 'lib/panels/actions.ts#updateTastingAction',
    allowed: RUN,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      const p = await panelFixture(a, false);
      return [p.sessionId, { title: 'Friday tasting', method: 'rated', variantIds: p.variantIds, attributeIds: [p.attributeId], notice: 'Contains fruit and sugar.' }];
    },
  },
  { action: 'lib/panels/actions.ts#discardTastingAction', allowed: RUN, otherWorkspace: 404, argsAsync: async (a) => [(await panelFixture(a, false)).sessionId] },
  {
    action: 'lib/panels/actions.ts#createAttributeAction',
    allowed: RUN,
    otherWorkspace: 'own-data',
    args: () => [{ name: `Peel chewiness ${randomUUID().slice(0, 8)}`, instruction: 'Chew the peel.', scale: 'intensity', lowAnchor: 'Tender', highAnchor: 'Chewy' }],
  },
  { action: 'lib/panels/actions.ts#renewMySeatAction', allowed: ['admin', 'developer', 'head_of_product', 'production', 'taster'], otherWorkspace: 404, argsAsync: async (a) => [await everyoneSeated(a)] },
  {
    action: 'lib/results/actions.ts#recommendVariantAction',
    allowed: RUN,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      const p = await panelFixture(a);
      return [p.trialId, { variantId: p.variantIds[1], rationale: 'Liked as much as the base with less sugar.' }];
    },
  },
];
