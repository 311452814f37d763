'use client';

import { useId, useState, type ReactNode } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { NETWORK_FAILURE_MESSAGE, type FormActionResult } from '@/components/ui/useFormAction';

const MAX_BYTES = 2_000_000;

/**
 * The one all-or-nothing CSV import: the chosen file is read in the browser and its text sent to a
 * server action that checks every row before anything lands; bad cells come back as "row N, column".
 */
export function CsvImportPanel<T>({ title, fileLabel, children, send, done }: {
  title: string;
  fileLabel: string;
  children: ReactNode;
  send: (csv: string) => Promise<FormActionResult<T>>;
  done: (data: T) => string;
}) {
  const router = useRouter();
  const titleId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string; rows?: Array<[string, string[]]> }>();

  async function upload() {
    if (!file) return;
    if (file.size > MAX_BYTES) return setMessage({ tone: 'danger', text: 'The file is larger than 2 MB.' });
    setBusy(true);
    setMessage(undefined);
    const res = await send(await file.text()).catch((): FormActionResult<T> => ({ ok: false, status: 0, error: NETWORK_FAILURE_MESSAGE }));
    setBusy(false);
    if (res.ok) {
      setMessage({ tone: 'success', text: done(res.data) });
      router.refresh();
    } else {
      setMessage({ tone: 'danger', text: res.error, rows: res.fields ? Object.entries(res.fields) : undefined });
    }
  }

  return (
    <section aria-labelledby={titleId} className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
      <h2 id={titleId} className="text-lg font-semibold">{title}</h2>
      <p className="mt-1 text-sm text-rind-600">{children}</p>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <label className="text-sm">
          <span className="sr-only">{fileLabel}</span>
          <input type="file" accept=".csv,text/csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} className="max-w-full text-sm" />
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
