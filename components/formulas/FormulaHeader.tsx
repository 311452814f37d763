import Link from 'next/link';
import type { FormulaDetail } from '@/lib/formulas/schema';
import { formatDateTime } from '@/lib/format/dates';

/** Name, revision and the formula's sub-pages. */
export function FormulaHeader({ formula, active }: { formula: FormulaDetail; active: 'editor' | 'history' | 'print' | 'label' | 'propose' }) {
  const base = `/formulas/${formula.id}`;
  const tabs = [
    { key: 'editor', href: base, label: 'Formula' },
    { key: 'history', href: `${base}/history`, label: 'History' },
    { key: 'print', href: `${base}/print`, label: 'Print view' },
    { key: 'label', href: `${base}/label`, label: 'Label' },
    { key: 'propose', href: `${base}/propose`, label: 'Propose' },
  ] as const;
  const c = formula.current;
  return (
    <header className="no-print mb-6">
      <p className="text-sm text-rind-500">
        <Link href="/formulas" className="underline-offset-2 hover:underline">Formulas</Link> /
      </p>
      <h1 className="text-3xl font-semibold tracking-tight">{formula.name}</h1>
      <p className="mt-1 text-sm text-rind-600">
        Revision {c.number}, saved by {c.createdBy.name} on {formatDateTime(c.createdAt)}
        {c.note ? ` — “${c.note}”` : ''}
      </p>
      {formula.description ? <p className="mt-2 max-w-3xl text-rind-700">{formula.description}</p> : null}
      <nav aria-label="Formula" className="mt-4 flex gap-1 overflow-x-auto border-b border-pith-300">
        {tabs.map((t) => (
          <Link
            key={t.key}
            href={t.href}
            aria-current={active === t.key ? 'page' : undefined}
            className={`-mb-px shrink-0 rounded-t-lg px-4 py-2 text-sm font-medium ${active === t.key ? 'border border-b-pith-100 border-pith-300 bg-pith-100 text-damson-900' : 'text-rind-600 hover:text-damson-800'}`}
          >
            {t.label}
          </Link>
        ))}
      </nav>
    </header>
  );
}
