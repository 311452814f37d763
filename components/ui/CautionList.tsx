import type { Caution, CautionSeverity } from '@/lib/chemistry';

const ORDER: Record<CautionSeverity, number> = { danger: 0, warning: 1, info: 2 };

const STYLE: Record<CautionSeverity, string> = {
  danger: 'bg-ember-50 text-ember-700 ring-2 ring-ember-600',
  warning: 'bg-amberline-50 text-amberline-700 ring-1 ring-amberline-100',
  info: 'bg-damson-50 text-damson-900 ring-1 ring-damson-200',
};

const SEVERITY_LABEL: Record<CautionSeverity, string> = { danger: 'Danger', warning: 'Warning', info: 'Note' };

/** Danger first and loud (role="alert"), then warnings, then notes; each with its source. */
export function sortCautions(cautions: Caution[]): Caution[] {
  return cautions.map((c, i) => ({ c, i })).sort((a, b) => ORDER[a.c.severity] - ORDER[b.c.severity] || a.i - b.i).map(({ c }) => c);
}

export function CautionList({ cautions }: { cautions: Caution[] }) {
  if (cautions.length === 0) return null;
  return (
    <ul className="space-y-2" aria-label="Cautions">
      {sortCautions(cautions).map((c) => (
        <li key={c.code} data-severity={c.severity} className={`rounded-lg px-4 py-3 text-sm ${STYLE[c.severity]}`}>
          <div role={c.severity === 'danger' ? 'alert' : undefined}>
          <p className="font-semibold">
            <span className="mr-2 inline-block rounded px-1.5 py-0.5 text-xs uppercase tracking-wide ring-1 ring-current">{SEVERITY_LABEL[c.severity]}</span>
            {c.title}
          </p>
          <p className="mt-1">{c.message}</p>
          <p className="mt-1 text-xs opacity-80">Source: {c.source}</p>
          </div>
        </li>
      ))}
    </ul>
  );
}
