'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { fahrenheitToCelsius, toGrams, type UnitPreference } from '@/lib/chemistry';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { Field, SelectField, inputClass } from '@/components/ui/Field';
import { SET_TEST_METHODS, SET_TEST_METHOD_LABELS, SET_TEST_SCALE, SYNERESIS_LABELS, SYNERESIS_LEVELS } from '@/lib/trials/vocabulary';
import { recordMeasurementAction } from '@/lib/trials/actions';
import { todayIso } from '@/lib/format/dates';

/** Readings are entered in the person's units and stored in grams and °C; the refractometer reading is stored as read. */
export function RecordCookForm({ trialId, variantId, massUnits, temperatureUnit }: { trialId: string; variantId: string; massUnits: UnitPreference; temperatureUnit: 'C' | 'F' }) {
  const router = useRouter();
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string }>();
  const [busy, setBusy] = useState(false);
  const massUnit = massUnits === 'imperial' ? 'lb' : 'g';
  const tUnit = `°${temperatureUnit}`;

  function number(form: FormData, name: string): number | null | typeof NaN {
    const raw = String(form.get(name) ?? '').trim().replace(',', '.');
    if (raw === '') return null;
    return Number(raw);
  }

  async function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    const form = new FormData(formEl);
    const local: Record<string, string[]> = {};
    const read = (name: string) => {
      const v = number(form, name);
      if (v !== null && Number.isNaN(v)) local[name] = ['Enter a number.'];
      return v === null || Number.isNaN(v) ? null : v;
    };
    const mass = (name: string) => {
      const v = read(name);
      return v === null ? null : toGrams(v, massUnit);
    };
    const temp = (name: string) => {
      const v = read(name);
      return v === null ? null : temperatureUnit === 'F' ? fahrenheitToCelsius(v) : v;
    };
    const input = {
      variantId,
      cookDate: String(form.get('cookDate') ?? ''),
      batchSizeG: mass('batchSizeG'),
      brixReading: read('brixReading'),
      brixSampleTempC: temp('brixSampleTempC'),
      ph: read('ph'),
      endPointTempC: temp('endPointTempC'),
      boilTimeMin: read('boilTimeMin'),
      setTestScore: read('setTestScore'),
      setTestMethod: (form.get('setTestMethod') as string) || null,
      syneresis: (form.get('syneresis') as string) || null,
      colourNotes: String(form.get('colourNotes') ?? '') || null,
      yieldJars: read('yieldJars'),
      yieldG: mass('yieldG'),
      notes: String(form.get('notes') ?? '') || null,
    };
    if (Object.keys(local).length) return setFields(local);
    setBusy(true);
    setFields({});
    setMessage(undefined);
    const res = await recordMeasurementAction(trialId, input);
    setBusy(false);
    if (res.ok) {
      formEl.reset();
      setMessage({ tone: 'success', text: 'Cook recorded.' });
      router.refresh();
    } else {
      const stripped = Object.fromEntries(Object.entries(res.fields ?? {}).map(([k, v]) => [k.replace(/^cook\./, ''), v]));
      setFields(stripped);
      setMessage({ tone: 'danger', text: res.error });
    }
  }

  return (
    <form onSubmit={submit} className="space-y-4 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" noValidate aria-label="Record a cook">
      <h2 className="text-lg font-semibold">Record a cook</h2>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Field label="Cook date" name="cookDate" type="date" required defaultValue={todayIso()} errors={fields.cookDate} />
        <Field label={`Batch size, total charge (${massUnit})`} name="batchSizeG" inputMode="decimal" errors={fields.batchSizeG} />
        <Field label="Boil time (min)" name="boilTimeMin" inputMode="decimal" errors={fields.boilTimeMin} />
        <Field label="Refractometer reading (°Brix, as read)" name="brixReading" inputMode="decimal" errors={fields.brixReading} />
        <Field label={`Sample temperature (${tUnit})`} name="brixSampleTempC" inputMode="decimal" errors={fields.brixSampleTempC} hint="Corrected to 20 °C on display" />
        <Field label="pH" name="ph" inputMode="decimal" errors={fields.ph} />
        <Field label={`End-point temperature (${tUnit})`} name="endPointTempC" inputMode="decimal" errors={fields.endPointTempC} />
        <Field label="Jars filled" name="yieldJars" inputMode="numeric" errors={fields.yieldJars} />
        <Field label={`Yield (${massUnit})`} name="yieldG" inputMode="decimal" errors={fields.yieldG} />
      </div>
      <fieldset>
        <legend className="text-sm font-medium text-rind-700">Set test</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-5">
          {SET_TEST_SCALE.map((s) => (
            <label key={s.value} className="flex min-h-10 cursor-pointer items-start gap-2 rounded-lg bg-white p-2 text-sm ring-1 ring-pith-300">
              <input type="radio" name="setTestScore" value={s.value} className="mt-1" />
              <span><span className="font-medium">{s.value} · {s.label}</span><span className="block text-xs text-rind-500">{s.hint}</span></span>
            </label>
          ))}
        </div>
        {fields.setTestScore ? <p className="mt-1 text-sm text-ember-700">{fields.setTestScore.join(' ')}</p> : null}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField label="Set test method" name="setTestMethod" options={[{ value: '', label: '—' }, ...SET_TEST_METHODS.map((m) => ({ value: m, label: SET_TEST_METHOD_LABELS[m] }))]} errors={fields.setTestMethod} />
        <SelectField label="Syneresis (weeping)" name="syneresis" options={[{ value: '', label: '—' }, ...SYNERESIS_LEVELS.map((m) => ({ value: m, label: SYNERESIS_LABELS[m] }))]} errors={fields.syneresis} />
      </div>
      <Field label="Colour notes" name="colourNotes" errors={fields.colourNotes} />
      <div>
        <label htmlFor="f-notes" className="mb-1 block text-sm font-medium text-rind-700">Notes</label>
        <textarea id="f-notes" name="notes" rows={2} className={inputClass} />
      </div>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <Button type="submit" disabled={busy}>{busy ? 'Saving…' : 'Save the cook'}</Button>
    </form>
  );
}
