/**
 * The results page reads a tasting's answers while it checks the tasting (readAnswers), so it waits
 * for one round trip instead of two; the read must give the same analysis and reveal nothing across
 * workspaces or for a tasting that does not exist.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { createWorkspace, actorOf, type WorkspaceFixture } from './harness';
import { tastingFixture } from './access-tastings';
import { joinAsGuest } from '@/lib/tastings/mutations';
import { recordAnswer, recordConsent, tasterView } from '@/lib/taster/seat';
import { analyseResults, loadResultsSetup, readAnswers } from '@/lib/results/queries';

let a: WorkspaceFixture;
let b: WorkspaceFixture;
let tastingId: string;
beforeAll(async () => {
  a = await createWorkspace('Results reads');
  b = await createWorkspace('Other results reads');
  const t = await tastingFixture(a);
  tastingId = t.tastingId;
  for (const [i, value] of [7, 5].entries()) {
    const { seatToken } = await joinAsGuest({ joinCode: t.joinCode!, displayName: `Guest ${i + 1}` });
    await recordConsent(seatToken);
    const view = await tasterView(seatToken);
    for (const sample of view.samples) await recordAnswer(seatToken, { idempotencyKey: randomUUID(), code: sample.code, attributeId: t.attributeId, value });
  }
});

describe('the answers read beside the tasting’s check', () => {
  it('give the analysis the page gave when it read them after the check', async () => {
    const actor = actorOf(a, 'developer');
    const answers = readAnswers(actor, tastingId);
    const setup = await loadResultsSetup(actor, tastingId);
    expect(await answers).toHaveLength(4);
    const early = await analyseResults(actor, setup, {}, answers);
    const late = await analyseResults(actor, setup);
    expect(early).toEqual(late);
    expect(early.attributes[0].descriptive.map((d) => d.n)).toEqual([2, 2]);
  });

  it('reveal nothing of another workspace’s tasting, or of one that does not exist, and fail nobody', async () => {
    const other = actorOf(b, 'developer');
    const answers = readAnswers(other, tastingId);
    await expect(loadResultsSetup(other, tastingId)).rejects.toMatchObject({ status: 404 });
    expect(await answers).toEqual([]);
    const missing = randomUUID();
    const none = readAnswers(actorOf(a, 'developer'), missing);
    await expect(loadResultsSetup(actorOf(a, 'developer'), missing)).rejects.toMatchObject({ status: 404 });
    expect(await none).toEqual([]);
  });
});
