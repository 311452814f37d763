import type { ReactNode } from 'react';

/**
 * The box every wide table sits in: on a narrow screen the table scrolls sideways inside it and the
 * page never does. It is a labelled region that takes keyboard focus, so the arrow keys scroll it too.
 * `framed` draws the usual card ring; leave it off for a table that already sits inside a card.
 */
export function TableBox({ label, framed = true, className = '', children }: { label: string; framed?: boolean; className?: string; children: ReactNode }) {
  return (
    <div
      role="region"
      aria-label={label}
      tabIndex={0}
      className={`relative max-w-full overflow-x-auto print:overflow-visible focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-damson-600 ${framed ? 'rounded-card ring-1 ring-pith-300' : ''} ${className}`}
    >
      {children}
    </div>
  );
}
