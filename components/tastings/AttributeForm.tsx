'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useFormAction } from '@/components/ui/useFormAction';
import { createAttributeAction } from '@/lib/tastings/actions';
import { Button } from '@/components/ui/Button';
import { Field, SelectField } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';

export function AttributeForm() {
  const router = useRouter();
  const [scale, setScale] = useState('intensity');
  const add = useFormAction(createAttributeAction);
  const { fields, pending: busy } = add;
  const [added, setAdded] = useState(false);
  const message = add.error ? { tone: 'danger' as const, text: add.error } : added ? { tone: 'success' as const, text: 'Added to the library.' } : undefined;
  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    const f = new FormData(formEl);
    setAdded(false);
    const result = await add.run({
      name: f.get('name'), instruction: f.get('instruction'), scale,
      ...(scale === 'intensity' ? { lowAnchor: f.get('lowAnchor'), highAnchor: f.get('highAnchor') } : {}),
    });
    if (!result?.ok) return;
    formEl.reset();
    setAdded(true);
    router.refresh();
  }
  return (
    <form onSubmit={submit} className="max-w-2xl space-y-4 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" noValidate aria-label="Add an attribute">
      <h2 className="text-lg font-semibold">Add an attribute of your own</h2>
      <Field label="Name" name="name" required errors={fields.name} placeholder="e.g. Peel chewiness" />
      <Field label="Instruction to the taster" name="instruction" required errors={fields.instruction} placeholder="e.g. Chew a piece of peel five times; how much does it resist?" />
      <SelectField label="Scale" name="scale" value={scale} onChange={(e) => setScale(e.target.value)} errors={fields.scale} options={[
        { value: 'intensity', label: 'Intensity line, 0–10' },
        { value: 'hedonic', label: '9-point hedonic (liking)' },
        { value: 'jar', label: '5-point just-about-right' },
      ]} />
      {scale === 'intensity' ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <Field label="Word at 0" name="lowAnchor" errors={fields.lowAnchor} placeholder="e.g. Tender" />
          <Field label="Word at 10" name="highAnchor" errors={fields.highAnchor} placeholder="e.g. Very chewy" />
        </div>
      ) : null}
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <Button type="submit" disabled={busy}>{busy ? 'Adding…' : 'Add attribute'}</Button>
    </form>
  );
}
