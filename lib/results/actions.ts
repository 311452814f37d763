'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { recommendationSchema } from './schema';
import { recommendVariant } from './mutations';

export async function recommendVariantAction(trialId: unknown, input: unknown) {
  const schema = z.object({ trialId: z.uuid('Unknown trial.'), recommendation: recommendationSchema });
  const result = await runAction('trials.write', schema, { trialId, recommendation: input }, (actor, d) => recommendVariant(actor, d.trialId, d.recommendation));
  if (result.ok) revalidatePath(`/trials/${String(trialId)}`, 'layout');
  return result;
}
