/** Scoped look-ups other features use to hang their records on a trial (uploads, notebook). */
import { getEm } from '@/lib/db';
import { Trial, Variant } from '@/entities';
import { inWorkspace, notFound, type Actor } from '@/lib/permissions';
import type { TrialStatus } from './vocabulary';

export interface TrialRef {
  id: string;
  number: number;
  title: string;
  status: TrialStatus;
}

/** The trial, if it is in the actor's workspace; otherwise 404, as for one that does not exist. */
export async function loadTrial(actor: Actor, trialId: string): Promise<TrialRef> {
  const em = await getEm();
  const t = await em.findOne(Trial, { ...inWorkspace(actor), id: trialId });
  if (!t) throw notFound('trial');
  return { id: t.id, number: t.number, title: t.title, status: t.status };
}

/** 404 unless the variant belongs to that trial of the actor's workspace. */
export async function assertVariantOfTrial(actor: Actor, trialId: string, variantId: string): Promise<void> {
  const em = await getEm();
  const n = await em.count(Variant, { ...inWorkspace(actor), id: variantId, trial: trialId, removedAt: null });
  if (!n) throw notFound('variant');
}

export function trialCode(number: number): string {
  return `T-${String(number).padStart(3, '0')}`;
}
