'use client';

import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { addIngredientPriceAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';
import { FormNotices, PricedThingSelect, usePriceForm } from './usePriceForm';

/** Adds a dated price point; earlier points stay as they are. */
export function IngredientPriceForm({ currency, ingredients, fixedIngredientId, defaultUnit, today }: {
  currency: string;
  ingredients: { id: string; name: string }[];
  fixedIngredientId?: string;
  defaultUnit: 'kg' | 'lb';
  today: string;
}) {
  const empty = { ingredientId: fixedIngredientId ?? '', packPrice: '', packSize: '', packUnit: defaultUnit as string, supplier: '', validFrom: today };
  const { form, values, saved, change, submit } = usePriceForm(addIngredientPriceAction, empty,
    (v) => ({ ...v, packSize: typedNumber(v.packSize), supplier: v.supplier.trim() || null }),
    (v) => ({ ...empty, ingredientId: v.ingredientId, packUnit: v.packUnit }));
  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label="Add a price">
      <FormNotices saved={saved} savedText="Price added. Earlier prices are kept." error={form.error} />
      <PricedThingSelect fixed={!!fixedIngredientId} label="Ingredient" choose="Choose an ingredient…" name="ingredientId" value={values.ingredientId}
        onChange={change('ingredientId')} errors={form.fields.ingredientId} options={ingredients} />
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field label={`Price of one pack (${currency})`} name="packPrice" inputMode="decimal" autoComplete="off" value={values.packPrice} onChange={change('packPrice')} errors={form.fields.packPrice} placeholder="e.g. 24.50" />
        <div className="grid grid-cols-[minmax(0,1fr)_6rem] gap-2">
          <Field label="Pack size" name="packSize" inputMode="decimal" autoComplete="off" value={values.packSize} onChange={change('packSize')} errors={form.fields.packSize} placeholder="e.g. 25" />
          <SelectField label="Unit" name="packUnit" value={values.packUnit} onChange={change('packUnit')} errors={form.fields.packUnit}
            options={[{ value: 'g', label: 'g' }, { value: 'kg', label: 'kg' }, { value: 'lb', label: 'lb' }]} />
        </div>
        <Field label="Supplier (optional)" name="supplier" value={values.supplier} onChange={change('supplier')} errors={form.fields.supplier} />
        <Field label="Valid from" name="validFrom" type="date" value={values.validFrom} onChange={change('validFrom')} errors={form.fields.validFrom} hint="The price holds from this day until the next price’s day." />
      </div>
      <Button type="submit" disabled={form.pending}>{form.pending ? 'Adding…' : 'Add price'}</Button>
    </form>
  );
}
