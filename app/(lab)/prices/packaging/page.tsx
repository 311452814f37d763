import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { costSettings, packagingItemList, packFormatList } from '@/lib/pricing/queries';
import { formatMoney } from '@/lib/pricing/money';
import { perPieceText } from '@/lib/pricing/display';
import { PACKAGING_KIND_LABELS } from '@/lib/pricing/vocabulary';
import { formatDate, todayIso } from '@/lib/format/dates';
import { PageHeader, Card, EmptyState } from '@/components/ui/Card';
import { TableBox } from '@/components/ui/TableBox';
import { NoCurrencyNotice, PriceTabs } from '@/components/pricing/PriceViews';
import { PackagingItemForm } from '@/components/pricing/PackagingItemForm';
import { PackagingPriceForm } from '@/components/pricing/PackagingPriceForm';
import { PackFormatForm } from '@/components/pricing/PackFormatForm';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Packaging and pack formats' };

const TD = 'px-4 py-3 align-top';

function share(pieces: number, perJars: number): string {
  return perJars === 1 ? `${pieces} per jar` : `${pieces} per ${perJars} jars`;
}

export default async function PackagingPage() {
  const actor = await requirePage('prices.read');
  const { currency } = await costSettings(actor.workspaceId);
  const [items, formats] = await Promise.all([packagingItemList(actor), packFormatList(actor)]);
  const canWrite = can(actor.role, 'prices.write');
  const pickable = items.filter((i) => !i.archived).map((i) => ({ id: i.id, name: i.name }));
  const unitPrice = new Map(items.map((i) => [i.id, i.current ? i.current.packPriceMinor / i.current.piecesPerPack : null]));
  return (
    <>
      <PageHeader title="Packaging and pack formats" lead={`Jars, lids, labels and cases with their dated prices${currency ? ` in ${currency}` : ''}, and the pack formats formulas and production versions are costed in.`} />
      <PriceTabs current="packaging" />
      <div className="space-y-6">
        {currency ? null : <NoCurrencyNotice canChoose={can(actor.role, 'costs.settings')} />}
        <Card title="Pack formats">
          {formats.length === 0 ? (
            <EmptyState title="No pack formats yet">A pack format is a jar with its net fill and the packaging that goes with it, e.g. a 340 g jar with lid, label and a share of a case of 12.</EmptyState>
          ) : (
            <ul className="space-y-4">
              {formats.map((f) => {
                const known = f.items.map((i) => unitPrice.get(i.packagingItemId));
                const total = known.every((v) => v != null) ? f.items.reduce((sum, i, k) => sum + (known[k] as number) * (i.pieces / i.perJars), 0) : null;
                return (
                  <li key={f.id} className="rounded-lg p-3 ring-1 ring-pith-300">
                    <h3 className="font-semibold">{f.name}{f.archived ? ' (archived)' : ''}</h3>
                    <p className="text-sm text-rind-600">
                      Net fill {f.netFillG} g · packaging per jar {currency ? (total === null ? 'incomplete: a packaging price is missing' : formatMoney(total, currency, 2)) : '—'}
                    </p>
                    {f.items.length ? (
                      <ul className="mt-2 list-disc pl-5 text-sm">
                        {f.items.map((i) => <li key={i.packagingItemId}>{i.name}: {share(i.pieces, i.perJars)}</li>)}
                      </ul>
                    ) : <p className="mt-2 text-sm text-rind-500">No packaging listed.</p>}
                    {canWrite ? (
                      <details className="mt-3">
                        <summary className="cursor-pointer text-sm font-medium text-damson-700">Edit {f.name}</summary>
                        <div className="mt-3"><PackFormatForm items={pickable} format={f} /></div>
                      </details>
                    ) : null}
                  </li>
                );
              })}
            </ul>
          )}
        </Card>
        <Card title="Packaging items">
          {items.length === 0 ? (
            <EmptyState title="No packaging yet">Add the jar, lid, label and case you fill into, then their prices.</EmptyState>
          ) : (
            <TableBox label="Packaging prices" framed={false}>
              <table className="min-w-full divide-y divide-pith-300 text-sm" data-testid="packaging-table">
                <caption className="sr-only">Packaging items and the price in force today{currency ? `, in ${currency}` : ''}</caption>
                <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
                  <tr>
                    <th scope="col" className="px-4 py-3">Item</th>
                    <th scope="col" className="px-4 py-3">Kind</th>
                    <th scope="col" className="px-4 py-3">Pack price</th>
                    <th scope="col" className="px-4 py-3">Per piece</th>
                    <th scope="col" className="px-4 py-3">Since</th>
                    <th scope="col" className="px-4 py-3">Supplier</th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-pith-200">
                  {items.map((i) => (
                    <tr key={i.id} className={i.archived ? 'text-rind-400' : ''}>
                      <th scope="row" className={`${TD} text-left font-medium`}>
                        <Link href={`/prices/packaging/${i.id}`} className="inline-flex min-h-10 items-center text-damson-700 underline-offset-2 hover:underline">{i.name}</Link>
                      </th>
                      <td className={TD}>{PACKAGING_KIND_LABELS[i.kind]}</td>
                      {i.current && currency ? (
                        <>
                          <td className={`${TD} whitespace-nowrap`}>{formatMoney(i.current.packPriceMinor, currency)} for {i.current.piecesPerPack}</td>
                          <td className={`${TD} whitespace-nowrap`}>{perPieceText(i.current.packPriceMinor, i.current.piecesPerPack, currency)}</td>
                          <td className={`${TD} whitespace-nowrap`}>{formatDate(i.current.validFrom)}</td>
                          <td className={TD}>{i.current.supplier ?? '—'}</td>
                        </>
                      ) : (
                        <td className={`${TD} text-rind-500`} colSpan={4}>No price in force today</td>
                      )}
                    </tr>
                  ))}
                </tbody>
              </table>
            </TableBox>
          )}
        </Card>
        {canWrite ? (
          <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
            <Card title="Add a packaging item"><PackagingItemForm /></Card>
            {currency && pickable.length ? <Card title="Add a packaging price"><PackagingPriceForm currency={currency} items={pickable} today={todayIso()} /></Card> : null}
            <Card title="Add a pack format"><PackFormatForm items={pickable} /></Card>
          </div>
        ) : null}
      </div>
    </>
  );
}
