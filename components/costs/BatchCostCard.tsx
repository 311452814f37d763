import type { BatchCost } from '@/lib/costs/schema';
import { Card } from '@/components/ui/Card';
import { costText, FillMismatchNotice, perJarText } from './CostSummary';

/** A batch's cost per jar: planned (the version at that day's prices) and actual (its charge over its good jars, none once rejected or discarded). */
export function BatchCostCard({ cost, writtenOff }: { cost: BatchCost; writtenOff: 'rejected' | 'discarded' | null }) {
  const goodJars = cost.goodJars;
  const currency = cost.currency;
  return (
    <Card title="Cost per jar">
      <dl className="grid grid-cols-1 gap-3 text-sm sm:grid-cols-2" data-testid="batch-cost">
        <div>
          <dt className="text-xs text-rind-500">Planned, at the batch day’s prices</dt>
          <dd className="text-lg font-semibold tabular-nums">{perJarText(cost.planned, currency)}</dd>
        </div>
        <div>
          <dt className="text-xs text-rind-500">{writtenOff ? 'Actual' : `Actual, over ${goodJars} good jars`}</dt>
          <dd className="text-lg font-semibold tabular-nums" data-testid="batch-actual-cost">
            {writtenOff ? `None: the batch was ${writtenOff}, so it has no good jars.` : currency && cost.actualPerJar ? costText(cost.actualPerJar, currency) : '—'}
          </dd>
        </div>
      </dl>
      <div className="mt-2"><FillMismatchNotice results={[{ label: 'This batch', result: cost.planned }]} testId="batch-cost-fill" /></div>
      <p className="mt-2 text-xs text-rind-500">Actual: the raw materials of the kettle charge plus packaging for every jar filled, divided by the jars that passed.</p>
    </Card>
  );
}
