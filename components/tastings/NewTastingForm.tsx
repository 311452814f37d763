'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useFormAction, type FormActionResult } from '@/components/ui/useFormAction';
import { createTastingAction, updateTastingAction } from '@/lib/tastings/actions';
import { Button } from '@/components/ui/Button';
import { Field, FieldErrorText, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { scaleNote } from '@/lib/sensory/scales';
import { TASTING_METHODS, TASTING_METHOD_LABELS, type TastingMethod } from '@/lib/tastings/vocabulary';

const DEFAULT_NOTICE =
  'These samples are fruit preserves made in our development kitchen. They contain fruit and sugar and may contain traces of nuts, gluten (crackers) and sulphites. Do not taste if you have an allergy or intolerance to any of these. Taking part is voluntary; your answers are stored under the name you give and used only to improve our products. You may stop at any time.';

export interface TastingSetup {
  id: string;
  title: string;
  place: string | null;
  startsAt: string | null;
  method: TastingMethod;
  variantIds: string[];
  attributeIds: string[];
  rankingAttributeId: string | null;
  notice: string;
}

/** A datetime-local value in the browser's own time zone. */
function localInput(iso: string | null): string | undefined {
  if (!iso) return undefined;
  const d = new Date(iso);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Sets up a tasting; with `editing`, changes the set-up of one that has not opened yet. */
export function NewTastingForm({ trialId, variants, attributes, suggestedAttributeIds, editing }: {
  trialId: string; variants: Array<{ id: string; label: string; description: string }>; attributes: Array<{ id: string; name: string; scaleName: string }>;
  suggestedAttributeIds: string[]; editing?: TastingSetup;
}) {
  const router = useRouter();
  const [method, setMethod] = useState<TastingMethod>(editing?.method ?? 'rated');
  const [chosen, setChosen] = useState<string[]>(editing?.variantIds ?? variants.slice(0, 4).map((v) => v.id));
  const [attrs, setAttrs] = useState<string[]>(editing ? editing.attributeIds : suggestedAttributeIds);
  const save = useFormAction(
    async (input: unknown): Promise<FormActionResult<{ tastingId?: string }>> => (editing ? updateTastingAction(editing.id, input).then((r) => (r.ok ? { ...r, data: {} } : r)) : createTastingAction(trialId, input)),
    { fieldPrefix: 'tasting' },
  );
  const { fields, error, pending: busy } = save;
  const toggle = (list: string[], id: string) => (list.includes(id) ? list.filter((x) => x !== id) : [...list, id]);

  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const startsAt = String(form.get('startsAt') ?? '');
    const result = await save.run({
      title: form.get('title'),
      place: String(form.get('place') ?? '') || undefined,
      startsAt: startsAt ? new Date(startsAt).toISOString() : undefined,
      method,
      variantIds: chosen,
      attributeIds: method === 'rated' ? attrs : [],
      rankingAttributeId: method === 'ranking' ? String(form.get('rankingAttributeId') ?? '') || undefined : undefined,
      notice: form.get('notice'),
    });
    if (!result?.ok) return;
    router.push(`/tastings/${editing?.id ?? result.data.tastingId}`);
    router.refresh();
  }

  return (
    <form onSubmit={submit} className="max-w-3xl space-y-5" noValidate>
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <Field label="Title tasters see" name="title" required defaultValue={editing?.title} errors={fields.title} hint="Never a variant or recipe name: tasters must not learn what they taste." placeholder="e.g. Thursday tasting" />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field label="Place" name="place" defaultValue={editing?.place ?? undefined} errors={fields.place} placeholder="e.g. Tasting room" />
        <Field label="Date and time" name="startsAt" type="datetime-local" defaultValue={localInput(editing?.startsAt ?? null)} errors={fields.startsAt} />
      </div>
      <fieldset>
        <legend className="text-sm font-medium text-rind-700">Method</legend>
        <div className="mt-2 flex flex-wrap gap-4 text-sm">
          {TASTING_METHODS.map((m) => (
            <label key={m} className="flex min-h-10 items-center gap-2">
              <input type="radio" name="method" checked={method === m} onChange={() => setMethod(m)} /> {TASTING_METHOD_LABELS[m]}
            </label>
          ))}
        </div>
      </fieldset>
      <fieldset>
        <legend className="text-sm font-medium text-rind-700">Samples {method === 'triangle' ? '(exactly two)' : '(two or more)'}</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-2">
          {variants.map((v) => (
            <label key={v.id} className="flex min-h-10 items-start gap-2 rounded-lg bg-white p-2 text-sm ring-1 ring-pith-300">
              <input type="checkbox" className="mt-1" checked={chosen.includes(v.id)} onChange={() => setChosen(toggle(chosen, v.id))} />
              <span><strong>{v.label}</strong> — {v.description}</span>
            </label>
          ))}
        </div>
        <FieldErrorText id="variantIds-err" errors={fields.variantIds} />
      </fieldset>
      {method === 'rated' ? (
        <fieldset>
          <legend className="text-sm font-medium text-rind-700">Attributes to rate</legend>
          <p className="text-xs text-rind-500">Ticked: overall liking and fruit flavour, and what the trial’s factors change. Add others if the question needs them.</p>
          <div className="mt-2 grid gap-2 sm:grid-cols-2">
            {attributes.map((a) => (
              <label key={a.id} className="flex min-h-10 items-center gap-2 text-sm">
                <input type="checkbox" checked={attrs.includes(a.id)} onChange={() => setAttrs(toggle(attrs, a.id))} /> {a.name}{scaleNote(a.name, a.scaleName) ? <span className="text-xs text-rind-500"> ({a.scaleName})</span> : null}
              </label>
            ))}
          </div>
          <FieldErrorText id="attributeIds-err" errors={fields.attributeIds} />
        </fieldset>
      ) : null}
      {method === 'ranking' ? (
        <label className="block text-sm">
          <span className="mb-1 block font-medium text-rind-700">Rank by</span>
          <select name="rankingAttributeId" defaultValue={editing?.rankingAttributeId ?? ''} className={inputClass}>
            <option value="">Preference (which they like most)</option>
            {attributes.map((a) => <option key={a.id} value={a.id}>{a.name}</option>)}
          </select>
        </label>
      ) : null}
      <div>
        <label htmlFor="f-notice" className="mb-1 block text-sm font-medium text-rind-700">Allergen and consent notice</label>
        <textarea id="f-notice" name="notice" rows={5} defaultValue={editing?.notice ?? DEFAULT_NOTICE} className={inputClass} />
        <FieldErrorText id="notice-err" errors={fields.notice} />
        <p className="mt-1 text-xs text-rind-500">Tasters read and accept this before the first sample. Check it against what is really in the samples; local rules on allergen information govern.</p>
      </div>
      <Button type="submit" disabled={busy}>{busy ? 'Saving…' : editing ? 'Save the changes' : 'Create the tasting'}</Button>
    </form>
  );
}
