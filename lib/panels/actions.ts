'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { createAttribute, createPanelSession, discardPanelSession, renewMySeatLink, updatePanelSession } from './mutations';
import { createAttributeSchema, createPanelSchema } from './schema';

const trialId = z.uuid('Unknown trial.');
const sessionId = z.uuid('Unknown tasting.');

/** A signed-in taster's way back to their own seat: returns the fresh seat link's path. */
export async function renewMySeatAction(id: unknown) {
  return runAction('tastings.own', z.object({ sessionId }), { sessionId: id }, (actor, d) => renewMySeatLink(actor, d.sessionId));
}

/** Sets up a tasting of a trial's variants. */
export async function createTastingAction(trial: unknown, input: unknown) {
  const result = await runAction('panels.run', z.object({ trialId, tasting: createPanelSchema }), { trialId: trial, tasting: input }, (actor, d) =>
    createPanelSession(actor, d.trialId, d.tasting),
  );
  if (result.ok) revalidatePath('/panels');
  return result;
}

/** Replaces the set-up of a tasting that has not opened (409 once it has). */
export async function updateTastingAction(id: unknown, input: unknown) {
  const result = await runAction('panels.run', z.object({ sessionId, tasting: createPanelSchema }), { sessionId: id, tasting: input }, (actor, d) =>
    updatePanelSession(actor, d.sessionId, d.tasting),
  );
  if (result.ok) revalidatePath(`/panels/${String(id)}`);
  return result;
}

/** Discards a tasting that never opened (409 once it has). */
export async function discardTastingAction(id: unknown) {
  const result = await runAction('panels.run', z.object({ sessionId }), { sessionId: id }, (actor, d) => discardPanelSession(actor, d.sessionId));
  if (result.ok) revalidatePath('/panels');
  return result;
}

/** Adds an attribute of the workspace's own to its library. */
export async function createAttributeAction(input: unknown) {
  const result = await runAction('panels.run', createAttributeSchema, input, createAttribute);
  if (result.ok) revalidatePath('/settings/attributes');
  return result;
}
