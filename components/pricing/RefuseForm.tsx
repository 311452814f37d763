'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Field } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { setRefuseAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';

export function RefuseForm({ ingredientId, refusePct }: { ingredientId: string; refusePct: number }) {
  const router = useRouter();
  const form = useFormAction(setRefuseAction);
  const [value, setValue] = useState(String(refusePct));
  const [saved, setSaved] = useState(false);
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if ((await form.run({ ingredientId, refusePct: typedNumber(value) }))?.ok) {
      setSaved(true);
      router.refresh();
    }
  }
  return (
    <form onSubmit={submit} className="max-w-sm space-y-3" noValidate aria-label="Refuse and trim">
      {saved ? <Notice tone="success">Saved.</Notice> : null}
      {form.error && !form.fields.refusePct ? <Notice tone="danger">{form.error}</Notice> : null}
      <Field label="Refuse and trim (% of the bought mass)" name="refusePct" inputMode="decimal" value={value}
        onChange={(e) => { setValue(e.target.value); setSaved(false); }} errors={form.fields.refusePct}
        hint="Stones, peel, stalks and hulls thrown away before weighing: 10 % means 1 kg weighed costs 1.11 kg bought." />
      <Button type="submit" tone="secondary" disabled={form.pending}>{form.pending ? 'Saving…' : 'Save refuse'}</Button>
    </form>
  );
}
