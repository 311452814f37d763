import Link from 'next/link';
import { RecordElsewhere } from '@/components/workspaces/RecordElsewhere';
import { recordHomeOfRequest } from '@/lib/workspaces/record-home';

/**
 * The 404 of a record. A record of another of the user's own workspaces offers the switch instead.
 * A section, not a <main>: inside an area it renders in the staff frame's main.
 */
export async function MissingRecord({ kind = 'page or record' }: { kind?: string }) {
  const home = await recordHomeOfRequest();
  if (home) return <RecordElsewhere home={home} />;
  return (
    <section className="mx-auto max-w-lg px-6 py-24 text-center">
      <p className="font-display text-5xl text-damson-300">404</p>
      <h1 className="mt-4 text-2xl font-semibold">Nothing here</h1>
      <p className="mt-2 text-rind-600">The {kind} does not exist in this workspace.</p>
      <Link href="/home" className="mt-6 inline-block text-damson-700 underline underline-offset-2">
        Back to your overview
      </Link>
    </section>
  );
}
