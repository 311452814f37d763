import { fillMismatchText, formatCost, type CostTotal, type FormulaCost } from '@/lib/costing';
import { formatDate } from '@/lib/format/dates';
import { Notice } from '@/components/ui/Notice';
import type { CostResult, TrialCosts } from '@/lib/costs/schema';

/** A total as the screen says it: "at least" while lines are unpriced. */
export function costText(total: CostTotal | null, currency: string): string {
  if (!total) return '—';
  return total.complete ? formatCost(total.minor, currency) : `at least ${formatCost(total.minor, currency)}`;
}

/** The three headline figures and, when prices are missing, which ones. Server or client. */
export function CostSummary({ cost, currency, testId }: { cost: FormulaCost; currency: string; testId?: string }) {
  return (
    <div className="space-y-3" data-testid={testId}>
      <dl className="grid grid-cols-1 gap-3 text-sm sm:grid-cols-3">
        <Figure label="Raw materials per batch" value={costText(cost.batch, currency)} />
        <Figure label="Per kg of finished product" value={costText(cost.perKg, currency)} />
        <Figure label={cost.perJar ? 'Per jar, with packaging' : 'Per jar'} value={cost.perJar ? costText(cost.perJar, currency) : 'No pack format'} testId={testId ? `${testId}-per-jar` : undefined} />
      </dl>
      {cost.fillMismatch ? (
        <div data-testid={testId ? `${testId}-fill-mismatch` : undefined}>
          <Notice tone="warning" title="Another jar size">{fillMismatchText(cost.fillMismatch)}</Notice>
        </div>
      ) : null}
      {!cost.complete ? (
        <Notice tone="warning" title="Incomplete">
          No price on {formatDate(cost.asOf)} for {cost.missing.join(', ')}. The figures count only the priced lines.
        </Notice>
      ) : null}
    </div>
  );
}

function Figure({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="min-w-0 rounded-card bg-white/60 p-3 ring-1 ring-pith-200">
      <dt className="text-xs text-rind-500">{label}</dt>
      <dd className="text-lg font-semibold tabular-nums text-damson-900" data-testid={testId}>{value}</dd>
    </div>
  );
}

/** A cost per jar in one cell: the figure, "at least …" while incomplete, or why there is none. */
export function perJarText(result: CostResult, currency: string | null): string {
  if (!currency) return 'No currency set';
  if (!result.ok) return 'Not costed';
  return result.cost.perJar ? costText(result.cost.perJar, currency) : 'No pack format';
}

/** The trial's variants' costs per jar, by variant id, for the variants table. */
export function variantCostTexts(costs: TrialCosts): Map<string, string> {
  return new Map(costs.variants.map((v) => [v.variantId, perJarText(v.result, costs.currency)]));
}

/**
 * The costs per jar that are for another jar than their formula's, one line each, named by `label`
 * (variants, versions); nothing when every pack format fills the formula's own jar.
 */
export function FillMismatchNotice({ results, testId }: { results: Array<{ label: string; result: CostResult }>; testId?: string }) {
  const rows = results.flatMap((r) => (r.result.ok && r.result.cost.perJar && r.result.cost.fillMismatch ? [{ label: r.label, mismatch: r.result.cost.fillMismatch }] : []));
  if (rows.length === 0) return null;
  return (
    <div data-testid={testId}>
      <Notice tone="warning" title="Costed for another jar size">
        <ul className="space-y-1">
          {rows.map((r) => (
            <li key={r.label}>{r.label}: {fillMismatchText(r.mismatch)}</li>
          ))}
        </ul>
      </Notice>
    </div>
  );
}
