/** Production records the promotion tests and the authorisation matrix build on. */
import { createTrial } from '@/lib/trials/mutations';
import { listVariants } from '@/lib/trials/queries';
import { getPromotionDraft, getProductionVersion } from '@/lib/production/queries';
import { decidePromotion, requestPromotion } from '@/lib/production/mutations';
import type { RequestPromotionInput } from '@/lib/production/schema';
import { actorOf, type WorkspaceFixture } from './harness';
import { createFixtureFormula } from './fixtures';

/** A trial on the fixture strawberry jam; its base variant A is computable and compliant (EU jam). */
export async function createPromotableTrial(fx: WorkspaceFixture): Promise<{ trialId: string; variantId: string }> {
  const dev = actorOf(fx, 'developer');
  const formulaId = await createFixtureFormula(fx);
  const { trialId } = await createTrial(dev, { title: 'Fixture promotion trial', question: 'Which variant goes to production?', formulaId });
  const [base] = await listVariants(dev, trialId);
  return { trialId, variantId: base.id };
}

let codeCounter = 0;
/** A fresh product code per call: A–Z letters only, as the scheme wants. */
export function freshProductCode(): string {
  codeCounter += 1;
  const n = Date.now() % 17576 + codeCounter * 7;
  return `Q${String.fromCharCode(65 + (n % 26))}${String.fromCharCode(65 + (Math.floor(n / 26) % 26))}${String.fromCharCode(65 + (Math.floor(n / 676) % 26))}`;
}

/** The request the form would send with its defaults, for a new product or a new version of one. */
export async function promotionInput(fx: WorkspaceFixture, trialId: string, variantId: string, product: { productId: string } | { code: string; name?: string }): Promise<RequestPromotionInput> {
  const draft = await getPromotionDraft(actorOf(fx, 'developer'), trialId);
  const v = draft.variants.find((x) => x.id === variantId)!;
  return {
    trialId, variantId,
    ...('productId' in product ? { target: 'existing_product' as const, productId: product.productId } : { target: 'new_product' as const, newProductName: product.name ?? 'Fixture strawberry jam', newProductCode: product.code }),
    rationale: 'Variant A set cleanly and scored best on overall liking.',
    process: { ...v.defaults!.process, cookNotes: 'Rolling boil; skim before filling.' },
    spec: v.defaults!.spec,
  };
}

/**
 * When the fixture's versions are requested and approved: early, so the tests' batches (dated from
 * 2025 on) are made after their version's approval, as recordBatch() requires.
 */
export const FIXTURE_REQUESTED_AT = new Date('2025-01-02T09:00:00Z');
export const FIXTURE_APPROVED_AT = new Date('2025-01-02T10:00:00Z');

/** Developer requests, head of product approves (on FIXTURE_APPROVED_AT): returns the new production version. */
export async function createApprovedVersion(fx: WorkspaceFixture, product?: { productId: string }): Promise<{ versionId: string; requestId: string; productCode: string; trialId: string }> {
  const { trialId, variantId } = await createPromotableTrial(fx);
  const code = freshProductCode();
  const input = await promotionInput(fx, trialId, variantId, product ?? { code });
  const { requestId } = await requestPromotion(actorOf(fx, 'developer'), input, { at: FIXTURE_REQUESTED_AT });
  const { productVersionId } = await decidePromotion(actorOf(fx, 'head_of_product'), requestId, { decision: 'approve', comment: '' }, { at: FIXTURE_APPROVED_AT });
  const version = await getProductionVersion(actorOf(fx, 'production'), productVersionId!);
  return { versionId: version.id, requestId, productCode: version.product.code, trialId };
}
