/**
 * Locks in the transaction: the advisory locks that number trials, promotion requests and
 * production versions must be held by the transaction that uses the number. A lock taken on
 * another pooled connection is released at once, and concurrent writers then collide on the
 * unique index (spurious 409s). Each case fires 20 writers at once and wants 20 successes with
 * 20 distinct, gap-free numbers.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { actorOf, createWorkspace, type WorkspaceFixture } from './harness';
import { createFixtureFormula } from './fixtures';
import { createApprovedVersion, createPromotableTrial, promotionInput } from './production-fixtures';
import { createTrial } from '@/lib/trials/mutations';
import { decidePromotion, requestPromotion } from '@/lib/production/mutations';
import { getEm } from '@/lib/db';
import { ProductVersion, PromotionRequest, Trial } from '@/entities';

const N = 20;
let a: WorkspaceFixture;

beforeAll(async () => {
  a = await createWorkspace('Locks');
});

/** Every settled promise, so one failure does not hide how many others failed. */
async function allSettled<T>(work: Array<() => Promise<T>>) {
  const settled = await Promise.allSettled(work.map((w) => w()));
  const failures = settled.filter((s) => s.status === 'rejected').map((s) => String((s as PromiseRejectedResult).reason));
  const values = settled.filter((s) => s.status === 'fulfilled').map((s) => (s as PromiseFulfilledResult<T>).value);
  return { values, failures };
}

const consecutive = (from: number) => Array.from({ length: N }, (_, i) => from + i);

describe('locks in the transaction', () => {
  it(`numbers ${N} concurrent trial creations 1…${N}, with no refusals`, async () => {
    const dev = actorOf(a, 'developer');
    const formulaId = await createFixtureFormula(a);
    const before = await (await getEm()).count(Trial, { workspace: a.workspaceId });
    const { values, failures } = await allSettled(
      Array.from({ length: N }, (_, i) => () => createTrial(dev, { title: `Parallel trial ${i + 1}`, question: 'Does numbering hold under load?', formulaId })),
    );
    expect(failures).toEqual([]);
    const numbers = values.map((v) => Number(v.code.slice(2))).sort((x, y) => x - y);
    expect(numbers).toEqual(consecutive(before + 1));
    expect(await (await getEm()).count(Trial, { workspace: a.workspaceId })).toBe(before + N);
  }, 120_000);

  it(`numbers ${N} concurrent promotion requests (on ${N} trials) with distinct numbers, with no refusals`, async () => {
    const dev = actorOf(a, 'developer');
    const inputs = [];
    for (let i = 0; i < N; i++) {
      const { trialId, variantId } = await createPromotableTrial(a);
      inputs.push(await promotionInput(a, trialId, variantId, { code: `L${String.fromCharCode(65 + Math.floor(i / 26))}${String.fromCharCode(65 + (i % 26))}P` }));
    }
    const before = await (await getEm()).count(PromotionRequest, { workspace: a.workspaceId });
    const { values, failures } = await allSettled(inputs.map((input) => () => requestPromotion(dev, input)));
    expect(failures).toEqual([]);
    const numbers = values.map((v) => Number(v.code.slice(3))).sort((x, y) => x - y);
    expect(numbers).toEqual(consecutive(before + 1));
  }, 120_000);

  it(`gives ${N} concurrent approvals for one product ${N} distinct versions, exactly one current`, async () => {
    const dev = actorOf(a, 'developer');
    const head = actorOf(a, 'head_of_product');
    const first = await createApprovedVersion(a);
    const em = await getEm();
    const productId = ((await em.findOneOrFail(ProductVersion, { id: first.versionId })).product as unknown as { id: string }).id;
    const requestIds: string[] = [];
    for (let i = 0; i < N; i++) {
      const { trialId, variantId } = await createPromotableTrial(a);
      requestIds.push((await requestPromotion(dev, await promotionInput(a, trialId, variantId, { productId }))).requestId);
    }
    const { values, failures } = await allSettled(requestIds.map((id) => () => decidePromotion(head, id, { decision: 'approve', comment: '' })));
    expect(failures).toEqual([]);
    expect(values.every((v) => v.status === 'approved')).toBe(true);
    const versions = await (await getEm()).find(ProductVersion, { product: productId }, { orderBy: { version: 'asc' } });
    expect(versions.map((v) => v.version)).toEqual([1, ...consecutive(2)]);
    expect(versions.filter((v) => v.status === 'current').map((v) => v.version)).toEqual([N + 1]);
    // Each superseded version names the one that replaced it: the chain has no fork.
    expect(versions.slice(0, -1).map((v) => v.supersededByVersion)).toEqual(consecutive(2));
  }, 120_000);
});
