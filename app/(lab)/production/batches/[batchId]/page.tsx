import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getBatch } from '@/lib/production/queries';
import { DISPOSITION_LABELS } from '@/lib/production/vocabulary';
import { formatMass, formatTemperature } from '@/lib/chemistry';
import { formatDate, formatDateTime } from '@/lib/format/dates';
import { PageHeader, Card } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { StatusBadge } from '@/components/production/StatusBadge';
import { CheckList } from '@/components/production/CheckList';
import { AuditTrail } from '@/components/production/AuditTrail';
import { BatchHoldPanel } from '@/components/production/BatchHoldPanel';
import { batchCost } from '@/lib/costs/queries';
import { BatchCostCard } from '@/components/costs/BatchCostCard';
import { versionLabel } from '@/lib/label/queries';
import { statedSugarAgainst } from '@/lib/label';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Batch' };

const KIND_LABELS = { retest: 'Re-test', release: 'Released', reject: 'Rejected' } as const;

export default async function BatchPage({ params }: { params: Promise<{ batchId: string }> }) {
  const actor = await requirePage('production.read');
  const { batch: b, product, audit } = await orNotFound(getBatch(actor, pageId((await params).batchId)));
  const temps = actor.temperatureUnit === 'C' ? 'metric' : 'imperial';
  const cost = can(actor.role, 'prices.read') ? await batchCost(actor, b.id) : null;
  const sugarOnLabel = statedSugarAgainst((await versionLabel(actor, b.versionId)).label, b.checks.find((c) => c.key === 'solids')?.value ?? null);
  return (
    <>
      <PageHeader
        title={`Batch ${b.lotCode}`}
        lead={`${product.name}, made to v${b.version} on ${formatDate(b.batchDate)}; ${formatMass(b.batchSizeG, actor.massUnits)}, ${b.status === 'rejected' || b.status === 'discarded' ? `${b.jarsFilled} jars filled, none good: the batch was ${b.status}` : `${b.jarsFilled} jars (${b.jarsRejected} rejected)`}. Recorded by ${b.recordedBy}.`}
        actions={<StatusBadge status={b.status} />}
      />
      <p className="-mt-3 mb-6 flex flex-wrap gap-3 text-sm">
        <Link href={`/production/versions/${b.versionId}`} className="text-damson-700 underline">v{b.version} and its spec</Link>
        <Link href={`/production/products/${product.id}`} className="text-damson-700 underline">All batches of {product.name}</Link>
      </p>
      {b.status === 'held' ? (
        <div className="mb-6">
          <Notice tone="warning" title="On hold">
            {b.latestOutcome === 'incomplete' && b.staleSinceRework.length
              ? `Reworked, and not measured again since: ${b.staleSinceRework.join(', ').toLowerCase()}. A re-boil or blend changes the batch, so the readings before it do not count: re-test ${b.staleSinceRework.length > 1 ? 'them' : 'it'} before the batch can be released.`
              : b.latestOutcome === 'incomplete'
              ? 'A check the spec requires was not measured: re-test it before the batch can be released.'
              : b.latestOutcome === 'fail' ? 'The latest checks failed: rework and re-test, or reject the batch.' : 'The latest re-test passed every check: the batch can be released.'}
          </Notice>
        </div>
      ) : null}
      {cost ? <div className="mb-6"><BatchCostCard cost={cost} writtenOff={b.status === 'rejected' || b.status === 'discarded' ? b.status : null} /></div> : null}
      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="Checks at recording">
          <div className="mb-2"><StatusBadge status={b.outcome} /></div>
          <CheckList checks={b.checks} testId="recorded-checks" />
          <p className="mt-3 text-sm text-rind-600">Filled at {formatTemperature(b.fillTempC, temps)}.</p>
          {sugarOnLabel ? (
            <p className={`mt-2 text-sm ${sugarOnLabel.withinTolerance ? 'text-rind-600' : 'font-semibold text-ember-700'}`} data-testid="label-sugar-check">
              Total sugar on the label: {sugarOnLabel.message}
            </p>
          ) : null}
          {b.disposition ? <p className="mt-2 text-sm"><strong>{DISPOSITION_LABELS[b.disposition]}:</strong> {b.dispositionComment}</p> : null}
          {b.notes ? <p className="mt-2 whitespace-pre-line text-sm">{b.notes}</p> : null}
        </Card>
        <Card title="Re-tests and decisions">
          {b.decisions.length ? (
            <ol className="space-y-4" data-testid="batch-decisions">
              {b.decisions.map((d) => (
                <li key={d.id} className="border-b border-pith-200 pb-3 text-sm">
                  <p className="flex flex-wrap items-center gap-2"><strong>{KIND_LABELS[d.kind]}</strong>{d.outcome ? <StatusBadge status={d.outcome} /> : null}<span className="text-rind-500">{formatDateTime(d.at)}, {d.decidedBy}</span></p>
                  <p className="mt-1">{d.comment}</p>
                  {d.checks ? <div className="mt-2"><CheckList checks={d.checks} /></div> : null}
                </li>
              ))}
            </ol>
          ) : <p className="text-sm text-rind-600">{b.status === 'held' ? 'No re-test yet.' : 'None: the batch was not held.'}</p>}
        </Card>
      </div>
      {b.status === 'held' && can(actor.role, 'batches.record') ? (
        <div className="mt-6"><BatchHoldPanel batchId={b.id} lotCode={b.lotCode} canRelease={b.canRelease} reworked={b.disposition === 'rework'} temperatureUnit={actor.temperatureUnit} /></div>
      ) : null}
      <div className="mt-6"><Card title="Audit trail"><AuditTrail events={audit} /></Card></div>
    </>
  );
}
