'use client';

import { CsvImportPanel } from '@/components/ui/CsvImportPanel';
import { importPricesAction } from '@/lib/pricing/actions';

/** Prices from a spreadsheet, all or nothing; rows already on record are counted, not added again. */
export function PriceImportForm({ currency }: { currency: string }) {
  return (
    <CsvImportPanel title="Import prices from CSV" fileLabel="CSV file of prices" send={(csv) => importPricesAction({ csv })}
      done={(d) => `${d.imported} price${d.imported === 1 ? '' : 's'} imported${d.alreadyPresent ? `; ${d.alreadyPresent} already on record, not added again` : ''}.`}>
      Columns: <code>ingredient</code> (as named in the library), <code>valid_from</code> (YYYY-MM-DD), <code>pack_price</code> ({currency}),
      {' '}<code>pack_size</code>, <code>pack_unit</code> (g, kg or lb), and optionally <code>supplier</code> and <code>currency</code>.
      A row already on record (same ingredient, day, pack price, pack size and supplier) is not added again. Nothing is imported unless every row is right.
    </CsvImportPanel>
  );
}
