/**
 * Answers only move forward: a replayed older request (a late copy held by a network, a phone
 * resending after its reply was lost) must never overwrite a newer answer to the same question.
 * Every idempotency key an answer has had is kept; a replay of any of them is a 2xx "duplicate"
 * (and "stale" when it is not the current answer), so the phone stops resending, and changes nothing.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { createWorkspace, callRoute, actorOf, type WorkspaceFixture } from './harness';
import { createFixtureFormula } from './fixtures';
import { createTrial, planVariants } from '@/lib/trials/mutations';
import { createTasting, openTasting, joinAsGuest } from '@/lib/tastings/mutations';
import { listAttributes } from '@/lib/tastings/queries';
import { MAX_KEYS_PER_ANSWER, recordConsent, tasterView } from '@/lib/taster/seat';
import * as answersRoute from '@/app/api/v1/tastings/seats/[seatToken]/answers/route';
import { getEm } from '@/lib/db';
import { TastingAnswer, Variant } from '@/entities';

let a: WorkspaceFixture;
let session: { tastingId: string; joinCode: string; likingId: string };

beforeAll(async () => {
  a = await createWorkspace('Answers forward');
  const dev = actorOf(a, 'developer');
  const { trialId } = await createTrial(dev, { title: 'Replay trial', question: 'Does a late replay undo an answer?', formulaId: await createFixtureFormula(a) });
  await planVariants(dev, trialId, { kind: 'full_factorial', factors: [{ factor: 'sugar_ratio', low: 0.8, high: 1.2 }], centrePoint: false });
  const variants = await (await getEm()).find(Variant, { trial: trialId }, { orderBy: { position: 'asc' } });
  const liking = (await listAttributes(dev)).find((x) => x.libraryKey === 'overall-liking')!;
  const { tastingId } = await createTasting(dev, trialId, { title: 'Replays', method: 'rated', variantIds: variants.slice(0, 2).map((v) => v.id), attributeIds: [liking.id], notice: 'Contains fruit.' });
  const { joinCode } = await openTasting(dev, tastingId);
  session = { tastingId, joinCode, likingId: liking.id };
});

async function newSeat() {
  const { seatToken } = await joinAsGuest({ joinCode: session.joinCode, displayName: 'Replayer' });
  await recordConsent(seatToken);
  const code = (await tasterView(seatToken)).samples[0].code;
  // Source for the scale: Peryam & Pilgrim (1957), the 9-point hedonic scale (1…9).
  const put = (idempotencyKey: string, value: number) =>
    callRoute(answersRoute.PUT, { method: 'PUT', path: '', caller: { kind: 'outsider' }, params: { seatToken }, body: { idempotencyKey, code, attributeId: session.likingId, value } });
  return { seatToken, code, put };
}

describe('answers only move forward', () => {
  it('a late replay of K1 after K2 keeps K2’s value and says duplicate and stale (2xx)', async () => {
    const { put, seatToken, code } = await newSeat();
    const k1 = randomUUID();
    const k2 = randomUUID();
    expect((await put(k1, 3)).body).toEqual({ stored: true, duplicate: false, stale: false });
    expect((await put(k2, 8)).body).toEqual({ stored: true, duplicate: false, stale: false });
    const replay = await put(k1, 3);
    expect(replay.status).toBe(200);
    expect(replay.body).toEqual({ stored: true, duplicate: true, stale: true });
    // A retry of the current answer is a plain duplicate.
    expect((await put(k2, 8)).body).toEqual({ stored: true, duplicate: true, stale: false });
    const view = await tasterView(seatToken);
    expect(view.answers.filter((x) => x.code === code)).toEqual([{ code, attributeId: session.likingId, value: 8 }]);
    const rows = await (await getEm()).find(TastingAnswer, { session: session.tastingId, item: code, idempotencyKey: { $in: [k1, k2] } });
    expect(rows.map((r) => [r.value, r.idempotencyKey])).toEqual([[8, k2]]);
    expect(rows[0].idempotencyKeys).toEqual([k1, k2]);
  });

  it('every older key stays refused after several changes of mind, and a new key still moves the answer on', async () => {
    const { put, seatToken, code } = await newSeat();
    const keys = [randomUUID(), randomUUID(), randomUUID()];
    for (const [i, k] of keys.entries()) await put(k, i + 2);
    for (const [i, k] of keys.slice(0, -1).entries()) {
      const res = await put(k, i + 2);
      expect(res.status).toBe(200);
      expect(res.body.stale).toBe(true);
    }
    expect((await tasterView(seatToken)).answers.find((x) => x.code === code)?.value).toBe(4);
    expect((await put(randomUUID(), 9)).body.duplicate).toBe(false);
    expect((await tasterView(seatToken)).answers.find((x) => x.code === code)?.value).toBe(9);
  });

  it('replays racing the newer answer never win', async () => {
    const { put, seatToken, code } = await newSeat();
    const k1 = randomUUID();
    await put(k1, 2);
    const k2 = randomUUID();
    const replies = await Promise.all([put(k1, 2), put(k2, 7), put(k1, 2), put(k1, 2), put(k1, 2)]);
    expect(replies.map((r) => r.status)).toEqual([200, 200, 200, 200, 200]);
    expect(replies.filter((r) => r.body.duplicate === false)).toHaveLength(1);
    expect((await tasterView(seatToken)).answers.find((x) => x.code === code)?.value).toBe(7);
    expect((await put(k1, 2)).body).toEqual({ stored: true, duplicate: true, stale: true });
  });

  it(`an answer keeps at most ${MAX_KEYS_PER_ANSWER} keys: one change more is refused (422), the last value stands and old keys stay recognised`, async () => {
    const { put, seatToken, code } = await newSeat();
    const keys = Array.from({ length: MAX_KEYS_PER_ANSWER }, () => randomUUID());
    for (const [i, k] of keys.entries()) expect((await put(k, 1 + (i % 9))).status).toBe(200);
    const last = 1 + ((MAX_KEYS_PER_ANSWER - 1) % 9);
    const refused = await put(randomUUID(), last === 9 ? 1 : 9);
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('too_many_changes');
    expect((await tasterView(seatToken)).answers.find((x) => x.code === code)?.value).toBe(last);
    expect((await put(keys[0], 1)).body).toEqual({ stored: true, duplicate: true, stale: true });
    expect((await put(keys.at(-1)!, last)).body).toEqual({ stored: true, duplicate: true, stale: false });
  });
});
