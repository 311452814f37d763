/** Server-rendered pieces of the price pages: the section tabs, the missing-currency notice and a price history table. */
import Link from 'next/link';
import type { ReactNode } from 'react';
import { Notice } from '@/components/ui/Notice';
import { TableBox } from '@/components/ui/TableBox';
import { formatDate, formatDateTime } from '@/lib/format/dates';

const TH = 'px-4 py-3';
const TD = 'px-4 py-3 align-top';

export function PriceTabs({ current }: { current: 'ingredients' | 'packaging' }) {
  const tab = (href: string, label: string, active: boolean) => (
    <Link href={href} aria-current={active ? 'page' : undefined}
      className={`inline-flex min-h-10 items-center rounded-lg px-3 text-sm font-medium ${active ? 'bg-damson-100 text-damson-900' : 'text-damson-700 hover:bg-pith-200'}`}>
      {label}
    </Link>
  );
  return (
    <nav aria-label="Prices" className="mb-6 flex flex-wrap gap-2">
      {tab('/prices', 'Ingredients', current === 'ingredients')}
      {tab('/prices/packaging', 'Packaging and pack formats', current === 'packaging')}
    </nav>
  );
}

export function NoCurrencyNotice({ canChoose }: { canChoose: boolean }) {
  return (
    <Notice tone="warning" title="No currency chosen yet">
      Every price is stated in the workspace’s one currency.{' '}
      {canChoose ? <Link href="/settings/costs" className="underline">Choose it in the cost settings</Link> : 'Ask an administrator to choose it in the cost settings.'}
      {' '}before entering prices.
    </Notice>
  );
}

export interface HistoryRow {
  id: string;
  validFrom: string;
  price: string;
  pack: string;
  unitPrice: string;
  supplier: string | null;
  entered: string;
  enteredByName: string;
  withdrawn: { at: string; by: string | null; reason: string | null } | null;
  /** The in-force point today. */
  current: boolean;
}

/** Newest first; withdrawn points stay visible, struck through, with who withdrew them and why. */
export function PriceHistoryTable({ rows, unitLabel, withdraw, label }: { rows: HistoryRow[]; unitLabel: string; withdraw?: (row: HistoryRow) => ReactNode; label: string }) {
  return (
    <TableBox label={label}>
      <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm">
        <caption className="sr-only">{label}</caption>
        <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
          <tr>
            <th scope="col" className={TH}>Valid from</th>
            <th scope="col" className={TH}>Pack price</th>
            <th scope="col" className={TH}>Pack</th>
            <th scope="col" className={TH}>{unitLabel}</th>
            <th scope="col" className={TH}>Supplier</th>
            <th scope="col" className={TH}>Entered</th>
            {withdraw ? <th scope="col" className={TH}><span className="sr-only">Actions</span></th> : null}
          </tr>
        </thead>
        <tbody className="divide-y divide-pith-200">
          {rows.map((r) => (
            <tr key={r.id} className={r.withdrawn ? 'text-rind-400' : ''}>
              <th scope="row" className={`${TD} text-left font-medium whitespace-nowrap`}>
                {formatDate(r.validFrom)}
                {r.current ? <span className="ml-2 rounded bg-leaf-50 px-1.5 py-0.5 text-xs text-leaf-700">in force today</span> : null}
              </th>
              <td className={`${TD} whitespace-nowrap ${r.withdrawn ? 'line-through' : ''}`}>{r.price}</td>
              <td className={`${TD} whitespace-nowrap`}>{r.pack}</td>
              <td className={`${TD} whitespace-nowrap`}>{r.unitPrice}</td>
              <td className={TD}>{r.supplier ?? '—'}</td>
              <td className={TD}>
                {formatDateTime(r.entered)} by {r.enteredByName}
                {r.withdrawn ? (
                  <p className="mt-1 text-ember-700">Withdrawn {formatDateTime(r.withdrawn.at)}{r.withdrawn.by ? ` by ${r.withdrawn.by}` : ''}: {r.withdrawn.reason}</p>
                ) : null}
              </td>
              {withdraw ? <td className={TD}>{r.withdrawn ? null : withdraw(r)}</td> : null}
            </tr>
          ))}
        </tbody>
      </table>
    </TableBox>
  );
}
