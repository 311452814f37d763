'use server';

import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { renewMySeatLink } from './mutations';

/** A signed-in taster's way back to their own seat: returns the fresh seat link's path. */
export async function renewMySeatAction(sessionId: unknown) {
  return runAction('tastings.own', z.object({ sessionId: z.uuid('Unknown tasting.') }), { sessionId }, (actor, d) => renewMySeatLink(actor, d.sessionId));
}
