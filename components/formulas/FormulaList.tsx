import Link from 'next/link';
import { formatMass, type UnitPreference } from '@/lib/chemistry';
import { PRODUCT_CLASS_LABELS, RULE_SET_LABELS, type FormulaSummary } from '@/lib/formulas/schema';
import { EmptyState } from '@/components/ui/Card';
import { formatDate } from '@/lib/format/dates';

const STATUS: Record<string, { label: string; className: string }> = {
  compliant: { label: 'Meets the rules', className: 'bg-leaf-50 text-leaf-700 ring-leaf-100' },
  non_compliant: { label: 'Fails a rule', className: 'bg-ember-50 text-ember-700 ring-ember-100' },
  incomplete: { label: 'Rules incomplete', className: 'bg-amberline-50 text-amberline-700 ring-amberline-100' },
  not_applicable: { label: 'No compositional standard', className: 'bg-pith-200 text-rind-700 ring-pith-300' },
};

export function FormulaList({ formulas, massUnits, canCreate, query }: { formulas: FormulaSummary[]; massUnits: UnitPreference; canCreate: boolean; query?: string }) {
  if (!formulas.length) {
    return query ? (
      <EmptyState title={`No formula matches “${query}”`} action={<Link href="/formulas" className="text-damson-700 underline">Clear the search</Link>} />
    ) : (
      <EmptyState title="No formulas yet" action={canCreate ? <Link href="/formulas/new" className="text-damson-700 underline">Start your first formula</Link> : null}>
        A formula is a list of ingredients with their weights. Start from the fruit, add sugar, pectin and acid, and Setwell shows the
        batch, the set and the rules as you type.
      </EmptyState>
    );
  }
  return (
    <ul className="grid gap-3 md:grid-cols-2" data-testid="formula-list">
      {formulas.map((f) => {
        const status = f.complianceOverall ? STATUS[f.complianceOverall] : undefined;
        return (
          <li key={f.id}>
            <Link href={`/formulas/${f.id}`} className="block h-full rounded-card bg-pith-50 p-4 shadow-card ring-1 ring-pith-300 hover:ring-damson-300">
              <div className="flex items-start justify-between gap-3">
                <p className="font-display text-lg text-damson-900">{f.name}</p>
                <span className="shrink-0 text-xs text-rind-500">rev. {f.revision}</span>
              </div>
              <p className="mt-1 text-sm text-rind-600">
                {PRODUCT_CLASS_LABELS[f.productClass]} · {RULE_SET_LABELS[f.ruleSet].split(' (')[0]}
                {f.finishedMassG !== null ? ` · ${formatMass(f.finishedMassG, massUnits)} finished` : ''}
              </p>
              <div className="mt-3 flex flex-wrap gap-2 text-xs">
                {status ? <span className={`rounded-full px-2 py-0.5 ring-1 ring-inset ${status.className}`}>{status.label}</span> : null}
                {f.dangerCount ? <span className="rounded-full bg-ember-600 px-2 py-0.5 font-semibold text-white">{f.dangerCount} safety caution{f.dangerCount > 1 ? 's' : ''}</span> : null}
                {f.warningCount ? <span className="rounded-full bg-amberline-100 px-2 py-0.5 text-amberline-700">{f.warningCount} warning{f.warningCount > 1 ? 's' : ''}</span> : null}
              </div>
              <p className="mt-3 text-xs text-rind-500">
                Saved by {f.updatedByName} on {formatDate(f.updatedAt)}
              </p>
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
