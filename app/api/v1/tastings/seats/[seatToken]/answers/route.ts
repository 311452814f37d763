import { publicRoute, json } from '@/lib/api/route';
import { recordAnswer } from '@/lib/taster/seat';
import { answerSchema } from '@/lib/tastings/schema';

export const dynamic = 'force-dynamic';

/** One answer, stored once per idempotency key; 409 after the session closed. */
export const PUT = publicRoute<{ seatToken: string }>(async ({ params, body }) => json(await recordAnswer(params.seatToken, await body(answerSchema))));
