'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { savePackagingItemAction } from '@/lib/pricing/actions';
import { PACKAGING_KINDS, PACKAGING_KIND_LABELS } from '@/lib/pricing/vocabulary';

export function PackagingItemForm() {
  const router = useRouter();
  const form = useFormAction(savePackagingItemAction, { fieldPrefix: 'data' });
  const [values, setValues] = useState({ name: '', kind: 'jar' });
  const [saved, setSaved] = useState(false);
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if ((await form.run(null, values))?.ok) {
      setSaved(true);
      setValues({ name: '', kind: values.kind });
      router.refresh();
    }
  }
  return (
    <form onSubmit={submit} className="space-y-3" noValidate aria-label="Add a packaging item">
      {saved ? <Notice tone="success">Packaging item added.</Notice> : null}
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field label="Name" name="name" value={values.name} onChange={(e) => { setValues({ ...values, name: e.target.value }); setSaved(false); }} errors={form.fields.name} placeholder="e.g. Twist-off lid 63 mm" />
        <SelectField label="Kind" name="kind" value={values.kind} onChange={(e) => setValues({ ...values, kind: e.target.value })} errors={form.fields.kind}
          options={PACKAGING_KINDS.map((k) => ({ value: k, label: PACKAGING_KIND_LABELS[k] }))} />
      </div>
      <Button type="submit" tone="secondary" disabled={form.pending}>{form.pending ? 'Adding…' : 'Add packaging item'}</Button>
    </form>
  );
}
