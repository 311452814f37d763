import { publicRoute, json } from '@/lib/api/route';
import { tasterView } from '@/lib/taster/seat';

export const dynamic = 'force-dynamic';

export const GET = publicRoute<{ seatToken: string }>(async ({ params }) => json(await tasterView(params.seatToken)));
