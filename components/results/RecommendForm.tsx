'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { SelectField, FieldErrorText, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { recommendVariantAction } from '@/lib/results/actions';

export function RecommendForm({ trialId, variants, current }: { trialId: string; variants: Array<{ id: string; label: string; description: string }>; current: { variantId: string; rationale: string } | null }) {
  const router = useRouter();
  const { pending: busy, error, fields, run, revalidate } = useFormAction(recommendVariantAction, { fieldPrefix: 'recommendation' });
  const [saved, setSaved] = useState(false);
  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    setSaved(false);
    const res = await run(trialId, { variantId: f.get('variantId'), rationale: f.get('rationale') });
    if (res?.ok) {
      setSaved(true);
      router.refresh();
    }
  }
  return (
    <form onSubmit={submit} className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Recommend a variant" noValidate>
      <h2 className="text-lg font-semibold">Recommend a variant</h2>
      <SelectField label="Variant" name="variantId" defaultValue={current?.variantId ?? variants[0]?.id} errors={fields.variantId} onChange={() => revalidate('variantId')} options={variants.map((v) => ({ value: v.id, label: `${v.label} — ${v.description}` }))} />
      <div>
        <label htmlFor="f-rationale" className="mb-1 block text-sm font-medium text-rind-700">Why</label>
        <textarea id="f-rationale" name="rationale" rows={3} defaultValue={current?.rationale} className={inputClass} aria-invalid={fields.rationale ? true : undefined} onChange={() => revalidate('rationale')} />
        <FieldErrorText id="f-rationale-err" errors={fields.rationale} />
      </div>
      {saved ? <Notice tone="success">Recommendation saved.</Notice> : null}
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <Button type="submit" disabled={busy}>{busy ? 'Saving…' : current ? 'Change the recommendation' : 'Recommend'}</Button>
    </form>
  );
}
