import { notFound } from 'next/navigation';

export const dynamic = 'force-dynamic';

/**
 * An empty page in the same build, the baseline for the phone page's first-load JavaScript in
 * `npm run bench`. Outside a benchmark server (SETWELL_BENCH_FLOOR=1) it does not exist.
 */
export default function BenchBlankPage() {
  if (process.env.SETWELL_BENCH_FLOOR !== '1') notFound();
  return null;
}
