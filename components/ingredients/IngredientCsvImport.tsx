'use client';

import { CsvImportPanel } from '@/components/ui/CsvImportPanel';
import { importIngredientsAction } from '@/lib/ingredients/actions';

/** Suppliers' values from a spreadsheet, all or nothing. */
export function IngredientCsvImport() {
  return (
    <CsvImportPanel title="Ingredients from a spreadsheet" fileLabel="CSV file of ingredients" send={importIngredientsAction}
      done={(d) => `Imported: ${d.created} added, ${d.updated} changed, ${d.unchanged} unchanged.`}>
      Use the columns of “Download CSV”. A row with an <code>id</code> (or the name of an ingredient you already have) replaces its values;
      a blank cell means unknown, never zero. Nothing is imported unless every row is right.
    </CsvImportPanel>
  );
}
