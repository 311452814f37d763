import { publicRoute, json } from '@/lib/api/route';
import { joinAsGuest } from '@/lib/tastings/mutations';
import { joinSchema } from '@/lib/tastings/schema';
import { clientAddress } from '@/lib/client-address';
import { consumeJoinAttempt } from '@/lib/rate-limit';

export const dynamic = 'force-dynamic';

/** Guests join with the short code; every attempt counts against the address (429 past the limit). */
export const POST = publicRoute(async ({ req, body }) => {
  await consumeJoinAttempt(clientAddress(req.headers));
  return json(await joinAsGuest(await body(joinSchema)), 201);
});
