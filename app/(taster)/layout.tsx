import type { Metadata } from 'next';

// Seat links are personal; keep them out of search results and referrer headers.
export const metadata: Metadata = { robots: { index: false, follow: false }, referrer: 'no-referrer' };

/** The taster's phone pages: no staff navigation, just the flow on cream paper. */
export default function TastingLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="min-h-dvh bg-pith-100 font-sans text-rind-900">
      <header className="mx-auto flex w-full max-w-md items-center px-4 pt-4">
        <span className="font-display text-lg text-damson-800">Setwell tasting</span>
      </header>
      <main className="mx-auto w-full max-w-md px-4 py-5">{children}</main>
    </div>
  );
}
