'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { addIngredientPriceAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';

/** Adds a dated price point; earlier points stay as they are. */
export function IngredientPriceForm({ currency, ingredients, fixedIngredientId, defaultUnit, today }: {
  currency: string;
  ingredients: { id: string; name: string }[];
  fixedIngredientId?: string;
  defaultUnit: 'kg' | 'lb';
  today: string;
}) {
  const router = useRouter();
  const form = useFormAction(addIngredientPriceAction);
  const empty = { ingredientId: fixedIngredientId ?? '', packPrice: '', packSize: '', packUnit: defaultUnit as string, supplier: '', validFrom: today };
  const [values, setValues] = useState(empty);
  const [saved, setSaved] = useState(false);
  const change = (key: keyof typeof values) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => {
    setValues({ ...values, [key]: e.target.value });
    setSaved(false);
  };
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const result = await form.run({ ...values, packSize: typedNumber(values.packSize), supplier: values.supplier.trim() || null });
    if (result?.ok) {
      setSaved(true);
      setValues({ ...empty, ingredientId: values.ingredientId, packUnit: values.packUnit });
      router.refresh();
    }
  }
  return (
    <form onSubmit={submit} className="space-y-4" noValidate aria-label="Add a price">
      {saved ? <Notice tone="success">Price added. Earlier prices are kept.</Notice> : null}
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      {fixedIngredientId ? null : (
        <SelectField label="Ingredient" name="ingredientId" value={values.ingredientId} onChange={change('ingredientId')} errors={form.fields.ingredientId}
          options={[{ value: '', label: 'Choose an ingredient…' }, ...ingredients.map((i) => ({ value: i.id, label: i.name }))]} />
      )}
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
