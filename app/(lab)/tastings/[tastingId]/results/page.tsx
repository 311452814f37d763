import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getTastingResults } from '@/lib/results/queries';
import { TASTING_STATE_LABELS } from '@/lib/tastings/vocabulary';
import { PageHeader } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { buttonClass } from '@/components/ui/Button';
import { ResultsView } from '@/components/results/ResultsView';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Tasting results' };

/** Results unblind the samples: staff only (tastings.read), never reachable from a seat token. */
export default async function TastingResultsPage({ params, searchParams }: { params: Promise<{ tastingId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePage('tastings.read');
  const id = pageId((await params).tastingId);
  // Penalty analysis is per sample; the pooled view is an explicit option (?penalty=pooled), anything else is ignored.
  const pooled = (await searchParams).penalty === 'pooled';
  const { session, analysis, data } = await orNotFound(getTastingResults(actor, id, { pooledPenalty: pooled }));
  const partial = data.seatCount - data.submittedSeats;
  return (
    <>
      <p className="text-sm text-rind-500"><Link href={`/tastings/${id}`} className="underline-offset-2 hover:underline">Back to the tasting</Link></p>
      <PageHeader
        title={`Results: ${session.title}`}
        lead={`${TASTING_STATE_LABELS[session.state]} · ${data.seatCount} seats, ${data.submittedSeats} submitted`}
        actions={
          <div className="flex flex-wrap gap-2">
            <a href={`/api/v1/tastings/${id}/answers.csv`} className={buttonClass('secondary')}>Raw answers (CSV)</a>
            <a href={`/api/v1/tastings/${id}/summary.csv`} className={buttonClass('ghost')}>Means (CSV)</a>
            <a href={`/api/v1/tastings/${id}/summary.csv?table=anova`} className={buttonClass('ghost')}>ANOVA (CSV)</a>
            {analysis.attributes.some((a) => a.penalties) ? <a href={`/api/v1/tastings/${id}/summary.csv?table=penalty`} className={buttonClass('ghost')}>Penalties (CSV)</a> : null}
            {analysis.triangle ? <a href={`/api/v1/tastings/${id}/summary.csv?table=triangle`} className={buttonClass('ghost')}>Triangle (CSV)</a> : null}
            {analysis.ranking ? <a href={`/api/v1/tastings/${id}/summary.csv?table=ranking`} className={buttonClass('ghost')}>Ranking (CSV)</a> : null}
          </div>
        }
      />
      <section className="mb-6 rounded-card bg-pith-50 p-4 text-sm ring-1 ring-pith-300" aria-label="Samples">
        <p className="font-medium">Samples (unblinded)</p>
        <ul className="mt-1 grid gap-1 sm:grid-cols-2">
          {session.samples.map((s) => <li key={s.sampleId}><strong>{s.variantLabel}</strong>{s.code ? ` (code ${s.code})` : ''} — {s.variantDescription}</li>)}
        </ul>
      </section>
      {session.state !== 'closed' ? <div className="mb-4"><Notice tone="warning">The tasting is still taking answers: these results will change.</Notice></div> : null}
      {partial > 0 ? <div className="mb-4"><Notice tone="info">{partial} seat{partial === 1 ? '' : 's'} did not submit; their answers so far are included, and the analysis adjusts for the missing cells.</Notice></div> : null}
      <ResultsView analysis={analysis} pooledPenalty={{ showHref: `/tastings/${id}/results?penalty=pooled`, hideHref: `/tastings/${id}/results` }} />
    </>
  );
}
