'use client';

import { CsvImportPanel } from '@/components/ui/CsvImportPanel';
import { importIngredientsAction } from '@/lib/ingredients/actions';
import type { IngredientImportResult } from '@/lib/ingredients/schema';

const cell = (v: string) => (v === '' ? 'blank' : v);

/** "The file also adds 2 new ingredients and leaves 21 unchanged. ", leaving out a count of 0. */
function alsoText(d: IngredientImportResult): string {
  const parts = [
    d.created ? `adds ${d.created} new ingredient${d.created > 1 ? 's' : ''}` : '',
    d.unchanged ? `leaves ${d.unchanged} unchanged` : '',
  ].filter(Boolean);
  return parts.length ? `The file also ${parts.join(' and ')}. ` : '';
}

/** The rows that would change ingredients already in the library, each change before → after. */
function updatesPreview(d: IngredientImportResult) {
  if (d.imported || !d.updates.length) return null;
  const n = d.updates.length;
  return {
    title: `Nothing imported yet: ${n} row${n > 1 ? 's change ingredients' : ' changes an ingredient'} you already have.`,
    body: (
      <>
        <ul className="list-disc space-y-1 pl-5" data-testid="csv-updates">
          {d.updates.map((u) => (
            <li key={u.ingredientId}>
              <strong>Row {u.row} updates {u.name}:</strong>{' '}
              {u.changes.length ? u.changes.map((c, i) => <span key={c.column}>{i ? '; ' : ''}column <code className="font-mono text-xs">{c.column}</code> {cell(c.before)} → {cell(c.after)}</span>) : 'no change in the file’s columns'}
            </li>
          ))}
        </ul>
        <p className="mt-2">{alsoText(d)}Nothing is imported unless you confirm.</p>
      </>
    ),
    confirmLabel: `Import and update ${n} ingredient${n > 1 ? 's' : ''}`,
  };
}

/** Suppliers' values from a spreadsheet, all or nothing; changes to ingredients already there are shown and confirmed first. */
export function IngredientCsvImport() {
  return (
    <CsvImportPanel title="Ingredients from a spreadsheet" fileLabel="CSV file of ingredients" send={(csv, confirmed) => importIngredientsAction(csv, confirmed)}
      preview={updatesPreview}
      done={(d) => `Imported: ${d.created} added, ${d.updated} changed, ${d.unchanged} unchanged.`}>
      Use the columns of “Download CSV”. A row with an <code>id</code> (or the name of an ingredient you already have) replaces its values:
      you see each change and confirm it before anything is imported. A blank cell means unknown, never zero. Nothing is imported unless every row is right.
    </CsvImportPanel>
  );
}
