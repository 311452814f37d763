import { notFound } from 'next/navigation';
import { requirePage, orNotFound } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { isUuid } from '@/lib/ids';
import { costSettings, packagingItemDetail } from '@/lib/pricing/queries';
import { packagingHistoryRows } from '@/lib/pricing/display';
import { PACKAGING_KIND_LABELS } from '@/lib/pricing/vocabulary';
import { formatDate, todayIso } from '@/lib/format/dates';
import { PageHeader, Card, EmptyState } from '@/components/ui/Card';
import { NoCurrencyNotice, PriceHistoryTable, PriceTabs } from '@/components/pricing/PriceViews';
import { PackagingPriceForm } from '@/components/pricing/PackagingPriceForm';
import { WithdrawPriceButton } from '@/components/pricing/WithdrawPriceButton';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Packaging price history' };

export default async function PackagingItemPage({ params }: { params: Promise<{ packagingItemId: string }> }) {
  const actor = await requirePage('prices.read');
  const { packagingItemId } = await params;
  if (!isUuid(packagingItemId)) notFound();
  const { item, points } = await orNotFound(packagingItemDetail(actor, packagingItemId));
  const { currency } = await costSettings(actor.workspaceId);
  const canWrite = can(actor.role, 'prices.write');
  const today = todayIso();
  return (
    <>
      <PageHeader title={item.name} lead={`${PACKAGING_KIND_LABELS[item.kind]}. Price history${currency ? ` in ${currency}` : ''}, newest first.`} />
      <PriceTabs current="packaging" />
      <div className="space-y-6">
        {currency ? null : <NoCurrencyNotice canChoose={can(actor.role, 'costs.settings')} />}
        <Card title="History">
          {points.length === 0 || !currency ? (
            <EmptyState title="No price yet">Until a price is entered, the packaging cost of formats that use it shows as incomplete.</EmptyState>
          ) : (
            <PriceHistoryTable
              label={`Prices of ${item.name}`}
              unitLabel="Per piece"
              rows={packagingHistoryRows(points, currency, today)}
              withdraw={canWrite ? (r) => <WithdrawPriceButton kind="packaging" priceId={r.id} label={`the price from ${formatDate(r.validFrom)}`} /> : undefined}
            />
          )}
        </Card>
        {canWrite && currency ? (
          <Card title="Add a price">
            <PackagingPriceForm currency={currency} items={[]} fixedItemId={item.id} today={today} />
          </Card>
        ) : null}
      </div>
    </>
  );
}
