'use client';

import { Button } from '@/components/ui/Button';

/** What an area shows when its page fails on the server (each area's error.tsx). Nothing saved is touched. */
export function AreaError({ what, reset }: { what: string; reset: () => void }) {
  return (
    <section className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold">{what} did not load</h1>
      <p className="mt-2 text-rind-600">Something went wrong on our side. Nothing you saved was lost.</p>
      <Button className="mt-6" onClick={reset}>
        Try again
      </Button>
    </section>
  );
}
