import Link from 'next/link';
import { SetwellWordmark } from '@/components/brand/SetwellMark';

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center bg-[radial-gradient(ellipse_at_top,_#ecdde7,_#fbf7ee_60%)] px-4 py-10">
      <Link href="/" className="mb-8" aria-label="Setwell home">
        <SetwellWordmark />
      </Link>
      <div className="w-full max-w-md rounded-card bg-pith-50 p-6 shadow-card ring-1 ring-pith-300 sm:p-8">{children}</div>
      <p className="mt-6 max-w-md text-center text-xs text-rind-500">
        Setwell keeps your formulas, trials and tasting answers private to your workspace.
      </p>
    </main>
  );
}
