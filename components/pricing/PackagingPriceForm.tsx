'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { addPackagingPriceAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';

/** A dated price of a packaging item as bought: the price of a pack of so many pieces. */
export function PackagingPriceForm({ currency, items, fixedItemId, today }: { currency: string; items: { id: string; name: string }[]; fixedItemId?: string; today: string }) {
  const router = useRouter();
  const form = useFormAction(addPackagingPriceAction);
  const empty = { packagingItemId: fixedItemId ?? '', packPrice: '', piecesPerPack: '1', supplier: '', validFrom: today };
  const [values, setValues] = useState(empty);
  const [saved, setSaved] = useState(false);
  const change = (key: keyof typeof values) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => {
    setValues({ ...values, [key]: e.target.value });
    setSaved(false);
  };
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const result = await form.run({ ...values, piecesPerPack: typedNumber(values.piecesPerPack), supplier: values.supplier.trim() || null });
    if (result?.ok) {
      setSaved(true);
      setValues({ ...empty, packagingItemId: values.packagingItemId });
      router.refresh();
    }
  }
  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label="Add a packaging price">
      {saved ? <Notice tone="success">Price added. Earlier prices are kept.</Notice> : null}
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      {fixedItemId ? null : (
        <SelectField label="Packaging item" name="packagingItemId" value={values.packagingItemId} onChange={change('packagingItemId')} errors={form.fields.packagingItemId}
          options={[{ value: '', label: 'Choose a packaging item…' }, ...items.map((i) => ({ value: i.id, label: i.name }))]} />
      )}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field label={`Price of one pack (${currency})`} name="packPrice" inputMode="decimal" autoComplete="off" value={values.packPrice} onChange={change('packPrice')} errors={form.fields.packPrice} placeholder="e.g. 61.00" />
        <Field label="Pieces in the pack" name="piecesPerPack" inputMode="numeric" value={values.piecesPerPack} onChange={change('piecesPerPack')} errors={form.fields.piecesPerPack} hint="Labels by the thousand: 1000." />
        <Field label="Supplier (optional)" name="supplier" value={values.supplier} onChange={change('supplier')} errors={form.fields.supplier} />
        <Field label="Valid from" name="validFrom" type="date" value={values.validFrom} onChange={change('validFrom')} errors={form.fields.validFrom} />
      </div>
      <Button type="submit" disabled={form.pending}>{form.pending ? 'Adding…' : 'Add packaging price'}</Button>
    </form>
  );
}
