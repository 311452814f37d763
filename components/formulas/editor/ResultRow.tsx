import type { ReactNode } from 'react';

/** One figure of the results: label, value, and where the value comes from, always beside it. */
export function ResultRow({ id, label, value, source }: { id: string; label: ReactNode; value: ReactNode; source?: ReactNode }) {
  return (
    <div className="border-b border-pith-200 py-2 last:border-b-0">
      <dt id={`result-${id}-label`} className="text-sm text-rind-600">
        {label}
      </dt>
      <dd aria-labelledby={`result-${id}-label`} className="mt-0.5">
        <span data-testid={`result-${id}`} className="font-display text-lg tabular-nums text-damson-900">
          {value}
        </span>
        {source ? <span className="mt-0.5 block text-xs text-rind-500">{source}</span> : null}
      </dd>
    </div>
  );
}
