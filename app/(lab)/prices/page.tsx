import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { costSettings, ingredientPriceList } from '@/lib/pricing/queries';
import { formatMoney } from '@/lib/pricing/money';
import { packSizeText, perMassText } from '@/lib/pricing/display';
import { formatDate, todayIso } from '@/lib/format/dates';
import { PageHeader, Card, EmptyState } from '@/components/ui/Card';
import { TableBox } from '@/components/ui/TableBox';
import { buttonClass } from '@/components/ui/Button';
import { NoCurrencyNotice, PriceTabs } from '@/components/pricing/PriceViews';
import { IngredientPriceForm } from '@/components/pricing/IngredientPriceForm';
import { PriceImportForm } from '@/components/pricing/PriceImportForm';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Prices' };

const TD = 'px-4 py-3 align-top';

export default async function PricesPage() {
  const actor = await requirePage('prices.read');
  const { currency } = await costSettings(actor.workspaceId);
  const rows = await ingredientPriceList(actor);
  const canWrite = can(actor.role, 'prices.write') && currency !== null;
  const priced = rows.filter((r) => r.current).length;
  return (
    <>
      <PageHeader
        title="Prices"
        lead={`What each ingredient costs as bought${currency ? `, in ${currency}` : ''}. Every price is dated and kept, so a formula can be costed as of any day.`}
        actions={rows.some((r) => r.points > 0) ? <a href="/api/v1/prices/export" className={buttonClass('secondary')} download>Export CSV</a> : null}
      />
      <PriceTabs current="ingredients" />
      <div className="space-y-6">
        {currency ? null : <NoCurrencyNotice canChoose={can(actor.role, 'costs.settings')} />}
        <Card title={`Ingredients (${priced} of ${rows.length} priced today)`}>
          {rows.length === 0 ? (
            <EmptyState title="No ingredients yet">Add ingredients to the library first; their prices are kept here.</EmptyState>
          ) : (
            <TableBox label="Ingredient prices" framed={false}>
              <table className="min-w-full divide-y divide-pith-300 text-sm" data-testid="price-table">
                <caption className="sr-only">The price of each ingredient in force today{currency ? `, in ${currency}` : ''}</caption>
                <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
                  <tr>
                    <th scope="col" className="px-4 py-3">Ingredient</th>
                    <th scope="col" className="px-4 py-3">Pack price</th>
                    <th scope="col" className="px-4 py-3">Pack</th>
                    <th scope="col" className="px-4 py-3">Price per {actor.massUnits === 'imperial' ? 'lb' : 'kg'}</th>
                    <th scope="col" className="px-4 py-3">Since</th>
                    <th scope="col" className="px-4 py-3">Supplier</th>
                    <th scope="col" className="px-4 py-3">Refuse</th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-pith-200">
                  {rows.map((r) => (
                    <tr key={r.ingredientId} className={r.archived ? 'text-rind-400' : ''}>
                      <th scope="row" className={`${TD} text-left font-medium`}>
                        <Link href={`/prices/${r.ingredientId}`} className="inline-flex min-h-10 items-center text-damson-700 underline-offset-2 hover:underline">{r.name}</Link>
                      </th>
                      {r.current && currency ? (
                        <>
                          <td className={`${TD} whitespace-nowrap`}>{formatMoney(r.current.packPriceMinor, currency)}</td>
                          <td className={`${TD} whitespace-nowrap`}>{packSizeText(r.current.packSizeG, actor.massUnits)}</td>
                          <td className={`${TD} whitespace-nowrap`}>{perMassText(r.current.packPriceMinor, r.current.packSizeG, currency, actor.massUnits)}</td>
                          <td className={`${TD} whitespace-nowrap`}>{formatDate(r.current.validFrom)}</td>
                          <td className={TD}>{r.current.supplier ?? '—'}</td>
                        </>
                      ) : (
                        <td className={`${TD} text-rind-500`} colSpan={5}>{r.points > 0 ? 'No price in force today (only later ones)' : 'No price yet: costs using it show as incomplete'}</td>
                      )}
                      <td className={`${TD} whitespace-nowrap`}>{r.refusePct ? `${r.refusePct} %` : '—'}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </TableBox>
          )}
        </Card>
        {canWrite && currency ? (
          <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
            <Card title="Add a price">
              <IngredientPriceForm currency={currency} ingredients={rows.filter((r) => !r.archived).map((r) => ({ id: r.ingredientId, name: r.name }))} defaultUnit={actor.massUnits === 'imperial' ? 'lb' : 'kg'} today={todayIso()} />
            </Card>
            <PriceImportForm currency={currency} />
          </div>
        ) : null}
      </div>
    </>
  );
}
