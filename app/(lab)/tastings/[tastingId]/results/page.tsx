import { Suspense } from 'react';
import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import type { Actor } from '@/lib/permissions';
import { analyseResults, loadResultsSetup, readAnswers } from '@/lib/results/queries';
import type { AnswerRead, ResultsSetup } from '@/lib/results/schema';
import { TASTING_STATE_LABELS } from '@/lib/tastings/vocabulary';
import { PageHeader } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { buttonClass } from '@/components/ui/Button';
import { ResultsView } from '@/components/results/ResultsView';
import { Skeleton } from '@/components/ui/Skeleton';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Tasting results' };

/** Results unblind the samples: staff only (tastings.read), never reachable from a seat token. */
export default async function TastingResultsPage({ params, searchParams }: { params: Promise<{ tastingId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePage('tastings.read');
  const id = pageId((await params).tastingId);
  // Penalty analysis is per sample; the pooled view is an explicit option (?penalty=pooled), anything else is ignored.
  const pooled = (await searchParams).penalty === 'pooled';
  // The tasting itself (or the 404) before anything is sent; the statistics stream in below. The
  // answers are read at the same time.
  const answers = readAnswers(actor, id);
  const setup = await orNotFound(loadResultsSetup(actor, id));
  const { session, tables } = setup;
  const partial = setup.seatCount - setup.submittedSeats;
  return (
    <>
      <p className="text-sm text-rind-500"><Link href={`/tastings/${id}`} className="underline-offset-2 hover:underline">Back to the tasting</Link></p>
      <PageHeader
        title={`Results: ${session.title}`}
        lead={`${TASTING_STATE_LABELS[session.state]} · ${setup.seatCount} seats, ${setup.submittedSeats} submitted`}
        actions={
          <div className="flex flex-wrap gap-2">
            <a href={`/api/v1/tastings/${id}/answers.csv`} className={buttonClass('secondary')}>Raw answers (CSV)</a>
            <a href={`/api/v1/tastings/${id}/summary.csv`} className={buttonClass('ghost')}>Means (CSV)</a>
            <a href={`/api/v1/tastings/${id}/summary.csv?table=anova`} className={buttonClass('ghost')}>ANOVA (CSV)</a>
            {tables.includes('penalty') ? <a href={`/api/v1/tastings/${id}/summary.csv?table=penalty`} className={buttonClass('ghost')}>Penalties (CSV)</a> : null}
            {tables.includes('triangle') ? <a href={`/api/v1/tastings/${id}/summary.csv?table=triangle`} className={buttonClass('ghost')}>Triangle (CSV)</a> : null}
            {tables.includes('ranking') ? <a href={`/api/v1/tastings/${id}/summary.csv?table=ranking`} className={buttonClass('ghost')}>Ranking (CSV)</a> : null}
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
      <Suspense fallback={<Skeleton what="the statistics" lines={8} />}>
        <Statistics actor={actor} setup={setup} pooled={pooled} answers={answers} />
      </Suspense>
    </>
  );
}

/**
 * The answers read and analysed while the page above is already on screen. It decides no 404 or
 * 403 (the page did, before streaming began; one decided here would go out as HTTP 200).
 */
async function Statistics({ actor, setup, pooled, answers }: { actor: Actor; setup: ResultsSetup; pooled: boolean; answers: AnswerRead }) {
  const analysis = await analyseResults(actor, setup, { pooledPenalty: pooled }, answers);
  const path = `/tastings/${setup.tastingId}/results`;
  return <ResultsView analysis={analysis} pooledPenalty={{ showHref: `${path}?penalty=pooled`, hideHref: path }} />;
}
