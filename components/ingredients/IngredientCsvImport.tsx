'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { NETWORK_FAILURE_MESSAGE } from '@/components/ui/useFormAction';
import { importIngredientsAction } from '@/lib/ingredients/actions';

const MAX_BYTES = 2_000_000;

/** Suppliers' values from a spreadsheet: the file is read in the browser, the server checks every row before anything lands. */
export function IngredientCsvImport() {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string; rows?: Array<[string, string[]]> }>();

  async function upload() {
    if (!file) return;
    if (file.size > MAX_BYTES) return setMessage({ tone: 'danger', text: 'The file is larger than 2 MB.' });
    setBusy(true);
    setMessage(undefined);
    const res = await importIngredientsAction(await file.text()).catch(() => ({ ok: false as const, error: NETWORK_FAILURE_MESSAGE, fields: undefined }));
    setBusy(false);
    if (res.ok) {
      const { created, updated, unchanged } = res.data;
      setMessage({ tone: 'success', text: `Imported: ${created} added, ${updated} changed, ${unchanged} unchanged.` });
      router.refresh();
    } else {
      setMessage({ tone: 'danger', text: res.error, rows: res.fields ? Object.entries(res.fields) : undefined });
    }
  }

  return (
    <section aria-labelledby="ingredient-csv-title" className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
      <h2 id="ingredient-csv-title" className="text-lg font-semibold">Ingredients from a spreadsheet</h2>
      <p className="mt-1 text-sm text-rind-600">
        Use the columns of “Download CSV”. A row with an <code>id</code> (or the name of an ingredient you already have) replaces its values;
        a blank cell means unknown, never zero. Nothing is imported unless every row is right.
      </p>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <label className="text-sm">
          <span className="sr-only">CSV file of ingredients</span>
          <input type="file" accept=".csv,text/csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="max-w-full text-sm" />
        </label>
        <Button type="button" onClick={upload} disabled={!file || busy}>{busy ? 'Importing…' : 'Import'}</Button>
      </div>
      {message ? (
        <div className="mt-3">
          <Notice tone={message.tone}>
            {message.text}
            {message.rows ? (
              <ul className="mt-2 list-disc pl-5">
                {message.rows.map(([where, msgs]) => <li key={where}><strong>{where}:</strong> {msgs.join(' ')}</li>)}
              </ul>
            ) : null}
          </Notice>
        </div>
      ) : null}
    </section>
  );
}
