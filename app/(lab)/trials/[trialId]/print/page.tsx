import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getTrialOverview } from '@/lib/trials/queries';
import { getEntry } from '@/lib/notebook/queries';
import { TrialHeader } from '@/components/trials/TrialHeader';
import { VariantsTable } from '@/components/trials/VariantsTable';
import { CookList } from '@/components/trials/CookList';
import { NotebookView } from '@/components/notebook/NotebookView';
import { PrintButton } from '@/components/ui/PrintButton';
import { formatDateTime } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Print trial' };

/** The whole trial on paper: variants, cooks and every notebook entry, no navigation. */
export default async function TrialPrintPage({ params }: { params: Promise<{ trialId: string }> }) {
  const actor = await requirePage('trials.read');
  const trialId = pageId((await params).trialId);
  const trial = await orNotFound(getTrialOverview(actor, trialId));
  const entries = await Promise.all([getEntry(actor, trialId, null), ...trial.variants.map((v) => getEntry(actor, trialId, v.id))]);
  return (
    <article className="print:text-[11pt]">
      <div className="no-print mb-4 flex items-center gap-3">
        <PrintButton />
        <p className="text-sm text-rind-500">A4 and US Letter; links and navigation stay off the paper.</p>
      </div>
      <TrialHeader trial={trial} />
      <section className="mb-6 break-inside-avoid">
        <h2 className="mb-2 text-xl font-semibold">Variants</h2>
        <VariantsTable trialId={trial.id} variants={trial.variants} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} />
      </section>
      <section className="mb-6">
        <h2 className="mb-2 text-xl font-semibold">Trial notebook</h2>
        <NotebookView doc={entries[0].doc} />
      </section>
      {trial.variants.map((v, i) => (
        <section key={v.id} className="mb-6 break-before-page">
          <h2 className="mb-1 text-xl font-semibold">Variant {v.label}{v.isBase ? ' (base)' : ''}</h2>
          <p className="mb-3 text-sm text-rind-700">{v.description}</p>
          <CookList trialId={trial.id} cooks={v.cooks} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} canEdit={false} />
          <h3 className="mb-1 mt-4 font-semibold">Notes</h3>
          <NotebookView doc={entries[i + 1].doc} />
        </section>
      ))}
      <footer className="mt-8 border-t border-rind-300 pt-2 text-xs text-rind-500">
        Printed from Setwell on {formatDateTime(new Date())}. Predictions are estimates for product development; local food-safety codes and licensed practice govern.
      </footer>
    </article>
  );
}
