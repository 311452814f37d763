import { TastingFlow, type FirstLoad } from '@/components/tasting/TastingFlow';
import { tasterViewOrNull } from '@/lib/panels/taster';
import { parseSeatView, SEAT_NOT_FOUND_MESSAGE } from '@/lib/tasting-client';
import { logger } from '@/lib/log';

export const metadata = { title: 'Tasting' };

/**
 * The seat is read here so the first screen (sample code, questions, controls) is in the HTML: a
 * slow phone paints it without waiting for the script and an API round trip. The view goes through
 * the same contract filter as the API's answer. If the read fails for another reason, the client
 * loads the seat through the API and offers "Try again".
 */
export default async function SeatPage({ params }: { params: Promise<{ seatToken: string }> }) {
  const { seatToken } = await params;
  let first: FirstLoad | undefined;
  try {
    const view = await tasterViewOrNull(seatToken);
    first = view ? { kind: 'ready', view: parseSeatView(JSON.parse(JSON.stringify(view))) } : { kind: 'failed', message: SEAT_NOT_FOUND_MESSAGE };
  } catch (err) {
    logger.warn({ err }, 'tasting page: first read failed, the phone loads the seat itself');
  }
  return <TastingFlow seatToken={seatToken} first={first} />;
}
