'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { savePackFormatAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';

type Row = { key: number; packagingItemId: string; pieces: string; perJars: string };

/** A container with its net fill and the packaging of one jar: "1 per 1 jar" for a lid, "1 per 12 jars" for a case. */
export function PackFormatForm({ items, format }: { items: { id: string; name: string }[]; format?: { id: string; name: string; netFillG: number; items: { packagingItemId: string; pieces: number; perJars: number }[] } }) {
  const router = useRouter();
  const form = useFormAction(savePackFormatAction, { fieldPrefix: 'data' });
  const [name, setName] = useState(format?.name ?? '');
  const [netFill, setNetFill] = useState(format ? String(format.netFillG) : '');
  const [rows, setRows] = useState<Row[]>(format ? format.items.map((i, key) => ({ key, packagingItemId: i.packagingItemId, pieces: String(i.pieces), perJars: String(i.perJars) })) : []);
  const [nextKey, setNextKey] = useState(rows.length);
  const [saved, setSaved] = useState(false);
  const update = (key: number, patch: Partial<Row>) => setRows(rows.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const data = { name, netFillG: typedNumber(netFill), items: rows.map((r) => ({ packagingItemId: r.packagingItemId, pieces: typedNumber(r.pieces), perJars: typedNumber(r.perJars) })) };
    if ((await form.run(format?.id ?? null, data))?.ok) {
      setSaved(true);
      if (!format) {
        setName('');
        setNetFill('');
        setRows([]);
      }
      router.refresh();
    }
  }
  const prefix = format ? `pf-${format.id}` : 'pf-new';
  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label={format ? `Edit ${format.name}` : 'Add a pack format'}>
      {saved ? <Notice tone="success">Pack format saved.</Notice> : null}
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field id={`${prefix}-name`} label="Name" name="name" value={name} onChange={(e) => { setName(e.target.value); setSaved(false); }} errors={form.fields.name} placeholder="e.g. 340 g jar, case of 12" />
        <Field id={`${prefix}-fill`} label="Net fill per jar (g)" name="netFillG" inputMode="decimal" value={netFill} onChange={(e) => { setNetFill(e.target.value); setSaved(false); }} errors={form.fields.netFillG} />
      </div>
      <fieldset className="space-y-3">
        <legend className="text-sm font-medium text-rind-700">Packaging of one jar</legend>
        {rows.length === 0 ? <p className="text-sm text-rind-500">No packaging yet: add the jar, its lid, the label and the case share.</p> : null}
        {rows.map((r, index) => (
          <div key={r.key} className="grid grid-cols-1 items-end gap-2 rounded-lg p-2 ring-1 ring-pith-300 sm:grid-cols-[minmax(0,1fr)_5rem_6rem_auto]">
            <SelectField id={`${prefix}-item-${r.key}`} label="Packaging item" name={`items.${index}.packagingItemId`} value={r.packagingItemId} onChange={(e) => update(r.key, { packagingItemId: e.target.value })}
              errors={form.fields[`items.${index}.packagingItemId`]} options={[{ value: '', label: 'Choose…' }, ...items.map((i) => ({ value: i.id, label: i.name }))]} />
            <Field id={`${prefix}-pieces-${r.key}`} label="Pieces" name={`items.${index}.pieces`} inputMode="numeric" value={r.pieces} onChange={(e) => update(r.key, { pieces: e.target.value })} errors={form.fields[`items.${index}.pieces`]} />
            <Field id={`${prefix}-jars-${r.key}`} label="Per jars" name={`items.${index}.perJars`} inputMode="numeric" value={r.perJars} onChange={(e) => update(r.key, { perJars: e.target.value })} errors={form.fields[`items.${index}.perJars`]} />
            <Button type="button" tone="ghost" onClick={() => setRows(rows.filter((x) => x.key !== r.key))} aria-label={`Remove packaging line ${index + 1}`}>Remove</Button>
          </div>
        ))}
        {form.fields.items ? <p className="text-sm text-ember-700" role="alert">{form.fields.items.join(' ')}</p> : null}
        <Button type="button" tone="secondary" onClick={() => { setRows([...rows, { key: nextKey, packagingItemId: '', pieces: '1', perJars: '1' }]); setNextKey(nextKey + 1); }} disabled={items.length === 0}>
          Add packaging line
        </Button>
      </fieldset>
      <Button type="submit" disabled={form.pending}>{form.pending ? 'Saving…' : format ? 'Save pack format' : 'Add pack format'}</Button>
    </form>
  );
}
