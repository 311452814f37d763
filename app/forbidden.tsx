import Link from 'next/link';
import { RecordElsewhere } from '@/components/workspaces/RecordElsewhere';
import { recordHomeOfRequest } from '@/lib/workspaces/record-home';

export default async function Forbidden() {
  // The active role cannot open this kind of record, but the record is in another of the user's workspaces.
  const home = await recordHomeOfRequest();
  if (home) return <RecordElsewhere home={home} />;
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <p className="font-display text-5xl text-damson-300">403</p>
      <h1 className="mt-4 text-2xl font-semibold">This part of Setwell is not open to your role</h1>
      <p className="mt-2 text-rind-600">If you need it, ask an administrator of your workspace to change your role.</p>
      <Link href="/home" className="mt-6 inline-block text-damson-700 underline underline-offset-2">
        Back to your overview
      </Link>
    </main>
  );
}
