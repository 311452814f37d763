'use client';

import { Button } from '@/components/ui/Button';

export default function LabError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-2xl font-semibold">That did not load</h1>
      <p className="mt-2 text-rind-600">Something went wrong on our side. Nothing you saved was lost.</p>
      <Button className="mt-6" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
