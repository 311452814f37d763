'use client';

import { Field } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { setRefuseAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';
import { FormNotices, usePriceForm } from './usePriceForm';

export function RefuseForm({ ingredientId, refusePct }: { ingredientId: string; refusePct: number }) {
  const { form, values, saved, change, submit } = usePriceForm(setRefuseAction, { refusePct: String(refusePct) },
    (v) => ({ ingredientId, refusePct: typedNumber(v.refusePct) }));
  return (
    <form onSubmit={submit} className="max-w-sm space-y-3" noValidate aria-label="Refuse and trim">
      <FormNotices saved={saved} savedText="Saved." error={form.fields.refusePct ? undefined : form.error} />
      <Field label="Refuse and trim (% of the bought mass)" name="refusePct" inputMode="decimal" value={values.refusePct}
        onChange={change('refusePct')} errors={form.fields.refusePct}
        hint="Stones, peel, stalks and hulls thrown away before weighing: 10 % means 1 kg weighed costs 1.11 kg bought." />
      <Button type="submit" tone="secondary" disabled={form.pending}>{form.pending ? 'Saving…' : 'Save refuse'}</Button>
    </form>
  );
}
