import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getServingSheet } from '@/lib/tastings/queries';
import { TASTING_METHOD_LABELS } from '@/lib/tastings/vocabulary';
import { PrintButton } from '@/components/ui/PrintButton';
import { EmptyState } from '@/components/ui/Card';
import { TableBox } from '@/components/ui/TableBox';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Serving sheet' };

/** For the kitchen only (tastings.run): which code is which variant, seat by seat, in serving order. */
export default async function ServingSheetPage({ params }: { params: Promise<{ tastingId: string }> }) {
  const actor = await requirePage('tastings.run');
  const sheet = await orNotFound(getServingSheet(actor, pageId((await params).tastingId)));
  return (
    <article>
      <div className="no-print mb-4 flex items-center gap-3">
        <PrintButton />
        <p className="text-sm text-rind-500">Keep this sheet in the kitchen: it unblinds the samples.</p>
      </div>
      <h1 className="text-2xl font-semibold">Serving sheet — {sheet.session.title}</h1>
      <p className="mb-4 text-sm text-rind-600">{TASTING_METHOD_LABELS[sheet.session.method]}. CONFIDENTIAL: do not show to tasters.</p>
      {sheet.session.method !== 'triangle' ? (
        <TableBox label="Codes" framed={false}>
          <table className="mb-6 text-sm">
            <caption className="text-left font-semibold">Codes</caption>
            <tbody>
              {sheet.samples.map((x) => <tr key={x.sampleId}><th scope="row" className="pr-4 text-left font-mono text-lg">{x.code}</th><td>Variant {x.variantLabel} — {x.variantDescription}</td></tr>)}
            </tbody>
          </table>
        </TableBox>
      ) : null}
      {sheet.seats.length === 0 ? (
        <EmptyState title="No seats yet">Seats are added as tasters join; reprint the sheet once everyone is seated.</EmptyState>
      ) : (
        <TableBox label="Serving sheet" framed={false}>
          <table className="w-full border-collapse text-sm" data-testid="serving-sheet">
            <thead><tr className="border-b border-rind-400 text-left"><th scope="col" className="py-1">Seat</th><th scope="col">Taster</th>{sheet.seats[0].cups.map((c) => <th key={c.position} scope="col">{c.position}</th>)}</tr></thead>
            <tbody>
              {sheet.seats.map((seat) => (
                <tr key={seat.seatNumber} className="border-b border-pith-300 break-inside-avoid">
                  <td className="py-1.5 tabular-nums">{seat.seatNumber}</td>
                  <td>{seat.displayName}</td>
                  {seat.cups.map((c) => <td key={c.position}><span className="font-mono text-base">{c.code}</span> <span className="text-xs text-rind-600">({c.variantLabel})</span></td>)}
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      )}
    </article>
  );
}
