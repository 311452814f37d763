'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { SelectField, FieldErrorText, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { recommendVariantAction } from '@/lib/results/actions';

export function RecommendForm({ trialId, variants, current }: { trialId: string; variants: Array<{ id: string; label: string; description: string }>; current: { variantId: string; rationale: string } | null }) {
  const router = useRouter();
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string }>();
  const [busy, setBusy] = useState(false);
  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const f = new FormData(e.currentTarget);
    setBusy(true);
    setFields({});
    setMessage(undefined);
    const res = await recommendVariantAction(trialId, { variantId: f.get('variantId'), rationale: f.get('rationale') });
    setBusy(false);
    if (res.ok) {
      setMessage({ tone: 'success', text: 'Recommendation saved.' });
      router.refresh();
    } else {
      setFields(Object.fromEntries(Object.entries(res.fields ?? {}).map(([k, v]) => [k.replace(/^recommendation\./, ''), v])));
      setMessage({ tone: 'danger', text: res.error });
    }
  }
  return (
    <form onSubmit={submit} className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Recommend a variant" noValidate>
      <h2 className="text-lg font-semibold">Recommend a variant</h2>
      <SelectField label="Variant" name="variantId" defaultValue={current?.variantId ?? variants[0]?.id} errors={fields.variantId} options={variants.map((v) => ({ value: v.id, label: `${v.label} — ${v.description}` }))} />
      <div>
        <label htmlFor="f-rationale" className="mb-1 block text-sm font-medium text-rind-700">Why</label>
        <textarea id="f-rationale" name="rationale" rows={3} defaultValue={current?.rationale} className={inputClass} aria-invalid={fields.rationale ? true : undefined} />
        <FieldErrorText id="f-rationale-err" errors={fields.rationale} />
      </div>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <Button type="submit" disabled={busy}>{busy ? 'Saving…' : current ? 'Change the recommendation' : 'Recommend'}</Button>
    </form>
  );
}
