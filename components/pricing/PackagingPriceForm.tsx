'use client';

import { Field } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { addPackagingPriceAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';
import { FormNotices, PricedThingSelect, usePriceForm } from './usePriceForm';

/** A dated price of a packaging item as bought: the price of a pack of so many pieces. */
export function PackagingPriceForm({ currency, items, fixedItemId, today }: { currency: string; items: { id: string; name: string }[]; fixedItemId?: string; today: string }) {
  const empty = { packagingItemId: fixedItemId ?? '', packPrice: '', piecesPerPack: '1', supplier: '', validFrom: today };
  const { form, values, saved, change, submit } = usePriceForm(addPackagingPriceAction, empty,
    (v) => ({ ...v, piecesPerPack: typedNumber(v.piecesPerPack), supplier: v.supplier.trim() || null }),
    (v) => ({ ...empty, packagingItemId: v.packagingItemId }));
  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label="Add a packaging price">
      <FormNotices saved={saved} savedText="Price added. Earlier prices are kept." error={form.error} />
      <PricedThingSelect fixed={!!fixedItemId} label="Packaging item" choose="Choose a packaging item…" name="packagingItemId" value={values.packagingItemId}
        onChange={change('packagingItemId')} errors={form.fields.packagingItemId} options={items} />
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field label={`Price of one pack (${currency})`} name="packPrice" inputMode="decimal" autoComplete="off" value={values.packPrice} onChange={change('packPrice')} errors={form.fields.packPrice} placeholder="e.g. 61.00" />
        <Field label="Pieces in the pack" name="piecesPerPack" inputMode="numeric" value={values.piecesPerPack} onChange={change('piecesPerPack')} errors={form.fields.piecesPerPack} hint="How many pieces the price buys: 12 for a tray of 12 jars, 1000 for a roll of 1000 labels." />
        <Field label="Supplier (optional)" name="supplier" value={values.supplier} onChange={change('supplier')} errors={form.fields.supplier} />
        <Field label="Valid from" name="validFrom" type="date" value={values.validFrom} onChange={change('validFrom')} errors={form.fields.validFrom} />
      </div>
      <Button type="submit" disabled={form.pending}>{form.pending ? 'Adding…' : 'Add packaging price'}</Button>
    </form>
  );
}
