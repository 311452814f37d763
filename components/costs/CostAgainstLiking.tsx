import { minorDigits } from '@/lib/pricing/money';
import { roundMinor } from '@/lib/costing';
import type { TrialCosts } from '@/lib/costs/schema';
import { TableBox } from '@/components/ui/TableBox';
import { formatDate } from '@/lib/format/dates';
import { CostLikingChart, type CostLikingPoint } from './CostLikingChart';
import { perJarText } from './CostSummary';
import { HEAD, TH, NUM_TH, CELL, NUM } from '@/components/results/DataTable';

/** The attribute the trade-off is read against (the library's 9-point hedonic "Overall liking"). */
export const LIKING_ATTRIBUTE = /^overall liking$/i;

/**
 * Compare page: each variant's cost per jar beside its overall liking, as a table (read by screen
 * readers and on phones) and, on wider screens, as a labelled scatter chart.
 */
export function CostAgainstLiking({ costs, means }: { costs: TrialCosts; means: Array<{ attribute: string; label: string; mean: number | null }> }) {
  const liking = new Map(means.filter((m) => LIKING_ATTRIBUTE.test(m.attribute) && m.mean !== null).map((m) => [m.label, m.mean as number]));
  const currency = costs.currency;
  const digits = currency ? minorDigits(currency) : 2;
  const points: CostLikingPoint[] = [];
  for (const v of costs.variants) {
    const perJar = v.result.ok ? v.result.cost.perJar : null;
    const score = liking.get(v.label);
    if (perJar?.complete && score !== undefined) points.push({ label: v.label, cost: roundMinor(perJar.minor) / 10 ** digits, liking: score });
  }
  const top = Math.max(9, ...points.map((p) => Math.ceil(p.liking)));
  return (
    <div className="space-y-3">
      <p className="text-sm text-rind-600">
        Prices of {formatDate(costs.asOf)}{costs.packFormat ? `, filled in ${costs.packFormat.name}` : ''}. A variant with unpriced lines shows “at least” and stays off the chart.
      </p>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,20rem)_minmax(0,1fr)]">
        <TableBox label="Cost per jar and overall liking">
          <table className="w-full border-collapse text-sm" data-testid="cost-liking-table">
            <thead className={HEAD}>
              <tr>
                <th scope="col" className={TH}>Variant</th>
                <th scope="col" className={NUM_TH}>Cost per jar</th>
                <th scope="col" className={NUM_TH}>Overall liking</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-pith-200">
              {costs.variants.map((v) => (
                <tr key={v.variantId}>
                  <th scope="row" className={`${CELL} text-left font-semibold`}>{v.label}</th>
                  <td className={NUM} data-testid="compare-cost">{perJarText(v.result, currency)}</td>
                  <td className={NUM} data-testid="compare-liking">{liking.has(v.label) ? liking.get(v.label)!.toFixed(2) : 'not tasted'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
        {currency && points.length >= 2 ? (
          <div className="hidden min-w-0 sm:block">
            <CostLikingChart points={points} currency={currency} digits={digits} likingScale={{ min: 1, max: top }} />
          </div>
        ) : (
          <p className="text-sm text-rind-600">The chart needs at least two variants with a full cost and an overall liking score.</p>
        )}
      </div>
    </div>
  );
}
