'use client';

import { useActionState } from 'react';
import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { updatePreferencesAction } from '@/lib/account/actions';

export function PreferencesForm({ name, massUnits, temperatureUnit }: { name: string; massUnits: string; temperatureUnit: string }) {
  const [state, action, pending] = useActionState(updatePreferencesAction, null);
  const fields = state && !state.ok ? state.fields : undefined;
  return (
    <form action={action} className="max-w-md space-y-4" noValidate>
      {state?.ok ? <Notice tone="success">Saved.</Notice> : null}
      {state && !state.ok && !fields ? <Notice tone="danger">{state.error}</Notice> : null}
      <Field label="Your name" name="name" defaultValue={name} required errors={fields?.name} />
      <SelectField
        label="Mass units on screen"
        name="massUnits"
        defaultValue={massUnits}
        errors={fields?.massUnits}
        options={[
          { value: 'metric', label: 'Metric (g, kg)' },
          { value: 'imperial', label: 'Imperial (oz, lb)' },
        ]}
      />
      <SelectField
        label="Temperatures"
        name="temperatureUnit"
        defaultValue={temperatureUnit}
        errors={fields?.temperatureUnit}
        options={[
          { value: 'C', label: 'Celsius (°C)' },
          { value: 'F', label: 'Fahrenheit (°F)' },
        ]}
      />
      <p className="text-xs text-rind-500">Setwell always stores grams and degrees Celsius; this only changes what you see and type.</p>
      <Button type="submit" disabled={pending}>{pending ? 'Saving…' : 'Save preferences'}</Button>
    </form>
  );
}
