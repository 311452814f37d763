import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react';
import { DateInput } from './DateInput';

const inputBase =
  'block w-full rounded-lg border-0 bg-white px-3 py-2 text-base text-rind-900 ring-1 ring-inset ring-rind-300 placeholder:text-rind-400 focus:ring-2 focus:ring-damson-500 aria-[invalid=true]:ring-ember-600';

export function FieldErrorText({ id, errors }: { id: string; errors?: string[] }) {
  if (!errors?.length) return null;
  return (
    <p id={id} className="mt-1 text-sm text-ember-700" role="alert">
      {errors.join(' ')}
    </p>
  );
}

interface FieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  name: string;
  errors?: string[];
  hint?: ReactNode;
}

/** A labelled input whose server-side field errors sit right under it. */
export function Field({ label, name, errors, hint, id, ...rest }: FieldProps) {
  const fieldId = id ?? `f-${name}`;
  const Input = rest.type === 'date' ? DateInput : 'input';
  return (
    <div>
      <label htmlFor={fieldId} className="mb-1 block text-sm font-medium text-rind-700">
        {label}
      </label>
      <Input
        id={fieldId}
        name={name}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={errors?.length ? `${fieldId}-err` : hint ? `${fieldId}-hint` : undefined}
        className={inputBase}
        {...rest}
      />
      {hint && !errors?.length ? (
        <p id={`${fieldId}-hint`} className="mt-1 text-xs text-rind-500">
          {hint}
        </p>
      ) : null}
      <FieldErrorText id={`${fieldId}-err`} errors={errors} />
    </div>
  );
}

interface SelectProps extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  name: string;
  errors?: string[];
  options: Array<{ value: string; label: string }>;
}

export function SelectField({ label, name, errors, options, id, ...rest }: SelectProps) {
  const fieldId = id ?? `f-${name}`;
  return (
    <div>
      <label htmlFor={fieldId} className="mb-1 block text-sm font-medium text-rind-700">
        {label}
      </label>
      <select id={fieldId} name={name} aria-invalid={errors?.length ? true : undefined} className={inputBase} {...rest}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <FieldErrorText id={`${fieldId}-err`} errors={errors} />
    </div>
  );
}

export const inputClass = inputBase;
