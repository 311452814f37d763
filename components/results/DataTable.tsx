import type { ReactNode } from 'react';

/**
 * Tables keep real columns on every screen: padded cells, numbers right-aligned, and a box of their
 * own that scrolls sideways when it must. The cell kinds are short classes defined once in
 * app/globals.css: a results page has hundreds of cells, and each cell's class goes out twice (in the
 * HTML and in the page's RSC payload), so a list of utilities per cell was a fifth of the page.
 */
export const TABLE_BOX = 'overflow-x-auto';
export const TABLE = 'data-table';
export const HEAD = 'data-head';
export const TH = 'data-th';
export const NUM_TH = 'data-th-num';
export const CELL = 'data-cell';
export const NUM = 'data-num';

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

