'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Field, SelectField, FieldErrorText, inputClass } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { createTrialAction } from '@/lib/trials/actions';

type Base = { formulaId: string; name: string; latestRevision: number };

export function NewTrialForm({ bases, preselected }: { bases: Base[]; preselected?: string }) {
  const router = useRouter();
  const [formulaId, setFormulaId] = useState(preselected ?? bases[0]?.formulaId ?? '');
  const { pending: busy, error, fields, run, revalidate } = useFormAction(createTrialAction);
  const base = bases.find((b) => b.formulaId === formulaId);

  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const res = await run({
      title: String(form.get('title') ?? ''),
      question: String(form.get('question') ?? ''),
      formulaId,
      baseRevision: Number(form.get('baseRevision')),
    });
    if (res?.ok) {
      router.push(`/trials/${res.data.trialId}`);
      router.refresh();
    }
  }

  if (!bases.length) return <Notice tone="info">Save a formula first: a trial starts from one of its revisions.</Notice>;
  return (
    <form onSubmit={submit} className="max-w-2xl space-y-4" noValidate>
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <Field label="Title" name="title" required errors={fields.title} onChange={() => revalidate('title')} placeholder="e.g. Less sugar in the apricot spread" />
      <div>
        <label htmlFor="f-question" className="mb-1 block text-sm font-medium text-rind-700">Question or hypothesis</label>
        <textarea id="f-question" name="question" rows={3} required className={inputClass} aria-invalid={fields.question ? true : undefined} onChange={() => revalidate('question')}
          placeholder="e.g. Does cutting the sugar ratio from 1.0 to 0.8 keep a clean set if we add pectin?" />
        <FieldErrorText id="f-question-err" errors={fields.question} />
      </div>
      <div className="grid gap-4 sm:grid-cols-[1fr_10rem]">
        <SelectField label="Base formula" name="formulaId" value={formulaId} onChange={(e) => { setFormulaId(e.target.value); revalidate('formulaId'); }} errors={fields.formulaId}
          options={bases.map((b) => ({ value: b.formulaId, label: b.name }))} />
        <SelectField key={formulaId} label="Revision" name="baseRevision" defaultValue={String(base?.latestRevision ?? 1)} errors={fields.baseRevision}
          options={Array.from({ length: base?.latestRevision ?? 1 }, (_, i) => {
            const n = (base?.latestRevision ?? 1) - i;
            return { value: String(n), label: n === base?.latestRevision ? `${n} (latest)` : String(n) };
          })} />
      </div>
      <p className="text-sm text-rind-600">Variant A will be this revision as it is. You add the others with the plan helper or by hand.</p>
      <Button type="submit" disabled={busy}>{busy ? 'Starting…' : 'Start the trial'}</Button>
    </form>
  );
}
