import { publicRoute, json } from '@/lib/api/route';
import { tasterView } from '@/lib/panels/taster';

export const dynamic = 'force-dynamic';

export const GET = publicRoute<{ seatToken: string }>(async ({ params }) => json(await tasterView(params.seatToken)));
