'use client';
// A client component, though it has no state: the server then sends the analysis as data and renders
// its HTML once, instead of also sending every table cell as a React Server Component element. That
// took about a quarter off the results page's server time under load (issue 14's bench). Its imports
// stay light: words and chart shapes, never the statistics (lib/results/words.ts).

import Link from 'next/link';
import type { TastingAnalysis } from '@/lib/results/analysis';
import { formatP } from '@/lib/results/words';
import type { PenaltyAnalysisResult } from '@/lib/stats';
import { SCALE_RANGES, groupByScale } from '@/lib/results/chart-data';
import { Notice } from '@/components/ui/Notice';
import { Disclosure } from '@/components/ui/Disclosure';
import { MeansChart, JarChart, CountChart, ProfileChart, PenaltyChart } from './Charts';
import { DataTable, CELL, HEAD, NUM, NUM_TH, TH } from './DataTable';
import { ANOVA_SOURCE_WORDS, PENALTY_GROUP_WORDS } from '@/lib/results/words';

const GROUP_LABELS = PENALTY_GROUP_WORDS;

/** One penalty table: a row per group of one sample (or of all samples pooled). */
function PenaltyRows({ sample, result }: { sample: string; result: PenaltyAnalysisResult }) {
  return (
    <>
      {(['tooLittle', 'justAboutRight', 'tooMuch'] as const).map((g, i) => {
        const x = result.groups[g];
        const small = g !== 'justAboutRight' && !x.largeEnoughToInterpret;
        return (
          <tr key={g} className={i === 0 ? 'border-t border-pith-300' : ''}>
            {i === 0 ? <th scope="rowgroup" rowSpan={3} className={`${CELL} text-left align-top font-semibold`}>{sample}<span className="block text-xs font-normal text-rind-500">n = {result.respondentCount}</span></th> : null}
            <th scope="row" className={`${CELL} text-left font-normal`}>{GROUP_LABELS[g]}</th>
            <td className={NUM}>{(100 * x.share).toFixed(0)} %</td>
            <td className={`${CELL} text-xs text-rind-500`}>{small ? 'under 20 %: not read' : ''}</td>
            <td className={NUM}>{n2(x.meanLiking)}</td>
            <td className={NUM}>{n2(x.meanDrop)}</td>
            <td className={NUM}>{n2(x.weightedPenalty)}</td>
          </tr>
        );
      })}
    </>
  );
}

function PenaltyTable({ caption, rows, testId }: { caption: string; rows: Array<{ sample: string; result: PenaltyAnalysisResult }>; testId: string }) {
  return (
    <DataTable testId={testId} caption={caption}>
      <thead className={HEAD}>
        <tr><th scope="col" className={TH}>Sample</th><th scope="col" className={TH}>Group</th><th scope="col" className={NUM_TH}>Share</th><th scope="col" className={TH}>Note</th><th scope="col" className={NUM_TH}>Mean liking</th><th scope="col" className={NUM_TH}>Mean drop</th><th scope="col" className={NUM_TH}>Weighted penalty</th></tr>
      </thead>
      <tbody>{rows.map((r) => <PenaltyRows key={r.sample} sample={r.sample} result={r.result} />)}</tbody>
    </DataTable>
  );
}

const SOURCE_LABEL = ANOVA_SOURCE_WORDS;
const n2 = (x: number | null | undefined, d = 2) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(d));

function VerdictBox({ verdict }: { verdict: { headline: string; differs: boolean | null; cautions: string[] } }) {
  return (
    <div className={`rounded-lg px-4 py-3 ring-1 ring-inset ${verdict.differs ? 'bg-leaf-50 ring-leaf-100' : 'bg-pith-50 ring-pith-300'}`} data-testid="verdict">
      <p className="font-medium text-rind-900">{verdict.headline}</p>
      {verdict.cautions.map((c) => <p key={c} className="mt-1 text-sm text-amberline-700">⚠ {c}</p>)}
    </div>
  );
}

/**
 * The analysis of one session, for staff (unblinded). `pooledPenalty` carries the links that switch
 * the pooled penalty analysis on and off (it is shown only when asked for).
 */
export function ResultsView({ analysis, pooledPenalty }: { analysis: TastingAnalysis; pooledPenalty?: { showHref: string; hideHref: string } }) {
  const profiles = groupByScale(analysis.attributes);
  return (
    <div className="space-y-8">
      {analysis.attributes.length > 1 ? (
        <section className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Attribute profile">
          <h2 className="text-xl font-semibold">Profile</h2>
          <p className="mt-1 text-sm text-rind-600">One chart per scale: means on different scales are never drawn on one axis.</p>
          <div className={`mt-3 grid gap-6 ${profiles.length > 1 ? 'lg:grid-cols-2' : ''}`}>
            {profiles.map((g) => (
              <div key={g.purpose}>
                <h3 className="font-medium">{g.scale.name}</h3>
                <ProfileChart
                  scale={g.scale}
                  base={g.purpose === 'just-about-right' ? 3 : undefined}
                  attributes={g.items.map((a) => a.attribute.name)}
                  samples={g.items[0].descriptive.map((d) => d.label)}
                  means={Object.fromEntries(g.items.map((a) => [a.attribute.name, Object.fromEntries(a.descriptive.map((d) => [d.label, d.mean]))]))}
                />
              </div>
            ))}
          </div>
        </section>
      ) : null}
      {analysis.attributes.map((a) => {
        const labels = a.descriptive.map((d) => d.label);
        const { min: scaleMin, max: scaleMax } = SCALE_RANGES[a.attribute.purpose];
        return (
          <section key={a.attribute.id} aria-labelledby={`att-${a.attribute.id}`} className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
            <h2 id={`att-${a.attribute.id}`} className="text-xl font-semibold">{a.attribute.name}</h2>
            <div className="mt-3"><VerdictBox verdict={a.verdict} /></div>
            <div className="mt-4 grid gap-6 lg:grid-cols-2">
              <DataTable testId="summary-table">
                <thead className={HEAD}>
                  <tr><th scope="col" className={TH}>Sample</th><th scope="col" className={TH}>Group</th><th scope="col" className={NUM_TH}>n</th><th scope="col" className={NUM_TH}>Mean</th><th scope="col" className={NUM_TH}>95 % CI</th><th scope="col" className={NUM_TH}>SD</th></tr>
                </thead>
                <tbody className="divide-y divide-pith-200">
                  {a.descriptive.map((d) => (
                    <tr key={d.label}>
                      <th scope="row" className={`${CELL} text-left`}>{d.label}</th>
                      {/* The group letters beside the sample: on a phone the table scrolls, and they are what a reader needs first. */}
                      <td className={`${CELL} font-mono`}>{a.comparison.letters[d.label] ?? '—'}</td>
                      <td className={NUM}>{d.n}</td>
                      <td className={NUM}>{n2(d.mean)}</td>
                      <td className={`${NUM} whitespace-nowrap`}>{d.confidenceInterval ? `${n2(d.confidenceInterval.lower)} – ${n2(d.confidenceInterval.upper)}` : '—'}</td>
                      <td className={NUM}>{n2(d.standardDeviation)}</td>
                    </tr>
                  ))}
                </tbody>
              </DataTable>
              <MeansChart
                title={a.attribute.name}
                labels={labels}
                means={a.descriptive.map((d) => d.mean)}
                intervals={a.descriptive.map((d) => (d.confidenceInterval ? [d.confidenceInterval.lower, d.confidenceInterval.upper] : null))}
                min={scaleMin}
                max={scaleMax}
                letters={labels.map((l) => a.comparison.letters[l] ?? '')}
              />
            </div>
            <p className="mt-2 text-xs text-rind-500">Samples sharing a letter are not shown to differ (Tukey HSD, α = 0.05). Means are raw; the ANOVA uses assessors as blocks (two-way, no interaction).</p>
            <Disclosure className="mt-3 text-sm" summaryClassName="cursor-pointer font-medium text-damson-800" summary="ANOVA table">
              <div className="mt-2 max-w-2xl">
                <DataTable>
                  <thead className={HEAD}><tr><th scope="col" className={TH}>Source</th><th scope="col" className={NUM_TH}>SS</th><th scope="col" className={NUM_TH}>df</th><th scope="col" className={NUM_TH}>MS</th><th scope="col" className={NUM_TH}>F</th><th scope="col" className={NUM_TH}>p</th></tr></thead>
                  <tbody className="divide-y divide-pith-200">
                    {a.anova.rows.map((r) => (
                      <tr key={r.source}><th scope="row" className={`${CELL} text-left font-normal`}>{SOURCE_LABEL[r.source]}</th><td className={NUM}>{n2(r.sumOfSquares, 3)}</td><td className={NUM}>{r.df}</td><td className={NUM}>{n2(r.meanSquare, 3)}</td><td className={NUM}>{n2(r.f, 3)}</td><td className={`${NUM} whitespace-nowrap`}>{r.p === null ? '—' : formatP(r.p)}</td></tr>
                    ))}
                  </tbody>
                </DataTable>
              </div>
              {a.anova.message ? <p className="mt-1 text-xs text-rind-500">{a.anova.message}</p> : null}
            </Disclosure>
            {a.penalties ? (
              <div className="mt-4 space-y-3">
                <h3 className="font-semibold">Just about right, and what each side costs in liking</h3>
                <JarChart title={a.attribute.name} rows={analysis.jarShares.filter((r) => r.attributeId === a.attribute.id)} />
                <PenaltyChart title={a.attribute.name} rows={a.penalties.map((p) => ({ label: p.label, tooLittle: p.result.groups.tooLittle.weightedPenalty, tooMuch: p.result.groups.tooMuch.weightedPenalty }))} />
                <PenaltyTable testId="penalty-table" caption="Penalty analysis, sample by sample" rows={a.penalties.map((p) => ({ sample: p.label, result: p.result }))} />
                <p className="text-xs text-rind-500">Each sample is analysed on its own: the drop is the liking of that sample’s “just about right” tasters minus the liking of its too-little or too-much tasters. Groups under 20 % of a sample’s tasters are not interpreted (common practice). Changing sugar changes keeping quality, not only taste: check the water activity and cautions before acting on “too sweet”.</p>
                {a.pooledPenalty ? (
                  <>
                    <PenaltyTable testId="pooled-penalty-table" caption="All samples pooled (for comparison only)" rows={[{ sample: 'All samples', result: a.pooledPenalty }]} />
                    <p className="text-xs text-amberline-700">Pooling mixes products: a penalty here may belong to one sample only, or to none. Read the per-sample tables first.</p>
                    {pooledPenalty ? <p className="text-sm"><Link href={pooledPenalty.hideHref} className="text-damson-700 underline">Hide the pooled analysis</Link></p> : null}
                  </>
                ) : pooledPenalty ? (
                  <p className="text-sm"><Link href={pooledPenalty.showHref} className="text-damson-700 underline">Also show all samples pooled</Link></p>
                ) : null}
              </div>
            ) : null}
          </section>
        );
      })}
      {analysis.triangle ? (
        <section className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
          <h2 className="text-xl font-semibold">Triangle test</h2>
          <div className="mt-3"><VerdictBox verdict={analysis.triangle.verdict} /></div>
          <CountChart label="Tasters" labels={['Picked the odd sample', 'Did not', 'Needed for a difference']} values={[analysis.triangle.result.correct, analysis.triangle.result.total - analysis.triangle.result.correct, analysis.triangle.result.minimumCorrectForDifference ?? 0]} ariaLabel="Triangle test outcome" />
          <p className="mt-2 text-xs text-rind-500">Exact binomial test with a guessing chance of one in three (ISO 4120). {analysis.triangle.result.discriminators ? `Estimated share of discriminators ${(100 * analysis.triangle.result.discriminators.estimate).toFixed(0)} %, upper limit ${(100 * analysis.triangle.result.discriminators.upperConfidenceLimit).toFixed(0)} %.` : ''}</p>
        </section>
      ) : null}
      {analysis.ranking ? (
        <section className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
          <h2 className="text-xl font-semibold">Ranking</h2>
          <div className="mt-3"><VerdictBox verdict={analysis.ranking.verdict} /></div>
          <CountChart label="Rank sum" labels={analysis.ranking.friedman.treatments} values={analysis.ranking.friedman.treatments.map((t) => analysis.ranking!.friedman.rankSums[t])} ariaLabel="Rank sums per sample (lower = ranked first more often)" />
          <p className="mt-2 text-xs text-rind-500">Friedman test with the tie correction; lower rank sum = put first more often.</p>
        </section>
      ) : null}
      {!analysis.attributes.length && !analysis.triangle && !analysis.ranking ? <Notice>No answers yet.</Notice> : null}
    </div>
  );
}
