import Link from 'next/link';
import { RecordElsewhere } from '@/components/workspaces/RecordElsewhere';
import { recordHomeOfRequest } from '@/lib/workspaces/record-home';

export default async function NotFound() {
  // A record of another of the user's own workspaces: offer the switch instead.
  const home = await recordHomeOfRequest();
  if (home) return <RecordElsewhere home={home} />;
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <p className="font-display text-5xl text-damson-300">404</p>
      <h1 className="mt-4 text-2xl font-semibold">Nothing here</h1>
      <p className="mt-2 text-rind-600">The page or record does not exist in this workspace.</p>
      <Link href="/home" className="mt-6 inline-block text-damson-700 underline underline-offset-2">
        Back to your overview
      </Link>
    </main>
  );
}
