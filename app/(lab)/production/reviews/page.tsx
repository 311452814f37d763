import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { listPromotionRequests, reviewQueue } from '@/lib/production/queries';
import { PageHeader, EmptyState, Card } from '@/components/ui/Card';
import { StatusBadge } from '@/components/production/StatusBadge';
import { formatDate } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Promotion reviews' };

export default async function ReviewsPage() {
  const actor = await requirePage('promotion.read');
  const [queue, all] = await Promise.all([reviewQueue(actor), listPromotionRequests(actor)]);
  const decided = all.filter((r) => r.status !== 'pending');
  const decider = can(actor.role, 'promotion.decide');
  return (
    <>
      <PageHeader title="Promotion reviews" lead={decider ? 'Requests waiting for your decision, oldest first. Open one to see its evidence.' : 'Requests to put trial variants into production, and what became of them.'} />
      <Card title="Waiting for review">
        {queue.length === 0 ? (
          <EmptyState title="The queue is empty">{can(actor.role, 'promotion.request') ? 'Request a promotion from a trial’s comparison page.' : 'New requests appear here, and you get an e-mail.'}</EmptyState>
        ) : (
          <ul className="divide-y divide-pith-200" data-testid="review-queue">
            {queue.map((r) => (
              <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 py-3">
                <div>
                  <Link href={`/production/reviews/${r.id}`} className="font-medium text-damson-800 underline">{r.code}: {r.trial.code} variant {r.variantLabel} → {r.productLabel}</Link>
                  <p className="text-sm text-rind-600">Requested by {r.requestedBy} on {formatDate(r.requestedAt)}{r.ownRequest ? ' (yours: another head of product must decide)' : ''}</p>
                </div>
                <StatusBadge status={r.status} />
              </li>
            ))}
          </ul>
        )}
      </Card>
      <div className="mt-6">
        <Card title="Decided">
          {decided.length === 0 ? <p className="text-sm text-rind-600">No decisions yet.</p> : (
            <ul className="divide-y divide-pith-200">
              {decided.map((r) => (
                <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 py-2 text-sm">
                  <Link href={`/production/reviews/${r.id}`} className="text-damson-800 underline">{r.code}: {r.trial.code} variant {r.variantLabel} → {r.productLabel}</Link>
                  <span className="flex items-center gap-2 text-rind-600">{formatDate(r.decidedAt)} <StatusBadge status={r.status} /></span>
                </li>
              ))}
            </ul>
          )}
        </Card>
      </div>
    </>
  );
}
