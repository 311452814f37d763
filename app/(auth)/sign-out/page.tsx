import Link from 'next/link';
import { SignOutButton } from '@/components/auth/SignOutButton';

export const metadata = { title: 'Sign out' };

export default function SignOutPage() {
  return (
    <>
      <h1 className="mb-2 text-2xl font-semibold">Sign out?</h1>
      <p className="mb-6 text-sm text-rind-600">You will need your password to come back. Unsaved notes in other tabs stay unsaved.</p>
      <div className="flex items-center gap-3">
        <SignOutButton />
        <Link href="/home" className="text-sm text-damson-700 underline underline-offset-2">
          Stay signed in
        </Link>
      </div>
    </>
  );
}
