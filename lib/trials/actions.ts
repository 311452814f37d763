'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { correctCookSchema, createTrialSchema, manualVariantSchema, cookSchema, planSchema, proposalTrialSchema, transitionSchema, withdrawCookSchema } from './schema';
import { addVariant, correctCook, createProposalTrial, createTrial, planVariants, recordCook, removeVariant, transitionTrial, withdrawCook } from './mutations';
import { importCooksCsv } from './csv';

const trialId = z.uuid('Unknown trial.');
const refresh = (id: unknown) => revalidatePath(`/trials/${String(id)}`, 'layout');

export async function createTrialAction(input: unknown) {
  const result = await runAction('trials.write', createTrialSchema, input, createTrial);
  if (result.ok) revalidatePath('/trials');
  return result;
}

/** One click from the optimiser: a trial whose variants are the proposal and a few points around it. */
export async function createProposalTrialAction(input: unknown) {
  const result = await runAction('trials.write', proposalTrialSchema, input, createProposalTrial);
  if (result.ok) revalidatePath('/trials');
  return result;
}

export async function transitionTrialAction(id: unknown, input: unknown) {
  const result = await runAction('trials.write', z.object({ id: trialId, change: transitionSchema }), { id, change: input }, (actor, d) =>
    transitionTrial(actor, d.id, d.change.to, d.change.note),
  );
  if (result.ok) refresh(id);
  return result;
}

export async function planVariantsAction(id: unknown, input: unknown) {
  const result = await runAction('trials.write', z.object({ id: trialId, plan: planSchema }), { id, plan: input }, (actor, d) => planVariants(actor, d.id, d.plan));
  if (result.ok) refresh(id);
  return result;
}

export async function addVariantAction(id: unknown, input: unknown) {
  const result = await runAction('trials.write', z.object({ id: trialId, variant: manualVariantSchema }), { id, variant: input }, (actor, d) => addVariant(actor, d.id, d.variant));
  if (result.ok) refresh(id);
  return result;
}

export async function removeVariantAction(id: unknown, variantId: unknown) {
  const result = await runAction('trials.write', z.object({ id: trialId, variantId: z.uuid('Unknown variant.') }), { id, variantId }, (actor, d) => removeVariant(actor, d.id, d.variantId));
  if (result.ok) refresh(id);
  return result;
}

export async function recordCookAction(id: unknown, input: unknown) {
  const result = await runAction('trials.write', z.object({ id: trialId, cook: cookSchema }), { id, cook: input }, (actor, d) => recordCook(actor, d.id, d.cook));
  if (result.ok) refresh(id);
  return result;
}

export async function correctCookAction(id: unknown, cookId: unknown, input: unknown) {
  const schema = z.object({ id: trialId, cookId: z.uuid('Unknown cook.'), change: correctCookSchema });
  const result = await runAction('trials.write', schema, { id, cookId, change: input }, (actor, d) => correctCook(actor, d.id, d.cookId, d.change));
  if (result.ok) refresh(id);
  return result;
}

export async function withdrawCookAction(id: unknown, cookId: unknown, input: unknown) {
  const schema = z.object({ id: trialId, cookId: z.uuid('Unknown cook.'), change: withdrawCookSchema });
  const result = await runAction('trials.write', schema, { id, cookId, change: input }, (actor, d) => withdrawCook(actor, d.id, d.cookId, d.change.reason));
  if (result.ok) refresh(id);
  return result;
}

export async function importCooksAction(id: unknown, csv: unknown) {
  const schema = z.object({ id: trialId, csv: z.string().min(1, 'Choose a CSV file.').max(2_000_000, 'The file is too large (2 MB at most).') });
  const result = await runAction('trials.write', schema, { id, csv }, (actor, d) => importCooksCsv(actor, d.id, d.csv));
  if (result.ok) refresh(id);
  return result;
}
