'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { importPricesAction } from '@/lib/pricing/actions';

/** CSV import, all or nothing: every problem is listed by row and column and nothing is stored until the file is clean. */
export function PriceImportForm({ currency }: { currency: string }) {
  const router = useRouter();
  const form = useFormAction(importPricesAction);
  const [csv, setCsv] = useState<string>();
  const [fileName, setFileName] = useState('');
  const [imported, setImported] = useState<number>();
  async function pick(e: React.ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    setImported(undefined);
    setFileName(file?.name ?? '');
    setCsv(file ? await file.text() : undefined);
  }
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const result = await form.run({ csv: csv ?? '' });
    if (result?.ok) {
      setImported((result.data as { imported: number }).imported);
      router.refresh();
    }
  }
  const problems = Object.entries(form.fields);
  return (
    <form onSubmit={submit} className="space-y-3" noValidate aria-label="Import prices from CSV">
      <p className="text-sm text-rind-600">
        Columns: <code>ingredient</code> (as named in the library), <code>valid_from</code> (YYYY-MM-DD), <code>pack_price</code> ({currency}),
        {' '}<code>pack_size</code>, <code>pack_unit</code> (g, kg or lb), and optionally <code>supplier</code> and <code>currency</code>.
      </p>
      {imported !== undefined ? <Notice tone="success">{imported} price{imported === 1 ? '' : 's'} imported.</Notice> : null}
      {form.error ? (
        <Notice tone="danger" title={form.error}>
          {problems.length ? (
            <ul className="mt-1 list-disc space-y-1 pl-5">
              {problems.slice(0, 50).map(([where, messages]) => <li key={where}><span className="font-medium">{where}:</span> {messages.join(' ')}</li>)}
              {problems.length > 50 ? <li>…and {problems.length - 50} more.</li> : null}
            </ul>
          ) : null}
        </Notice>
      ) : null}
      <label htmlFor="price-csv" className="block text-sm font-medium text-rind-700">CSV file</label>
      <input id="price-csv" type="file" accept=".csv,text/csv" onChange={pick} className="block w-full min-w-0 text-sm" />
      {fileName ? <p className="break-words text-xs text-rind-500">{fileName}</p> : null}
      <Button type="submit" tone="secondary" disabled={form.pending || csv === undefined}>{form.pending ? 'Importing…' : 'Import prices'}</Button>
    </form>
  );
}
