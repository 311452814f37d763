import type { ReactNode } from 'react';

/** Tables keep real columns on every screen: padded cells, numbers right-aligned, and a box of their own that scrolls sideways when it must. */
export const TABLE_BOX = 'overflow-x-auto';
export const TABLE = 'w-full min-w-max border-collapse text-sm';
export const HEAD = 'border-b border-pith-300 text-left text-xs uppercase tracking-wider text-rind-500';
export const TH = 'px-3 py-2 font-medium';
export const NUM_TH = `${TH} text-right`;
export const CELL = 'px-3 py-1.5';
export const NUM = `${CELL} text-right tabular-nums`;

export function DataTable({ testId, caption, children }: { testId?: string; caption?: string; children: ReactNode }) {
  return (
    <div className={TABLE_BOX}>
      <table className={TABLE} data-testid={testId}>
        {caption ? <caption className="px-3 pb-1 text-left text-sm font-medium text-rind-700">{caption}</caption> : null}
        {children}
      </table>
    </div>
  );
}

