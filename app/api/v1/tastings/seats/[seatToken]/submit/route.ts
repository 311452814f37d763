import { publicRoute, json } from '@/lib/api/route';
import { submitSeat } from '@/lib/taster/seat';

export const dynamic = 'force-dynamic';

export const POST = publicRoute<{ seatToken: string }>(async ({ params }) => {
  await submitSeat(params.seatToken);
  return json({ ok: true });
});
