'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { celsiusToFahrenheit, fahrenheitToCelsius, fromGrams, toGrams, type UnitPreference } from '@/lib/chemistry';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { Field, SelectField, inputClass } from '@/components/ui/Field';
import { SET_TEST_METHODS, SET_TEST_METHOD_LABELS, SET_TEST_SCALE, SYNERESIS_LABELS, SYNERESIS_LEVELS } from '@/lib/trials/vocabulary';
import { correctCookAction, recordCookAction } from '@/lib/trials/actions';
import { cookReadingProblems, type CookView } from '@/lib/trials/schema';
import { todayIso } from '@/lib/format/dates';
import { readDecimal } from '@/lib/format/numbers';

const round = (n: number, places: number) => String(Number(n.toFixed(places)));

/**
 * Readings are entered in the person's units and stored in grams and °C; the refractometer reading is
 * stored as read. With `cook` the form corrects that cook: it starts from the stored values and asks why.
 */
export function RecordCookForm({ trialId, variantId, massUnits, temperatureUnit, cook, onDone }: {
  trialId: string; variantId: string; massUnits: UnitPreference; temperatureUnit: 'C' | 'F'; cook?: CookView; onDone?: () => void;
}) {
  const router = useRouter();
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string }>();
  const [busy, setBusy] = useState(false);
  const massUnit = massUnits === 'imperial' ? 'lb' : 'g';
  const tUnit = `°${temperatureUnit}`;
  const initialMass = (g: number | null | undefined) => (g == null ? undefined : round(fromGrams(g, massUnit), massUnit === 'g' ? 1 : 3));
  const initialTemp = (c: number | null | undefined) => (c == null ? undefined : round(temperatureUnit === 'F' ? celsiusToFahrenheit(c) : c, 1));
  const initialNum = (n: number | null | undefined) => (n == null ? undefined : String(n));
  const formId = cook ? `cook-${cook.id}` : 'cook-new';

  function number(form: FormData, name: string): number | null {
    return readDecimal(String(form.get(name) ?? ''));
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
    const readings = {
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
    const reason = String(form.get('reason') ?? '').trim();
    if (cook && !reason) local.reason = ['Say why the cook is corrected (it is kept with its history).'];
    for (const p of cookReadingProblems(readings)) if (!local[p.path]) local[p.path] = [p.message];
    if (Object.keys(local).length) {
      setMessage(undefined);
      return setFields(local);
    }
    setBusy(true);
    setFields({});
    setMessage(undefined);
    const res = cook ? await correctCookAction(trialId, cook.id, { ...readings, reason }) : await recordCookAction(trialId, { variantId, ...readings });
    setBusy(false);
    if (res.ok) {
      if (!cook) formEl.reset();
      setMessage({ tone: 'success', text: cook ? 'Correction saved; the old values stay in the cook’s history.' : 'Cook recorded.' });
      router.refresh();
      onDone?.();
    } else {
      const stripped = Object.fromEntries(Object.entries(res.fields ?? {}).map(([k, v]) => [k.replace(/^(cook|change)\./, ''), v]));
      setFields(stripped);
      setMessage({ tone: 'danger', text: res.error });
    }
  }

  const id = (name: string) => `${formId}-${name}`;

  const title = cook ? 'Correct this cook' : 'Record a cook';
  return (
    <form onSubmit={submit} className="space-y-4 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" noValidate aria-label={title}>
      <h2 className="text-lg font-semibold">{title}</h2>
      <p className="text-sm text-rind-600">A cook needs at least one reading: refractometer, pH, end point, boil time, set test, syneresis, yield or colour.</p>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Field id={id('cookDate')} label="Cook date" name="cookDate" type="date" required defaultValue={cook?.cookDate ?? todayIso()} errors={fields.cookDate} />
        <Field id={id('batchSizeG')} label={`Batch size, total charge (${massUnit})`} name="batchSizeG" inputMode="decimal" defaultValue={initialMass(cook?.batchSizeG)} errors={fields.batchSizeG} />
        <Field id={id('boilTimeMin')} label="Boil time (min)" name="boilTimeMin" inputMode="decimal" defaultValue={initialNum(cook?.boilTimeMin)} errors={fields.boilTimeMin} />
        <Field id={id('brixReading')} label="Refractometer reading (°Brix, as read)" name="brixReading" inputMode="decimal" defaultValue={initialNum(cook?.brixReading)} errors={fields.brixReading} />
        <Field id={id('brixSampleTempC')} label={`Sample temperature (${tUnit})`} name="brixSampleTempC" inputMode="decimal" defaultValue={initialTemp(cook?.brixSampleTempC)} errors={fields.brixSampleTempC} hint="Corrected to 20 °C on display" />
        <Field id={id('ph')} label="pH" name="ph" inputMode="decimal" defaultValue={initialNum(cook?.ph)} errors={fields.ph} />
        <Field id={id('endPointTempC')} label={`End-point temperature (${tUnit})`} name="endPointTempC" inputMode="decimal" defaultValue={initialTemp(cook?.endPointTempC)} errors={fields.endPointTempC} />
        <Field id={id('yieldJars')} label="Jars filled" name="yieldJars" inputMode="numeric" defaultValue={initialNum(cook?.yieldJars)} errors={fields.yieldJars} />
        <Field id={id('yieldG')} label={`Yield (${massUnit})`} name="yieldG" inputMode="decimal" defaultValue={initialMass(cook?.yieldG)} errors={fields.yieldG} />
      </div>
      <fieldset>
        <legend className="text-sm font-medium text-rind-700">Set test</legend>
        <div className="mt-2 grid gap-2 sm:grid-cols-5">
          {SET_TEST_SCALE.map((s) => (
            <label key={s.value} className="flex min-h-10 cursor-pointer items-start gap-2 rounded-lg bg-white p-2 text-sm ring-1 ring-pith-300">
              <input type="radio" name="setTestScore" value={s.value} defaultChecked={cook?.setTestScore === s.value} className="mt-1" />
              <span><span className="font-medium">{s.value} · {s.label}</span><span className="block text-xs text-rind-500">{s.hint}</span></span>
            </label>
          ))}
        </div>
        {fields.setTestScore ? <p className="mt-1 text-sm text-ember-700">{fields.setTestScore.join(' ')}</p> : null}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField id={id('setTestMethod')} label="Set test method" name="setTestMethod" defaultValue={cook?.setTestMethod ?? ''} options={[{ value: '', label: '—' }, ...SET_TEST_METHODS.map((m) => ({ value: m, label: SET_TEST_METHOD_LABELS[m] }))]} errors={fields.setTestMethod} />
        <SelectField id={id('syneresis')} label="Syneresis (weeping)" name="syneresis" defaultValue={cook?.syneresis ?? ''} options={[{ value: '', label: '—' }, ...SYNERESIS_LEVELS.map((m) => ({ value: m, label: SYNERESIS_LABELS[m] }))]} errors={fields.syneresis} />
      </div>
      <Field id={id('colourNotes')} label="Colour notes" name="colourNotes" defaultValue={cook?.colourNotes ?? undefined} errors={fields.colourNotes} />
      <div>
        <label htmlFor={id('notes')} className="mb-1 block text-sm font-medium text-rind-700">Notes</label>
        <textarea id={id('notes')} name="notes" rows={2} defaultValue={cook?.notes ?? undefined} className={inputClass} />
      </div>
      {cook ? (
        <div>
          <label htmlFor={id('reason')} className="mb-1 block text-sm font-medium text-rind-700">Why is it corrected?</label>
          <textarea id={id('reason')} name="reason" rows={2} required aria-invalid={fields.reason ? true : undefined} aria-describedby={fields.reason ? `${id('reason')}-err` : undefined} className={inputClass} />
          {fields.reason ? <p id={`${id('reason')}-err`} role="alert" className="mt-1 text-sm text-ember-700">{fields.reason.join(' ')}</p> : null}
        </div>
      ) : null}
      {fields.readings && fields.readings.join(' ') !== message?.text ? <Notice tone="danger">{fields.readings.join(' ')}</Notice> : null}
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={busy}>{busy ? 'Saving…' : cook ? 'Save the correction' : 'Save the cook'}</Button>
        {cook && onDone ? <Button type="button" tone="secondary" onClick={onDone} disabled={busy}>Cancel</Button> : null}
      </div>
    </form>
  );
}
