import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { listProducts, reviewQueue } from '@/lib/production/queries';
import { PageHeader, EmptyState } from '@/components/ui/Card';
import { buttonClass } from '@/components/ui/Button';
import { formatDate } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Production' };

export default async function ProductionPage() {
  const actor = await requirePage('production.read');
  const [products, queue] = await Promise.all([listProducts(actor), can(actor.role, 'promotion.read') ? reviewQueue(actor) : Promise.resolve([])]);
  return (
    <>
      <PageHeader
        title="Production"
        lead="Products in production, each with its approved versions, batch sheets and the QC record of every batch."
        actions={
          <div className="flex flex-wrap gap-2">
            {can(actor.role, 'promotion.read') ? <Link href="/production/reviews" className={buttonClass('secondary')}>Promotion reviews{queue.length ? ` (${queue.length} waiting)` : ''}</Link> : null}
            {can(actor.role, 'audit.read') ? <Link href="/production/audit" className={buttonClass('secondary')}>Audit trail</Link> : null}
          </div>
        }
      />
      {products.length === 0 ? (
        <EmptyState title="Nothing in production yet">A product appears here when the head of product approves a promotion from a trial.</EmptyState>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2" data-testid="products">
          {products.map((p) => (
            <li key={p.id} className="rounded-card bg-pith-50 p-5 shadow-card ring-1 ring-pith-300">
              <p className="font-display text-lg text-damson-900"><Link href={`/production/products/${p.id}`} className="hover:underline">{p.name}</Link> <span className="font-mono text-sm text-rind-500">{p.code}</span></p>
              <p className="mt-1 text-sm text-rind-600">
                {p.current ? <>In production: <Link className="text-damson-700 underline" href={`/production/versions/${p.current.id}`}>v{p.current.version}</Link>, approved {formatDate(p.current.approvedAt)}</> : 'No version in production'}
                {' · '}{p.versionCount} version{p.versionCount === 1 ? '' : 's'}
              </p>
              <p className="mt-1 text-sm text-rind-600">{p.batchCount} batch{p.batchCount === 1 ? '' : 'es'}{p.failedCount ? <>, <span className="font-medium text-ember-700">{p.failedCount} failed</span></> : null}{p.lastBatchDate ? `, last ${formatDate(p.lastBatchDate)}` : ''}</p>
              {p.current && can(actor.role, 'batches.record') ? (
                <div className="mt-3 flex flex-wrap gap-2">
                  <Link href={`/production/versions/${p.current.id}/sheet`} className={buttonClass('secondary')}>Batch sheet</Link>
                  <Link href={`/production/versions/${p.current.id}/batches/new`} className={buttonClass('primary')}>Record a batch</Link>
                </div>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
