import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getProduct } from '@/lib/production/queries';
import { type BatchView } from '@/lib/production/schema';
import { PageHeader, Card } from '@/components/ui/Card';
import { buttonClass } from '@/components/ui/Button';
import { StatusBadge } from '@/components/production/StatusBadge';
import { BatchTable } from '@/components/production/BatchTable';
import { TrendChart } from '@/components/production/TrendChart';
import { formatDate } from '@/lib/format/dates';
import { productCosts } from '@/lib/costs/queries';
import { ProductCostCard } from '@/components/costs/ProductCostCard';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Product' };

const checkPassed = (b: BatchView, key: string) => b.checks.find((c) => c.key === key)?.status === 'pass';

export default async function ProductPage({ params }: { params: Promise<{ productId: string }> }) {
  const actor = await requirePage('production.read');
  const { product, versions, batches } = await orNotFound(getProduct(actor, pageId((await params).productId)));
  const current = versions.find((v) => v.status === 'current');
  const costs = can(actor.role, 'prices.read') ? await productCosts(actor, product.id) : null;
  return (
    <>
      <PageHeader
        title={product.name}
        lead={`Product code ${product.code}. Every batch is checked against the spec of the version it was made to.`}
        actions={
          <div className="flex flex-wrap gap-2">
            <a href={`/api/v1/products/${product.id}/batches.csv`} className={buttonClass('secondary')} download>Batches as CSV</a>
            {current && can(actor.role, 'batches.record') ? <Link href={`/production/versions/${current.id}/batches/new`} className={buttonClass('primary')}>Record a batch</Link> : null}
          </div>
        }
      />
      <Card title="Versions">
        <ul className="divide-y divide-pith-200" data-testid="versions">
          {versions.map((v) => (
            <li key={v.id} className="flex flex-wrap items-center justify-between gap-2 py-2 text-sm">
              <span><Link href={`/production/versions/${v.id}`} className="font-medium text-damson-800 underline">v{v.version}</Link> — from {v.source.trialCode} variant {v.source.variantLabel}, approved by {v.approvedBy} on {formatDate(v.approvedAt)}{v.supersededAt ? `; superseded by v${v.supersededByVersion} on ${formatDate(v.supersededAt)}` : ''}</span>
              <StatusBadge status={v.status} />
            </li>
          ))}
        </ul>
      </Card>
      {costs ? <div className="mt-6"><ProductCostCard costs={costs} /></div> : null}
      <section className="mt-6 grid gap-4 lg:grid-cols-2" aria-label="Trends">
        {batches.length ? (
          <>
            <TrendChart title="Soluble solids at 20 °C" unit="°Brix" decimals={1} points={batches.map((b) => ({ lotCode: b.lotCode, value: b.brix20, min: b.limits.solidsMin, max: b.limits.solidsMax, ok: checkPassed(b, 'solids') }))} />
            <TrendChart title="pH" unit="pH" decimals={2} points={batches.map((b) => ({ lotCode: b.lotCode, value: b.ph, min: b.limits.phMin, max: b.limits.phMax, ok: checkPassed(b, 'ph') }))} />
          </>
        ) : <p className="text-sm text-rind-600">The trend charts appear with the first batch.</p>}
      </section>
      <div className="mt-6" id="batches"><Card title="Batch records"><BatchTable batches={[...batches].reverse()} units={actor.massUnits} temperatures={actor.temperatureUnit === 'C' ? 'metric' : 'imperial'} /></Card></div>
    </>
  );
}
