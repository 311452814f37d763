'use client';

import { CsvImportPanel } from '@/components/ui/CsvImportPanel';
import { importCooksAction } from '@/lib/trials/actions';
import { COOK_CSV_HEADER } from '@/lib/trials/csv-columns';

/** Cooks from a spreadsheet, all or nothing. */
export function CsvImport({ trialId }: { trialId: string }) {
  return (
    <CsvImportPanel title="Cooks from a spreadsheet" fileLabel="CSV file" send={(csv) => importCooksAction(trialId, csv)}
      done={(d) => `Imported ${d.imported} cook${d.imported === 1 ? '' : 's'}.`}>
      One row per cook, first row the column names. <code className="break-all text-xs">{COOK_CSV_HEADER}</code>. Only <code>variant</code> (the label, e.g. B) and <code>cook_date</code> are required.
      Nothing is imported unless every row is right.
    </CsvImportPanel>
  );
}
