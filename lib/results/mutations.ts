import 'server-only';
/** Writes of the results feature: the developer's recommendation of a trial's variant. */
import { momentOf, type RecordedAt } from '@/lib/recorded-at';
import { getEm } from '@/lib/db';
import { Trial, User, Variant } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import { ValidationFailed } from '@/lib/errors';

/** The product developer marks the variant to promote, with the reasons; the promotion step reads it. */
export async function recommendVariant(actor: Actor, trialId: string, input: { variantId: string; rationale: string }, options: RecordedAt = {}): Promise<void> {
  const em = await getEm();
  const trial = await em.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  if (!trial) throw notFound('trial');
  const variant = await em.findOne(Variant, { ...inWorkspace(actor), trial: trialId, id: input.variantId, removedAt: null });
  if (!variant) throw new ValidationFailed('Choose a variant of this trial.', { variantId: ['Choose a variant of this trial.'] });
  trial.recommendedVariantId = variant.id;
  trial.recommendationRationale = input.rationale;
  trial.recommendedBy = em.getReference(User, actor.userId);
  trial.recommendedAt = momentOf(options);
  trial.updatedAt = momentOf(options);
  await em.flush();
}
