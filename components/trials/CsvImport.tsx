'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { importMeasurementsAction } from '@/lib/trials/actions';
import { MEASUREMENT_CSV_HEADER } from '@/lib/trials/csv-columns';

/** Reads the chosen file in the browser and sends its text; the server checks every row before anything lands. */
export function CsvImport({ trialId }: { trialId: string }) {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string; rows?: Array<[string, string[]]> }>();

  async function upload() {
    if (!file) return;
    if (file.size > 2_000_000) return setMessage({ tone: 'danger', text: 'The file is larger than 2 MB.' });
    setBusy(true);
    setMessage(undefined);
    const res = await importMeasurementsAction(trialId, await file.text());
    setBusy(false);
    if (res.ok) {
      setMessage({ tone: 'success', text: `Imported ${res.data.imported} cook${res.data.imported === 1 ? '' : 's'}.` });
      router.refresh();
    } else {
      setMessage({ tone: 'danger', text: res.error, rows: res.fields ? Object.entries(res.fields) : undefined });
    }
  }

  return (
    <section aria-labelledby="csv-title" className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
      <h2 id="csv-title" className="text-lg font-semibold">Cooks from a spreadsheet</h2>
      <p className="mt-1 text-sm text-rind-600">
        One row per cook, first row the column names. <code className="break-all text-xs">{MEASUREMENT_CSV_HEADER}</code>. Only <code>variant</code> (the label, e.g. B) and <code>cook_date</code> are required.
        Nothing is imported unless every row is right.
      </p>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <label className="text-sm">
          <span className="sr-only">CSV file</span>
          <input type="file" accept=".csv,text/csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="text-sm" />
        </label>
        <Button type="button" tone="secondary" disabled={!file || busy} onClick={upload}>{busy ? 'Checking…' : 'Import'}</Button>
      </div>
      {message ? (
        <div className="mt-3">
          <Notice tone={message.tone} title={message.text}>
            {message.rows ? (
              <ul className="list-disc pl-5" data-testid="csv-errors">
                {message.rows.map(([where, msgs]) => <li key={where}><strong>{where}:</strong> {msgs.join(' ')}</li>)}
              </ul>
            ) : null}
          </Notice>
        </div>
      ) : null}
    </section>
  );
}
