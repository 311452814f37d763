'use client';

import { useState } from 'react';
import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { updatePreferencesAction } from '@/lib/account/actions';
import { preferencesSchema } from '@/lib/account/schema';

export function PreferencesForm({ name, massUnits, temperatureUnit }: { name: string; massUnits: string; temperatureUnit: string }) {
  const form = useFormAction(updatePreferencesAction, { schema: preferencesSchema });
  const [values, setValues] = useState({ name, massUnits, temperatureUnit });
  const [saved, setSaved] = useState(false);
  const change = (key: keyof typeof values) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => {
    const next = { ...values, [key]: e.target.value };
    setValues(next);
    setSaved(false);
    form.revalidate(key, next);
  };
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setSaved(false);
    const data = new FormData();
    for (const [k, v] of Object.entries(values)) data.set(k, v);
    if ((await form.run(null, data))?.ok) setSaved(true);
  }
  return (
    <form onSubmit={submit} className="max-w-md space-y-4" noValidate>
      {saved ? <Notice tone="success">Saved.</Notice> : null}
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      <Field label="Your name" name="name" value={values.name} onChange={change('name')} required errors={form.fields.name} />
      <SelectField
        label="Mass units on screen"
        name="massUnits"
        value={values.massUnits}
        onChange={change('massUnits')}
        errors={form.fields.massUnits}
        options={[
          { value: 'metric', label: 'Metric (g, kg)' },
          { value: 'imperial', label: 'Imperial (oz, lb)' },
        ]}
      />
      <SelectField
        label="Temperatures"
        name="temperatureUnit"
        value={values.temperatureUnit}
        onChange={change('temperatureUnit')}
        errors={form.fields.temperatureUnit}
        options={[
          { value: 'C', label: 'Celsius (°C)' },
          { value: 'F', label: 'Fahrenheit (°F)' },
        ]}
      />
      <p className="text-xs text-rind-500">Setwell always stores grams and degrees Celsius; this only changes what you see and type.</p>
      <Button type="submit" disabled={form.pending}>{form.pending ? 'Saving…' : 'Save preferences'}</Button>
    </form>
  );
}
