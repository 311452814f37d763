/** Tastings as a list (filters, edit and discard while set up, my seats with a way back) and each role's worklist. */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, actorOf, type WorkspaceFixture } from './harness';
import { tastingFixture } from './access-tastings';
import { trialWithVariants } from './access-trials';
import { createApprovedVersion } from './production-fixtures';
import * as tastingRoute from '@/app/api/v1/tastings/[tastingId]/route';
import { getEm } from '@/lib/db';
import { TastingSample, Tasting } from '@/entities';
import { closeTasting, inviteStaffTasters, renewMySeatLink } from '@/lib/tastings/mutations';
import { getTasting, listMySeats, listTastings } from '@/lib/tastings/queries';
import { tasterView } from '@/lib/taster/seat';
import { recordCook, transitionTrial, withdrawCook } from '@/lib/trials/mutations';
import { trialsAtTheStove } from '@/lib/trials/queries';
import { decideBatch, recordBatch, retestBatch } from '@/lib/production/mutations';
import { batchWorklist } from '@/lib/production/queries';
import { lotCodeFor } from '@/lib/production/vocabulary';

let a: WorkspaceFixture;
const dev = () => ({ kind: 'session' as const, person: a.people.developer });

beforeAll(async () => {
  a = await createWorkspace('Worklists');
});

describe('the workspace list of tastings', () => {
  it('filters by state and by trial', async () => {
    const draft = await tastingFixture(a, false);
    const open = await tastingFixture(a, true);
    const developer = actorOf(a, 'developer');
    const drafts = await listTastings(developer, { state: 'draft' });
    expect(drafts.map((t) => t.id)).toContain(draft.tastingId);
    expect(drafts.map((t) => t.id)).not.toContain(open.tastingId);
    expect(drafts.every((t) => t.state === 'draft')).toBe(true);
    const ofTrial = await listTastings(developer, { trialId: open.trialId });
    expect(ofTrial.map((t) => t.id)).toEqual([open.tastingId]);
    expect(ofTrial[0].trial.code).toMatch(/^T-\d{3}$/);
  });

  it('changes and discards a tasting while it is being set up, and refuses both once it has opened', async () => {
    const p = await tastingFixture(a, false);
    const body = { title: 'Friday tasting', place: 'Tasting room', method: 'rated', variantIds: [p.variantIds[1], p.variantIds[0]], attributeIds: [p.attributeId], notice: 'Contains fruit and sugar.' };
    const changed = await callRoute(tastingRoute.PATCH, { method: 'PATCH', path: '', caller: dev(), params: { tastingId: p.tastingId }, body });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    const view = await getTasting(actorOf(a, 'developer'), p.tastingId);
    expect(view.title).toBe('Friday tasting');
    expect(view.place).toBe('Tasting room');
    expect(view.samples.map((s) => s.variantId)).toEqual([p.variantIds[1], p.variantIds[0]]);
    expect(view.samples.every((s) => /^\d{3}$/.test(s.code ?? ''))).toBe(true);

    const discarded = await callRoute(tastingRoute.DELETE, { method: 'DELETE', path: '', caller: dev(), params: { tastingId: p.tastingId } });
    expect(discarded.status).toBe(200);
    const em = (await getEm()).fork();
    expect(await em.count(Tasting, { id: p.tastingId })).toBe(0);
    expect(await em.count(TastingSample, { session: p.tastingId })).toBe(0);

    const opened = await tastingFixture(a, true);
    const before = await getTasting(actorOf(a, 'developer'), opened.tastingId);
    const openBody = { ...body, variantIds: opened.variantIds };
    expect((await callRoute(tastingRoute.PATCH, { method: 'PATCH', path: '', caller: dev(), params: { tastingId: opened.tastingId }, body: openBody })).status).toBe(409);
    expect((await callRoute(tastingRoute.DELETE, { method: 'DELETE', path: '', caller: dev(), params: { tastingId: opened.tastingId } })).status).toBe(409);
    const after = await getTasting(actorOf(a, 'developer'), opened.tastingId);
    expect(after.title).toBe(before.title);
    expect(after.samples).toEqual(before.samples);
  });
});

describe('my tastings', () => {
  it('lists the signed-in taster’s seats, open ones first, and gives a fresh link to the seat (the old one stops working)', async () => {
    const taster = actorOf(a, 'taster');
    expect(await listMySeats(taster)).toEqual([]);
    const closed = await tastingFixture(a, true);
    const open = await tastingFixture(a, true);
    await inviteStaffTasters(actorOf(a, 'developer'), closed.tastingId, [a.people.taster.userId]);
    await closeTasting(actorOf(a, 'developer'), closed.tastingId);
    await inviteStaffTasters(actorOf(a, 'developer'), open.tastingId, [a.people.taster.userId]);

    const seats = await listMySeats(taster);
    expect(seats.map((s) => [s.tastingId, s.waiting])).toEqual([[open.tastingId, true], [closed.tastingId, false]]);
    // Only what a taster may see: no variant, trial or sample fields.
    expect(Object.keys(seats[0]).sort()).toEqual(['place', 'startsAt', 'state', 'submitted', 'tastingId', 'title', 'waiting']);
    expect(await listMySeats(actorOf(a, 'developer'))).toEqual([]);

    const first = await renewMySeatLink(taster, open.tastingId);
    expect(first.path).toMatch(/^\/t\/sws_/);
    expect((await tasterView(first.path.slice(3))).seat.displayName).toBeTruthy();
    const second = await renewMySeatLink(taster, open.tastingId);
    await expect(tasterView(first.path.slice(3))).rejects.toMatchObject({ status: 404 });
    expect((await tasterView(second.path.slice(3))).session.state).toBe('open');

    // Nobody else's seat, and no link to a closed tasting.
    await expect(renewMySeatLink(actorOf(a, 'developer'), open.tastingId)).rejects.toMatchObject({ status: 404 });
    await expect(renewMySeatLink(taster, closed.tastingId)).rejects.toMatchObject({ name: 'Conflict' });
  });
});

describe('worklists', () => {
  it('the developer’s trials at the stove name the variants not cooked yet; a withdrawn cook does not count', async () => {
    const developer = actorOf(a, 'developer');
    const t = await trialWithVariants(a);
    expect((await trialsAtTheStove(developer)).map((x) => x.id)).not.toContain(t.trialId);
    await transitionTrial(developer, t.trialId, 'cooking');
    const item = () => trialsAtTheStove(developer).then((list) => list.find((x) => x.id === t.trialId));
    expect((await item())?.uncooked).toEqual(['A', 'B', 'C']);
    const { cookId } = await recordCook(developer, t.trialId, { variantId: t.baseId, cookDate: '2026-11-20', ph: 3.2 });
    expect((await item())?.uncooked).toEqual(['B', 'C']);
    await withdrawCook(developer, t.trialId, cookId, 'Wrong jar.');
    expect((await item())?.uncooked).toEqual(['A', 'B', 'C']);
    // Only the owner's trials: the admin has none at the stove.
    expect((await trialsAtTheStove(actorOf(a, 'admin'))).map((x) => x.id)).not.toContain(t.trialId);
  });

  it('production sees held batches and today’s batches', async () => {
    const { versionId, productCode } = await createApprovedVersion(a);
    const production = actorOf(a, 'production');
    const today = new Date().toISOString().slice(0, 10);
    const good = { batchSizeG: 30_000, brixReading: 65, brixSampleTempC: 20, ph: 3.1, fillTempC: 88, netFillMeanG: 342, netFillMinG: 336, setTestScore: 4, jarsFilled: 80, jarsRejected: 0 };
    await recordBatch(production, versionId, { ...good, lotCode: lotCodeFor(productCode, today, 1), batchDate: today });
    const held = await recordBatch(production, versionId, { ...good, ph: 4.8, lotCode: lotCodeFor(productCode, '2026-01-05', 1), batchDate: '2026-01-05', disposition: 'hold', dispositionComment: 'Re-test the pH.' } as never);
    const list = await batchWorklist(production, today);
    expect(list.held.map((b) => b.id)).toEqual([held.batchId]);
    expect(list.today.map((b) => b.lotCode)).toEqual([lotCodeFor(productCode, today, 1)]);
    // Once re-tested and released, the batch leaves the held list.
    await retestBatch(production, held.batchId, { ph: 3.2, comment: 'pH taken again after re-boil.' });
    await decideBatch(production, held.batchId, { decision: 'release', comment: 'Re-test passed; released.' });
    expect((await batchWorklist(production, today)).held).toEqual([]);
  });
});
