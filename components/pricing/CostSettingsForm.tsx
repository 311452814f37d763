'use client';

import { Field, SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { saveCostSettingsAction } from '@/lib/pricing/actions';
import { typedNumber } from './numbers';
import { FormNotices, usePriceForm } from './usePriceForm';

/** Currency (fixed once prices exist), filling overfill and the cost-change warning threshold. */
export function CostSettingsForm({ settings, currencies, currencyLocked }: {
  settings: { currency: string | null; overfillPct: number; costWarningPct: number };
  currencies: { code: string; label: string }[];
  currencyLocked: boolean;
}) {
  const { form, values, saved, change, submit } = usePriceForm(saveCostSettingsAction,
    { currency: settings.currency ?? '', overfillPct: String(settings.overfillPct), costWarningPct: String(settings.costWarningPct) },
    (v) => ({ currency: v.currency, overfillPct: typedNumber(v.overfillPct), costWarningPct: typedNumber(v.costWarningPct) }));
  return (
    <form onSubmit={submit} className="max-w-md space-y-4" noValidate>
      <FormNotices saved={saved} savedText="Saved." error={form.error} />
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
