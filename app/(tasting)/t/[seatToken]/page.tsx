import { TastingFlow } from '@/components/tasting/TastingFlow';

export const metadata = { title: 'Tasting' };

/** Thin on purpose: the client component loads the seat through the API, never the database. */
export default async function SeatPage({ params }: { params: Promise<{ seatToken: string }> }) {
  const { seatToken } = await params;
  return <TastingFlow seatToken={seatToken} />;
}
