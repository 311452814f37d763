'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { createAttribute, createTasting, discardTasting, renewMySeatLink, updateTasting } from './mutations';
import { createAttributeSchema, createTastingSchema } from './schema';

const trialId = z.uuid('Unknown trial.');
const tastingId = z.uuid('Unknown tasting.');

/** A signed-in taster's way back to their own seat: returns the fresh seat link's path. */
export async function renewMySeatAction(id: unknown) {
  return runAction('tastings.own', z.object({ tastingId }), { tastingId: id }, (actor, d) => renewMySeatLink(actor, d.tastingId));
}

/** Sets up a tasting of a trial's variants. */
export async function createTastingAction(trial: unknown, input: unknown) {
  const result = await runAction('tastings.run', z.object({ trialId, tasting: createTastingSchema }), { trialId: trial, tasting: input }, (actor, d) =>
    createTasting(actor, d.trialId, d.tasting),
  );
  if (result.ok) revalidatePath('/tastings');
  return result;
}

/** Replaces the set-up of a tasting that has not opened (409 once it has). */
export async function updateTastingAction(id: unknown, input: unknown) {
  const result = await runAction('tastings.run', z.object({ tastingId, tasting: createTastingSchema }), { tastingId: id, tasting: input }, (actor, d) =>
    updateTasting(actor, d.tastingId, d.tasting),
  );
  if (result.ok) revalidatePath(`/tastings/${String(id)}`);
  return result;
}

/** Discards a tasting that never opened (409 once it has). */
export async function discardTastingAction(id: unknown) {
  const result = await runAction('tastings.run', z.object({ tastingId }), { tastingId: id }, (actor, d) => discardTasting(actor, d.tastingId));
  if (result.ok) revalidatePath('/tastings');
  return result;
}

/** Adds an attribute of the workspace's own to its library. */
export async function createAttributeAction(input: unknown) {
  const result = await runAction('tastings.run', createAttributeSchema, input, createAttribute);
  if (result.ok) revalidatePath('/settings/attributes');
  return result;
}
