import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { listFamilies } from '@/lib/modelling/queries';
import { PageHeader, EmptyState } from '@/components/ui/Card';
import { TableBox } from '@/components/ui/TableBox';
import { CELL, HEAD, NUM, NUM_TH, TABLE, TH } from '@/components/results/DataTable';
import { formatDate } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Models' };

/** The product families whose trials can be modelled. */
export default async function ModelsPage() {
  const actor = await requirePage('models.read');
  const families = await listFamilies(actor);
  return (
    <>
      <PageHeader
        title="Models"
        lead="What the workspace’s own trials say about how a product family behaves: how set, tartness and liking move with sugar, solids, pectin and acid. A family is one product class of one main fruit; its cooked and tasted variants from every trial pool into one data set."
      />
      {families.length === 0 ? (
        <EmptyState title="No cooked variants yet">Record cooks and tastings in trials; each product family appears here with its first cooked variant.</EmptyState>
      ) : (
        <TableBox label="Product families">
          <table className={TABLE} data-testid="model-families">
            <thead className={HEAD}>
              <tr><th scope="col" className={TH}>Product family</th><th scope="col" className={NUM_TH}>Trials</th><th scope="col" className={NUM_TH}>Cooked variants</th><th scope="col" className={TH}>Last cook</th></tr>
            </thead>
            <tbody className="divide-y divide-pith-200">
              {families.map((f) => (
                <tr key={f.slug}>
                  <th scope="row" className={`${CELL} text-left font-medium`}><Link href={`/models/${f.slug}`} className="text-damson-700 underline">{f.name}</Link></th>
                  <td className={NUM}>{f.trials}</td>
                  <td className={NUM}>{f.variants}</td>
                  <td className={CELL}>{f.lastCook ? formatDate(f.lastCook) : '—'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      )}
    </>
  );
}
