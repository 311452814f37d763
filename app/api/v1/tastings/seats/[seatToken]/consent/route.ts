import { publicRoute, json } from '@/lib/api/route';
import { recordConsent } from '@/lib/taster/seat';

export const dynamic = 'force-dynamic';

export const POST = publicRoute<{ seatToken: string }>(async ({ params }) => {
  await recordConsent(params.seatToken);
  return json({ ok: true });
});
