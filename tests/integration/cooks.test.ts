/** Cooks: a cook needs a reading; corrections keep the old values; withdrawn cooks leave the evidence but stay on record. */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, callRoute, actorOf, type WorkspaceFixture } from './harness';
import { createPromotableTrial, freshProductCode, promotionInput } from './production-fixtures';
import * as cooksRoute from '@/app/api/v1/trials/[trialId]/cooks/route';
import * as cookRoute from '@/app/api/v1/trials/[trialId]/cooks/[cookId]/route';
import * as withdrawRoute from '@/app/api/v1/trials/[trialId]/cooks/[cookId]/withdraw/route';
import * as importRoute from '@/app/api/v1/trials/[trialId]/cooks/import/route';
import * as trialRoute from '@/app/api/v1/trials/[trialId]/route';
import { getEm } from '@/lib/db';
import { Cook, CookChange, PromotionRequest } from '@/entities';
import { getTrialComparison } from '@/lib/results/trial-comparison';
import { requestPromotion } from '@/lib/production/mutations';
import { NO_READING_MESSAGE } from '@/lib/trials/schema';

let a: WorkspaceFixture;
const dev = () => ({ kind: 'session' as const, person: a.people.developer });

beforeAll(async () => {
  a = await createWorkspace('Cooks');
});

const overview = async (trialId: string) => (await callRoute(trialRoute.GET, { method: 'GET', path: '', caller: dev(), params: { trialId } })).body.trial;
const count = (trialId: string) => getEm().then((em) => em.fork().count(Cook, { workspace: a.workspaceId, variant: { trial: trialId } }));

async function recordCook(trialId: string, variantId: string, readings: Record<string, unknown>) {
  const res = await callRoute(cooksRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { variantId, cookDate: '2026-11-20', ...readings } });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.cookId as string;
}

describe('a cook needs at least one reading', () => {
  it('refuses a cook with only a date and a batch size, by the API and the CSV import, and stores nothing', async () => {
    const { trialId, variantId } = await createPromotableTrial(a);
    const empty = await callRoute(cooksRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { variantId, cookDate: '2026-11-20', batchSizeG: 2000, notes: 'went fine' } });
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields.readings).toEqual([NO_READING_MESSAGE]);
    const csv = await callRoute(importRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId }, body: { csv: 'variant,cook_date,batch_size_g\nA,2026-11-20,2000\n' } });
    expect(csv.status).toBe(422);
    expect(Object.values(csv.body.error.fields).flat()).toContain(NO_READING_MESSAGE);
    expect(await count(trialId)).toBe(0);
    // One reading is enough.
    await recordCook(trialId, variantId, { setTestScore: 4 });
    expect(await count(trialId)).toBe(1);
  });
});

describe('correcting a cook', () => {
  it('replaces the values sent, keeps the ones it replaced with the reason, and refuses a correction that empties the cook', async () => {
    const { trialId, variantId } = await createPromotableTrial(a);
    const id = await recordCook(trialId, variantId, { ph: 3.4, yieldG: 1500 });
    const fixed = await callRoute(cookRoute.PATCH, { method: 'PATCH', path: '', caller: dev(), params: { trialId, cookId: id }, body: { ph: 3.14, reason: 'Meter was not calibrated; re-read after calibration.' } });
    expect(fixed.status, JSON.stringify(fixed.body)).toBe(200);
    const cook = (await overview(trialId)).variants[0].cooks[0];
    expect(cook.ph).toBe(3.14);
    expect(cook.yieldG).toBe(1500);
    expect(cook.changes).toEqual([expect.objectContaining({ kind: 'corrected', reason: 'Meter was not calibrated; re-read after calibration.', before: { ph: 3.4 } })]);

    const emptied = await callRoute(cookRoute.PATCH, { method: 'PATCH', path: '', caller: dev(), params: { trialId, cookId: id }, body: { ph: null, yieldG: null, reason: 'oops' } });
    expect(emptied.status).toBe(422);
    expect(emptied.body.error.fields.readings).toEqual([NO_READING_MESSAGE]);
    const same = await callRoute(cookRoute.PATCH, { method: 'PATCH', path: '', caller: dev(), params: { trialId, cookId: id }, body: { ph: 3.14, reason: 'again' } });
    expect(same.status).toBe(422);
    const noReason = await callRoute(cookRoute.PATCH, { method: 'PATCH', path: '', caller: dev(), params: { trialId, cookId: id }, body: { ph: 3.2 } });
    expect(noReason.status).toBe(422);
    expect(noReason.body.error.fields).toHaveProperty(['reason']);
    const after = (await overview(trialId)).variants[0].cooks[0];
    expect(after.ph).toBe(3.14);
    expect(after.changes).toHaveLength(1);
  });

  it('keeps the change history insert-only', async () => {
    const { trialId, variantId } = await createPromotableTrial(a);
    const id = await recordCook(trialId, variantId, { ph: 3.4 });
    await callRoute(cookRoute.PATCH, { method: 'PATCH', path: '', caller: dev(), params: { trialId, cookId: id }, body: { ph: 3.3, reason: 'typo' } });
    const em = (await getEm()).fork();
    await expect(em.getConnection().execute(`update measurement_changes set reason = 'rewritten' where measurement_id = ?`, [id])).rejects.toThrow(/insert-only/);
    await expect(em.getConnection().execute(`delete from measurement_changes where measurement_id = ?`, [id])).rejects.toThrow(/insert-only/);
    expect(await em.count(CookChange, { cook: id })).toBe(1);
  });
});

describe('withdrawing a cook', () => {
  it('keeps it on record as withdrawn, and leaves it out of the comparison and the promotion evidence', async () => {
    const { trialId, variantId } = await createPromotableTrial(a);
    await recordCook(trialId, variantId, { ph: 3.2, brixReading: 65, brixSampleTempC: 20 });
    const bad = await recordCook(trialId, variantId, { ph: 4.1, notes: 'wrong jar measured' });
    // Before: the newest cook (pH 4.1) is the one the comparison uses.
    expect((await getTrialComparison(actorOf(a, 'developer'), trialId)).variants[0].lab.ph).toBe(4.1);

    const noReason = await callRoute(withdrawRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId, cookId: bad }, body: { reason: '  ' } });
    expect(noReason.status).toBe(422);
    const res = await callRoute(withdrawRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId, cookId: bad }, body: { reason: 'Measured the wrong jar.' } });
    expect(res.status, JSON.stringify(res.body)).toBe(200);

    const variant = (await overview(trialId)).variants[0];
    expect(variant.cooks.map((m: any) => m.ph)).toEqual([3.2]);
    expect(variant.withdrawnCooks).toEqual([expect.objectContaining({ ph: 4.1, withdrawn: expect.objectContaining({ reason: 'Measured the wrong jar.' }) })]);
    expect(await count(trialId)).toBe(2);
    expect((await getTrialComparison(actorOf(a, 'developer'), trialId)).variants[0].lab.ph).toBe(3.2);

    const input = await promotionInput(a, trialId, variantId, { code: freshProductCode() });
    const { requestId } = await requestPromotion(actorOf(a, 'developer'), input);
    const request = await (await getEm()).fork().findOneOrFail(PromotionRequest, { id: requestId });
    expect((request.evidence as { lab: Array<{ ph: number | null }> }).lab.map((l) => l.ph)).toEqual([3.2]);

    // A withdrawn cook is final: no correction, no second withdrawal.
    const again = await callRoute(withdrawRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId, cookId: bad }, body: { reason: 'twice' } });
    expect(again.status).toBe(409);
    const fix = await callRoute(cookRoute.PATCH, { method: 'PATCH', path: '', caller: dev(), params: { trialId, cookId: bad }, body: { ph: 3.3, reason: 'late fix' } });
    expect(fix.status).toBe(409);
  });

  it('cannot reach a cook of another trial through this trial', async () => {
    const one = await createPromotableTrial(a);
    const two = await createPromotableTrial(a);
    const id = await recordCook(one.trialId, one.variantId, { ph: 3.2 });
    const res = await callRoute(withdrawRoute.POST, { method: 'POST', path: '', caller: dev(), params: { trialId: two.trialId, cookId: id }, body: { reason: 'x' } });
    expect(res.status).toBe(404);
  });
});
