import { notFound } from 'next/navigation';
import { TastingFlow } from '@/components/taster/TastingFlow';
import { tasterViewOrNull } from '@/lib/taster/seat';
import { parseSeatView } from '@/lib/taster';
import type { TasterView } from '@/lib/tastings/schema';
import { logger } from '@/lib/log';

export const metadata = { title: 'Tasting' };

/**
 * The seat is read here so the first screen (sample code, questions, controls) is in the HTML: a
 * slow phone paints it without waiting for the script and an API round trip. The view goes through
 * the same contract filter as the API's answer. An unknown seat is a 404 (not-found.tsx says what
 * to do); if the read fails for another reason, the client loads the seat through the API and
 * offers "Try again".
 */
export default async function SeatPage({ params }: { params: Promise<{ seatToken: string }> }) {
  const { seatToken } = await params;
  let view: TasterView | null | undefined;
  try {
    view = await tasterViewOrNull(seatToken);
  } catch (err) {
    logger.warn({ err }, 'tasting page: first read failed, the phone loads the seat itself');
  }
  if (view === null) notFound();
  return <TastingFlow seatToken={seatToken} first={view ? parseSeatView(JSON.parse(JSON.stringify(view))) : undefined} />;
}
