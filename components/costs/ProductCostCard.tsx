import { formatCost } from '@/lib/costing';
import type { ProductCosts, VersionCost } from '@/lib/costs/schema';
import { formatDate } from '@/lib/format/dates';
import { Card } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { TableBox } from '@/components/ui/TableBox';
import { FillMismatchNotice, perJarText } from './CostSummary';
import { TABLE, HEAD, TH, NUM_TH, CELL, NUM } from '@/components/results/DataTable';

function approvalText(v: VersionCost): string {
  const a = v.atApproval;
  if (!a) return 'Not recorded';
  if (a.perJarMinor === null) return 'No pack format';
  return `${a.complete ? '' : 'at least '}${formatCost(a.perJarMinor, a.currency)}`;
}

/** A product's cost per jar: frozen at each version's approval, and today; warns past the workspace threshold. */
export function ProductCostCard({ costs }: { costs: ProductCosts }) {
  const current = costs.versions.find((v) => v.status === 'current');
  return (
    <Card title="Cost per jar">
      <div className="space-y-3" data-testid="product-cost">
        {current?.warn && current.movedPct !== null ? (
          <Notice tone="warning" title="Cost moved">
            Today’s cost per jar of v{current.version} is {Math.abs(current.movedPct).toFixed(1)} % {current.movedPct > 0 ? 'above' : 'below'} its cost at approval;
            the workspace warns beyond {costs.warningPct} %.
          </Notice>
        ) : null}
        <FillMismatchNotice results={costs.versions.map((v) => ({ label: `v${v.version}`, result: v.today }))} testId="product-cost-fill" />
        <TableBox label="Cost per jar of each version" framed={false}>
          <table className={TABLE}>
            <thead className={HEAD}>
              <tr>
                <th scope="col" className={TH}>Version</th>
                <th scope="col" className={NUM_TH}>At approval</th>
                <th scope="col" className={NUM_TH}>Today ({formatDate(costs.asOf)})</th>
                <th scope="col" className={NUM_TH}>Change</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-pith-200">
              {costs.versions.map((v) => (
                <tr key={v.versionId}>
                  <th scope="row" className={`${CELL} text-left font-normal`}>v{v.version}{v.status === 'current' ? ' (current)' : ''}</th>
                  <td className={NUM} data-testid="cost-at-approval">
                    {approvalText(v)}
                    {v.atApproval ? <span className="block text-xs text-rind-500">{formatDate(v.atApproval.asOf)}</span> : null}
                  </td>
                  <td className={NUM} data-testid="cost-today">{perJarText(v.today, costs.currency)}</td>
                  <td className={`px-3 py-1.5 text-right tabular-nums ${v.warn ? 'font-semibold text-ember-700' : ''}`}>
                    {v.movedPct === null ? '—' : `${v.movedPct > 0 ? '+' : v.movedPct < 0 ? '−' : ''}${Math.abs(v.movedPct).toFixed(1)} %`}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
        <p className="text-xs text-rind-500">The cost at approval is kept as it was on that day; today’s uses today’s prices and the version’s pack format.</p>
      </div>
    </Card>
  );
}
