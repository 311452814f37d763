/** Authorisation-table rows for panels and the taster endpoints (merged into access-table.ts). */
import type { ActionCase, RouteCase } from './access-table';
import { trialWithVariants } from './access-trials';
import { actorOf, type WorkspaceFixture } from './harness';
import { createTasting, inviteStaffTasters, openTasting } from '@/lib/tastings/mutations';
import { listAttributes } from '@/lib/tastings/queries';
import { joinAsGuest } from '@/lib/tastings/mutations';
import { recordAnswer, recordConsent } from '@/lib/taster/seat';
import { randomUUID } from 'node:crypto';
import type { Role } from '@/lib/permissions';

const READ: Role[] = ['admin', 'developer', 'head_of_product'];
const RUN: Role[] = ['admin', 'developer'];

export async function tastingFixture(a: WorkspaceFixture, open = true): Promise<{ trialId: string; tastingId: string; joinCode: string | null; attributeId: string; variantIds: string[] }> {
  const t = await trialWithVariants(a);
  const actor = actorOf(a, 'developer');
  const attrs = await listAttributes(actor);
  const liking = attrs.find((x) => x.libraryKey === 'overall-liking') ?? attrs[0];
  const { tastingId } = await createTasting(actor, t.trialId, {
    title: 'Thursday tasting', method: 'rated', variantIds: [t.baseId, t.otherId], attributeIds: [liking.id],
    notice: 'Contains fruit and sugar. Tell us about any allergy before you taste.',
  });
  const joinCode = open ? (await openTasting(actor, tastingId)).joinCode : null;
  return { trialId: t.trialId, tastingId, joinCode, attributeId: liking.id, variantIds: [t.baseId, t.otherId] };
}

export async function seatFixture(a: WorkspaceFixture) {
  const p = await tastingFixture(a);
  const { seatToken } = await joinAsGuest({ joinCode: p.joinCode!, displayName: 'Guest taster' });
  return { ...p, seatToken };
}

/** A seat that has agreed and answered every question, so it may be submitted. */
async function completeSeatFixture(a: WorkspaceFixture) {
  const s = await seatFixture(a);
  await recordConsent(s.seatToken);
  const { tasterView } = await import('@/lib/taster/seat');
  const view = await tasterView(s.seatToken);
  for (const sample of view.samples) {
    for (const attribute of view.attributes) {
      await recordAnswer(s.seatToken, { idempotencyKey: randomUUID(), code: sample.code, attributeId: attribute.id, value: attribute.scale.kind === 'category' ? attribute.scale.points[0].value : attribute.scale.min });
    }
  }
  return s;
}

export const TASTINGS_ROUTE_CASES: RouteCase[] = [
  { route: 'GET /api/v1/attributes', allowed: READ, otherWorkspace: 'own-data' },
  { route: 'POST /api/v1/attributes', allowed: RUN, otherWorkspace: 'own-data', prepare: () => ({ body: { name: 'Peel chewiness', instruction: 'Chew the peel.', scale: 'intensity', lowAnchor: 'Tender', highAnchor: 'Chewy' } }) },
  { route: 'GET /api/v1/trials/[trialId]/tastings', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await trialWithVariants(a)).trialId } }) },
  {
    route: 'POST /api/v1/trials/[trialId]/tastings',
    allowed: RUN,
    otherWorkspace: 404,
    prepare: async (a) => {
      const t = await trialWithVariants(a);
      const attrs = await listAttributes(actorOf(a, 'developer'));
      return { params: { trialId: t.trialId }, body: { title: 'Matrix tasting', method: 'rated', variantIds: [t.baseId, t.otherId], attributeIds: [attrs[0].id], notice: 'Fruit, sugar.' } };
    },
  },
  { route: 'GET /api/v1/tastings/[tastingId]', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a)).tastingId } }) },
  {
    route: 'PATCH /api/v1/tastings/[tastingId]',
    allowed: RUN,
    otherWorkspace: 404,
    prepare: async (a) => {
      const p = await tastingFixture(a, false);
      return { params: { tastingId: p.tastingId }, body: { title: 'Friday tasting', method: 'rated', variantIds: p.variantIds, attributeIds: [p.attributeId], notice: 'Contains fruit and sugar.' } };
    },
  },
  { route: 'DELETE /api/v1/tastings/[tastingId]', allowed: RUN, otherWorkspace: 404, prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a, false)).tastingId } }) },
  { route: 'POST /api/v1/tastings/[tastingId]/open', allowed: RUN, otherWorkspace: 404, prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a, false)).tastingId } }) },
  { route: 'POST /api/v1/tastings/[tastingId]/close', allowed: RUN, otherWorkspace: 404, prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a)).tastingId } }) },
  {
    route: 'POST /api/v1/tastings/[tastingId]/invitations',
    allowed: RUN,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a)).tastingId }, body: { userIds: [a.people.taster.userId] } }),
  },
  { route: 'GET /api/v1/tastings/[tastingId]/serving-sheet', allowed: RUN, otherWorkspace: 404, prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a)).tastingId } }) },
  { route: 'GET /api/v1/tastings/[tastingId]/results', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a)).tastingId } }) },
  { route: 'GET /api/v1/tastings/[tastingId]/answers.csv', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a)).tastingId } }) },
  { route: 'GET /api/v1/tastings/[tastingId]/summary.csv', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { tastingId: (await tastingFixture(a)).tastingId } }) },
  { route: 'GET /api/v1/trials/[trialId]/comparison', allowed: READ, otherWorkspace: 404, prepare: async (a) => ({ params: { trialId: (await tastingFixture(a)).trialId } }) },
  {
    route: 'PUT /api/v1/trials/[trialId]/recommendation',
    allowed: RUN,
    otherWorkspace: 404,
    prepare: async (a) => {
      const p = await tastingFixture(a);
      return { params: { trialId: p.trialId }, body: { variantId: p.variantIds[1], rationale: 'Liked as much as the base with less sugar.' } };
    },
  },
  // The taster endpoints take no staff sign-in: the seat token in the path is the identity.
  { route: 'POST /api/v1/tastings/join', allowed: 'public', otherWorkspace: 'public', prepare: async (a) => ({ body: { joinCode: (await tastingFixture(a)).joinCode, displayName: 'Matrix guest' } }) },
  { route: 'GET /api/v1/tastings/seats/[seatToken]', allowed: 'public', otherWorkspace: 'public', prepare: async (a) => ({ params: { seatToken: (await seatFixture(a)).seatToken } }) },
  { route: 'POST /api/v1/tastings/seats/[seatToken]/consent', allowed: 'public', otherWorkspace: 'public', prepare: async (a) => ({ params: { seatToken: (await seatFixture(a)).seatToken } }) },
  {
    route: 'PUT /api/v1/tastings/seats/[seatToken]/answers',
    allowed: 'public',
    otherWorkspace: 'public',
    prepare: async (a) => {
      const s = await seatFixture(a);
      await recordConsent(s.seatToken);
      const { tasterView } = await import('@/lib/taster/seat');
      const view = await tasterView(s.seatToken);
      return { params: { seatToken: s.seatToken }, body: { idempotencyKey: randomUUID(), code: view.samples[0].code, attributeId: s.attributeId, value: 7 } };
    },
  },
  { route: 'POST /api/v1/tastings/seats/[seatToken]/submit', allowed: 'public', otherWorkspace: 'public', prepare: async (a) => ({ params: { seatToken: (await completeSeatFixture(a)).seatToken } }) },
];

/** An open tasting where every person of workspace A holds a staff seat, so each can ask for their own seat link. */
async function everyoneSeated(a: WorkspaceFixture): Promise<string> {
  const p = await tastingFixture(a);
  await inviteStaffTasters(actorOf(a, 'developer'), p.tastingId, Object.values(a.people).map((person) => person.userId));
  return p.tastingId;
}

export const TASTINGS_ACTION_CASES: ActionCase[] = [
  {
    action: 'lib/tastings/actions.ts#createTastingAction',
    allowed: RUN,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      const t = await trialWithVariants(a);
      const attrs = await listAttributes(actorOf(a, 'developer'));
      return [t.trialId, { title: 'Matrix tasting', method: 'rated', variantIds: [t.baseId, t.otherId], attributeIds: [attrs[0].id], notice: 'Fruit, sugar.' }];
    },
  },
  {
    action: 'lib/tastings/actions.ts#updateTastingAction',
    allowed: RUN,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      const p = await tastingFixture(a, false);
      return [p.tastingId, { title: 'Friday tasting', method: 'rated', variantIds: p.variantIds, attributeIds: [p.attributeId], notice: 'Contains fruit and sugar.' }];
    },
  },
  { action: 'lib/tastings/actions.ts#discardTastingAction', allowed: RUN, otherWorkspace: 404, argsAsync: async (a) => [(await tastingFixture(a, false)).tastingId] },
  {
    action: 'lib/tastings/actions.ts#createAttributeAction',
    allowed: RUN,
    otherWorkspace: 'own-data',
    args: () => [{ name: `Peel chewiness ${randomUUID().slice(0, 8)}`, instruction: 'Chew the peel.', scale: 'intensity', lowAnchor: 'Tender', highAnchor: 'Chewy' }],
  },
  { action: 'lib/tastings/actions.ts#renewMySeatAction', allowed: ['admin', 'developer', 'head_of_product', 'production', 'taster'], otherWorkspace: 404, argsAsync: async (a) => [await everyoneSeated(a)] },
  {
    action: 'lib/results/actions.ts#recommendVariantAction',
    allowed: RUN,
    otherWorkspace: 404,
    argsAsync: async (a) => {
      const p = await tastingFixture(a);
      return [p.trialId, { variantId: p.variantIds[1], rationale: 'Liked as much as the base with less sugar.' }];
    },
  },
];
