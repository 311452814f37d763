'use server';
/** Server actions of the production feature: thin wrappers over the mutations, through runAction. */
import { z } from 'zod';
import { revalidatePath } from 'next/cache';
import { runAction } from '@/lib/actions';
import { batchDecisionSchema, batchRecordSchema, batchRetestSchema, decisionSchema, requestPromotionSchema, withdrawSchema } from './schema';
import { decideBatch, decidePromotion, recordBatch, requestPromotion, retestBatch, withdrawPromotion } from './mutations';

export async function requestPromotionAction(input: unknown) {
  const result = await runAction('promotion.request', requestPromotionSchema, input, (actor, d) => requestPromotion(actor, d));
  if (result.ok) revalidatePath('/production/reviews');
  return result;
}

export async function decidePromotionAction(requestId: unknown, input: unknown) {
  const schema = z.object({ requestId: z.uuid('Unknown request.'), decision: decisionSchema });
  const result = await runAction('promotion.decide', schema, { requestId, decision: input }, (actor, d) => decidePromotion(actor, d.requestId, d.decision));
  if (result.ok) revalidatePath('/production', 'layout');
  return result;
}

export async function withdrawPromotionAction(requestId: unknown, input: unknown) {
  const schema = z.object({ requestId: z.uuid('Unknown request.'), withdraw: withdrawSchema });
  const result = await runAction('promotion.request', schema, { requestId, withdraw: input }, (actor, d) => withdrawPromotion(actor, d.requestId, d.withdraw.comment));
  if (result.ok) revalidatePath('/production/reviews');
  return result;
}

export async function recordBatchAction(versionId: unknown, input: unknown) {
  const schema = z.object({ versionId: z.uuid('Unknown production version.'), batch: batchRecordSchema });
  const result = await runAction('batches.record', schema, { versionId, batch: input }, (actor, d) => recordBatch(actor, d.versionId, d.batch));
  if (result.ok) revalidatePath('/production', 'layout');
  return result;
}

export async function retestBatchAction(batchId: unknown, input: unknown) {
  const schema = z.object({ batchId: z.uuid('Unknown batch.'), retest: batchRetestSchema });
  const result = await runAction('batches.record', schema, { batchId, retest: input }, (actor, d) => retestBatch(actor, d.batchId, d.retest));
  if (result.ok) revalidatePath('/production', 'layout');
  return result;
}

export async function decideBatchAction(batchId: unknown, input: unknown) {
  const schema = z.object({ batchId: z.uuid('Unknown batch.'), decision: batchDecisionSchema });
  const result = await runAction('batches.record', schema, { batchId, decision: input }, (actor, d) => decideBatch(actor, d.batchId, d.decision));
  if (result.ok) revalidatePath('/production', 'layout');
  return result;
}
