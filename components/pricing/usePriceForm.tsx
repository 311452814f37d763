'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { SelectField } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { useFormAction, type FormActionResult } from '@/components/ui/useFormAction';

/**
 * The state every price form shares: text values as typed, "saved" until the next edit, a submit that
 * sends `toInput(values)` to the server action and, once it is stored, refreshes the page and starts
 * again from `afterSave(values)` (default: the values stay).
 */
export function usePriceForm<V extends Record<string, string>, T>(
  action: (input: unknown) => Promise<FormActionResult<T>>,
  initial: V,
  toInput: (values: V) => unknown,
  afterSave: (values: V) => V = (values) => values,
) {
  const router = useRouter();
  const form = useFormAction(action);
  const [values, setValues] = useState(initial);
  const [saved, setSaved] = useState(false);
  const change = (key: keyof V) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => {
    setValues({ ...values, [key]: e.target.value });
    setSaved(false);
  };
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const result = await form.run(toInput(values));
    if (result?.ok) {
      setSaved(true);
      setValues(afterSave(values));
      router.refresh();
    }
  }
  return { form, values, saved, change, submit };
}

/** The success line after a save and the server's message after a refusal. */
export function FormNotices({ saved, savedText, error }: { saved: boolean; savedText: string; error?: string }) {
  return (
    <>
      {saved ? <Notice tone="success">{savedText}</Notice> : null}
      {error ? <Notice tone="danger">{error}</Notice> : null}
    </>
  );
}

/** The list to pick what a price is for, unless the page is already about one thing. */
export function PricedThingSelect({ fixed, label, choose, name, value, onChange, errors, options }: {
  fixed: boolean;
  label: string;
  choose: string;
  name: string;
  value: string;
  onChange: (e: React.ChangeEvent<HTMLSelectElement>) => void;
  errors?: string[];
  options: { id: string; name: string }[];
}) {
  if (fixed) return null;
  return (
    <SelectField label={label} name={name} value={value} onChange={onChange} errors={errors}
      options={[{ value: '', label: choose }, ...options.map((o) => ({ value: o.id, label: o.name }))]} />
  );
}
