'use client';

import { AreaError } from '@/components/shell/AreaError';

export default function AreaErrorPage({ reset }: { error: Error; reset: () => void }) {
  return <AreaError what="Tastings" reset={reset} />;
}
