import Link from 'next/link';
import { SEAT_NOT_FOUND_MESSAGE } from '@/lib/taster';

/** An unknown or mistyped seat link: a 404 that tells the taster what to do, inside the phone layout. */
export default function SeatNotFound() {
  return (
    <div className="space-y-4 py-8">
      <h1 className="font-display text-3xl leading-tight text-damson-900">Tasting not found</h1>
      <p className="text-base text-rind-700">{SEAT_NOT_FOUND_MESSAGE}</p>
      <Link href="/join" className="inline-block min-h-12 py-3 text-base font-semibold text-damson-700 underline underline-offset-4">
        Join with a code
      </Link>
    </div>
  );
}
