'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { saveCostSettingsAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';

/** Currency (fixed once prices exist), filling overfill and the cost-change warning threshold. */
export function CostSettingsForm({ settings, currencies, currencyLocked }: {
  settings: { currency: string | null; overfillPct: number; costWarningPct: number };
  currencies: { code: string; label: string }[];
  currencyLocked: boolean;
}) {
  const router = useRouter();
  const form = useFormAction(saveCostSettingsAction);
  const [values, setValues] = useState({ currency: settings.currency ?? '', overfillPct: String(settings.overfillPct), costWarningPct: String(settings.costWarningPct) });
  const [saved, setSaved] = useState(false);
  const change = (key: keyof typeof values) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => {
    setValues({ ...values, [key]: e.target.value });
    setSaved(false);
  };
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const result = await form.run({ currency: values.currency, overfillPct: typedNumber(values.overfillPct), costWarningPct: typedNumber(values.costWarningPct) });
    if (result?.ok) {
      setSaved(true);
      router.refresh();
    }
  }
  return (
    <form onSubmit={submit} className="max-w-md space-y-4" noValidate>
      {saved ? <Notice tone="success">Saved.</Notice> : null}
      {form.error ? <Notice tone="danger">{form.error}</Notice> : null}
      <SelectField
        label="Currency of every price"
        name="currency"
        value={values.currency}
        onChange={change('currency')}
        errors={form.fields.currency}
        disabled={currencyLocked}
        options={[{ value: '', label: 'Choose a currency…' }, ...currencies.map((c) => ({ value: c.code, label: c.label }))]}
      />
      {currencyLocked ? <p className="text-xs text-rind-500">Prices are recorded in {settings.currency}, so the currency stays: Setwell never converts prices.</p> : null}
      <Field label="Filling overfill (%)" name="overfillPct" inputMode="decimal" value={values.overfillPct} onChange={change('overfillPct')} errors={form.fields.overfillPct}
        hint="Product filled above the declared net fill of each jar, on average." />
      <Field label="Warn when a product’s cost per jar has moved by more than (%)" name="costWarningPct" inputMode="decimal" value={values.costWarningPct} onChange={change('costWarningPct')} errors={form.fields.costWarningPct} />
      <Button type="submit" disabled={form.pending}>{form.pending ? 'Saving…' : 'Save cost settings'}</Button>
    </form>
  );
}
