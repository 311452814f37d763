'use client';

import { useId, useState, type ReactNode } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { NETWORK_FAILURE_MESSAGE, type FormActionResult } from '@/components/ui/useFormAction';

const MAX_BYTES = 2_000_000;

/** What an import would change and waits for the user's word (nothing has landed yet). */
export interface CsvImportPreview {
  title: string;
  body: ReactNode;
  confirmLabel: string;
}

/**
 * The one all-or-nothing CSV import: the chosen file is read in the browser and its text sent to a
 * server action that checks every row before anything lands; bad cells come back as "row N, column".
 * With `preview`, an answer it turns into a preview lands nothing: the file is sent again, confirmed,
 * only when the user says so.
 */
export function CsvImportPanel<T>({ title, fileLabel, children, send, done, preview }: {
  title: string;
  fileLabel: string;
  children: ReactNode;
  send: (csv: string, confirmed: boolean) => Promise<FormActionResult<T>>;
  done: (data: T) => string;
  preview?: (data: T) => CsvImportPreview | null;
}) {
  const router = useRouter();
  const titleId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string; rows?: Array<[string, string[]]> }>();
  const [waiting, setWaiting] = useState<{ csv: string; preview: CsvImportPreview } | null>(null);

  async function upload(confirmedCsv?: string) {
    if (!file && confirmedCsv === undefined) return;
    if (confirmedCsv === undefined && file && file.size > MAX_BYTES) return setMessage({ tone: 'danger', text: 'The file is larger than 2 MB.' });
    setBusy(true);
    setMessage(undefined);
    setWaiting(null);
    const csv = confirmedCsv ?? (await file!.text());
    const res = await send(csv, confirmedCsv !== undefined).catch((): FormActionResult<T> => ({ ok: false, status: 0, error: NETWORK_FAILURE_MESSAGE }));
    setBusy(false);
    const asks = res.ok && confirmedCsv === undefined ? preview?.(res.data) ?? null : null;
    if (asks) {
      setWaiting({ csv, preview: asks });
    } else if (res.ok) {
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
          <input type="file" accept=".csv,text/csv" onChange={(e) => { setFile(e.target.files?.[0] ?? null); setWaiting(null); }} className="max-w-full text-sm" />
        </label>
        <Button type="button" tone="secondary" disabled={!file || busy} onClick={() => upload()}>{busy ? 'Checking…' : 'Import'}</Button>
      </div>
      {waiting ? (
        <div className="mt-3" data-testid="csv-preview">
          <Notice tone="warning" title={waiting.preview.title}>
            {waiting.preview.body}
            <div className="mt-3 flex flex-wrap gap-3">
              <Button type="button" disabled={busy} onClick={() => upload(waiting.csv)}>{waiting.preview.confirmLabel}</Button>
              <Button type="button" tone="secondary" disabled={busy} onClick={() => setWaiting(null)}>Cancel</Button>
            </div>
          </Notice>
        </div>
      ) : null}
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
