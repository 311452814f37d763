import { Disclosure } from '@/components/ui/Disclosure';
import { OVERALL_STATUS_LABELS, RULE_STATUS_LABELS, type ComplianceReport, type OverallComplianceStatus, type RuleCheckResult, type RuleStatus } from '@/lib/chemistry';

const STATUS_STYLE: Record<RuleStatus, string> = {
  pass: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
  fail: 'bg-ember-50 text-ember-700 ring-ember-100',
  not_applicable: 'bg-pith-200 text-rind-600 ring-pith-300',
  not_evaluable: 'bg-amberline-50 text-amberline-700 ring-amberline-100',
};

const OVERALL_STYLE: Record<OverallComplianceStatus, string> = {
  compliant: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
  non_compliant: 'bg-ember-50 text-ember-700 ring-ember-100',
  incomplete: 'bg-amberline-50 text-amberline-700 ring-amberline-100',
  not_applicable: 'bg-pith-200 text-rind-600 ring-pith-300',
};

/** Each rule with requirement, actual, status and its legal source; cards on phones, a table on wide screens. */
export function ComplianceTable({ report }: { report: ComplianceReport }) {
  const applicable = report.results.filter((r) => r.status !== 'not_applicable');
  const notApplicable = report.results.filter((r) => r.status === 'not_applicable');
  return (
    <div className="space-y-3">
      <p data-testid="compliance-overall" className={`rounded-lg px-3 py-2 text-sm font-semibold ring-1 ring-inset ${OVERALL_STYLE[report.overall]}`}>
        {OVERALL_STATUS_LABELS[report.overall]}
      </p>
      <p className="text-xs text-rind-500">Rule edition for {report.ruleDate}: {report.edition}</p>
      <RuleList results={applicable} label="Rules checked" />
      {notApplicable.length ? (
        <Disclosure
          className="text-sm"
          summaryClassName="min-h-10 cursor-pointer py-2 text-rind-600"
          summary={`${notApplicable.length} rule${notApplicable.length === 1 ? '' : 's'} of this rule set that do not apply here`}
        >
          <RuleList results={notApplicable} label="Rules that do not apply" />
        </Disclosure>
      ) : null}
    </div>
  );
}

function RuleList({ results, label }: { results: RuleCheckResult[]; label: string }) {
  if (results.length === 0) return null;
  return (
    <ul className="divide-y divide-pith-200 rounded-lg ring-1 ring-pith-300" aria-label={label}>
      {results.map((r) => (
        <li key={r.ruleId} data-testid={`rule-${r.ruleId}`} className="grid gap-1 px-3 py-2 text-sm sm:grid-cols-[1fr_auto] sm:gap-3">
          <div>
            <p className="font-medium text-rind-800">{r.title}</p>
            <p className="text-rind-600">
              Required: {r.requirement}
              <span className="mx-1 text-rind-400">·</span>
              Actual: {r.actual ?? '—'}
            </p>
            <p className="mt-0.5 text-xs text-rind-500">Source: {r.source}</p>
            {r.note ? <p className="mt-0.5 text-xs text-rind-500">{r.note}</p> : null}
          </div>
          <span className={`self-start justify-self-start rounded px-2 py-0.5 text-xs font-semibold ring-1 ring-inset sm:justify-self-end ${STATUS_STYLE[r.status]}`}>
            {RULE_STATUS_LABELS[r.status]}
          </span>
        </li>
      ))}
    </ul>
  );
}
