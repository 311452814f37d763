import { requirePage, orNotFound } from '@/lib/page-guard';
import { notFound } from 'next/navigation';
import { can } from '@/lib/permissions';
import { isUuid } from '@/lib/ids';
import { costSettings, ingredientPriceDetail } from '@/lib/pricing/queries';
import { ingredientHistoryRows } from '@/lib/pricing/display';
import { formatDate, todayIso } from '@/lib/format/dates';
import { PageHeader, Card, EmptyState } from '@/components/ui/Card';
import { NoCurrencyNotice, PriceHistoryTable, PriceTabs } from '@/components/pricing/PriceViews';
import { IngredientPriceForm } from '@/components/pricing/IngredientPriceForm';
import { RefuseForm } from '@/components/pricing/RefuseForm';
import { WithdrawPriceButton } from '@/components/pricing/WithdrawPriceButton';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Price history' };

export default async function IngredientPricePage({ params }: { params: Promise<{ ingredientId: string }> }) {
  const actor = await requirePage('prices.read');
  const { ingredientId } = await params;
  if (!isUuid(ingredientId)) notFound();
  const { ingredient, points } = await orNotFound(ingredientPriceDetail(actor, ingredientId));
  const { currency } = await costSettings(actor.workspaceId);
  const canWrite = can(actor.role, 'prices.write');
  const today = todayIso();
  return (
    <>
      <PageHeader title={ingredient.name} lead={`Price history${currency ? ` in ${currency}` : ''}, newest first. A correction is a new price; a mistaken one is withdrawn with a reason and stays on record.`} />
      <PriceTabs current="ingredients" />
      <div className="space-y-6">
        {currency ? null : <NoCurrencyNotice canChoose={can(actor.role, 'costs.settings')} />}
        <Card title="History">
          {points.length === 0 || !currency ? (
            <EmptyState title="No price yet">Until a price is entered, costs that use {ingredient.name} show as incomplete.</EmptyState>
          ) : (
            <PriceHistoryTable
              label={`Prices of ${ingredient.name}`}
              unitLabel={`Per ${actor.massUnits === 'imperial' ? 'lb' : 'kg'}`}
              rows={ingredientHistoryRows(points, currency, actor.massUnits, today)}
              withdraw={canWrite ? (r) => <WithdrawPriceButton kind="ingredient" priceId={r.id} label={`the price from ${formatDate(r.validFrom)}`} /> : undefined}
            />
          )}
        </Card>
        {canWrite && currency ? (
          <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
            <Card title="Add a price">
              <IngredientPriceForm currency={currency} ingredients={[]} fixedIngredientId={ingredient.id} defaultUnit={actor.massUnits === 'imperial' ? 'lb' : 'kg'} today={today} />
            </Card>
            <Card title="Refuse and trim">
              <RefuseForm ingredientId={ingredient.id} refusePct={ingredient.refusePct} />
            </Card>
          </div>
        ) : (
          <p className="text-sm text-rind-600">Refuse and trim: {ingredient.refusePct} % of the bought mass.</p>
        )}
      </div>
    </>
  );
}
