'use client';

import { useState, type InputHTMLAttributes } from 'react';
import { formatDate } from '@/lib/format/dates';

const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;

/**
 * A native date input (the phone's own picker) that reads its day back in the app's one date
 * format. The browser draws the input in its own locale (11/20/2026 in one, 20/11/2026 in another);
 * the line under it says "20 Nov 2026", so a day never reads two ways.
 */
export function DateInput({ onChange, value, defaultValue, ...rest }: Omit<InputHTMLAttributes<HTMLInputElement>, 'type'>) {
  const [typed, setTyped] = useState(String(defaultValue ?? ''));
  const day = value === undefined ? typed : String(value);
  return (
    <>
      <input
        type="date"
        value={value}
        defaultValue={defaultValue}
        onChange={(e) => {
          setTyped(e.target.value);
          onChange?.(e);
        }}
        {...rest}
      />
      {ISO_DAY.test(day) ? (
        <span className="mt-1 block text-xs text-rind-600" data-date-reads>
          {formatDate(day)}
        </span>
      ) : null}
    </>
  );
}
