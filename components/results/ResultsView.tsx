import type { PanelAnalysis } from '@/lib/results/analysis';
import { formatP } from '@/lib/results/analysis';
import { Notice } from '@/components/ui/Notice';
import { MeansChart, JarChart, CountChart, ProfileChart, PenaltyChart } from './Charts';

const SOURCE_LABEL = { treatments: 'Samples', blocks: 'Assessors', error: 'Error', total: 'Total' } as const;
const n2 = (x: number | null | undefined, d = 2) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(d));

function VerdictBox({ verdict }: { verdict: { headline: string; differs: boolean | null; cautions: string[] } }) {
  return (
    <div className={`rounded-lg px-4 py-3 ring-1 ring-inset ${verdict.differs ? 'bg-leaf-50 ring-leaf-100' : 'bg-pith-50 ring-pith-300'}`} data-testid="verdict">
      <p className="font-medium text-rind-900">{verdict.headline}</p>
      {verdict.cautions.map((c) => <p key={c} className="mt-1 text-sm text-amberline-700">⚠ {c}</p>)}
    </div>
  );
}

/** The analysis of one session, for staff (unblinded). */
export function ResultsView({ analysis }: { analysis: PanelAnalysis }) {
  return (
    <div className="space-y-8">
      {analysis.attributes.length > 1 ? (
        <section className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Attribute profile">
          <h2 className="text-xl font-semibold">Profile</h2>
          <ProfileChart
            attributes={analysis.attributes.map((a) => a.attribute.name)}
            samples={analysis.attributes[0].descriptive.map((d) => d.label)}
            means={Object.fromEntries(analysis.attributes.map((a) => [a.attribute.name, Object.fromEntries(a.descriptive.map((d) => [d.label, d.mean]))]))}
          />
        </section>
      ) : null}
      {analysis.attributes.map((a) => {
        const labels = a.descriptive.map((d) => d.label);
        const scaleMax = a.attribute.purpose === 'liking' ? 9 : a.attribute.purpose === 'just-about-right' ? 5 : 10;
        const scaleMin = a.attribute.purpose === 'intensity' ? 0 : 1;
        return (
          <section key={a.attribute.id} aria-labelledby={`att-${a.attribute.id}`} className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
            <h2 id={`att-${a.attribute.id}`} className="text-xl font-semibold">{a.attribute.name}</h2>
            <div className="mt-3"><VerdictBox verdict={a.verdict} /></div>
            <div className="mt-4 grid gap-6 lg:grid-cols-2">
              <table className="w-full text-sm" data-testid="summary-table">
                <thead className="text-left text-xs uppercase tracking-wider text-rind-500">
                  <tr><th scope="col">Sample</th><th scope="col">n</th><th scope="col">Mean</th><th scope="col">95 % CI</th><th scope="col">SD</th><th scope="col">Group</th></tr>
                </thead>
                <tbody className="divide-y divide-pith-200">
                  {a.descriptive.map((d) => (
                    <tr key={d.label}>
                      <th scope="row" className="py-1.5 text-left">{d.label}</th>
                      <td className="tabular-nums">{d.n}</td>
                      <td className="tabular-nums">{n2(d.mean)}</td>
                      <td className="tabular-nums">{d.confidenceInterval ? `${n2(d.confidenceInterval.lower)} – ${n2(d.confidenceInterval.upper)}` : '—'}</td>
                      <td className="tabular-nums">{n2(d.standardDeviation)}</td>
                      <td className="font-mono">{a.comparison.letters[d.label] ?? '—'}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
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
            <details className="mt-3 text-sm">
              <summary className="cursor-pointer font-medium text-damson-800">ANOVA table</summary>
              <table className="mt-2 w-full max-w-xl text-sm">
                <thead className="text-left text-xs uppercase tracking-wider text-rind-500"><tr><th scope="col">Source</th><th scope="col">SS</th><th scope="col">df</th><th scope="col">MS</th><th scope="col">F</th><th scope="col">p</th></tr></thead>
                <tbody>
                  {a.anova.rows.map((r) => (
                    <tr key={r.source}><th scope="row" className="text-left font-normal">{SOURCE_LABEL[r.source]}</th><td className="tabular-nums">{n2(r.sumOfSquares, 3)}</td><td>{r.df}</td><td className="tabular-nums">{n2(r.meanSquare, 3)}</td><td className="tabular-nums">{n2(r.f, 3)}</td><td>{r.p === null ? '—' : formatP(r.p)}</td></tr>
                  ))}
                </tbody>
              </table>
              {a.anova.message ? <p className="mt-1 text-xs text-rind-500">{a.anova.message}</p> : null}
            </details>
            {a.penalty ? (
              <div className="mt-4">
                <h3 className="font-semibold">Just-about-right and its penalties</h3>
                <JarChart title={a.attribute.name} rows={analysis.jarShares.filter((r) => r.attributeId === a.attribute.id)} />
                <PenaltyChart title={a.attribute.name} tooLittle={a.penalty.groups.tooLittle.weightedPenalty} tooMuch={a.penalty.groups.tooMuch.weightedPenalty} />
                <table className="mt-2 text-sm">
                  <thead className="text-left text-xs uppercase tracking-wider text-rind-500"><tr><th scope="col">Group</th><th scope="col">Share</th><th scope="col">Mean liking</th><th scope="col">Mean drop</th><th scope="col">Weighted penalty</th></tr></thead>
                  <tbody>
                    {(['tooLittle', 'justAboutRight', 'tooMuch'] as const).map((g) => {
                      const x = a.penalty!.groups[g];
                      return (
                        <tr key={g}><th scope="row" className="pr-4 text-left font-normal">{g === 'tooLittle' ? 'Too little' : g === 'tooMuch' ? 'Too much' : 'Just about right'}</th><td className="tabular-nums">{(100 * x.share).toFixed(0)} %{x.largeEnoughToInterpret || g === 'justAboutRight' ? '' : ' (under 20 %)'}</td><td className="tabular-nums">{n2(x.meanLiking)}</td><td className="tabular-nums">{n2(x.meanDrop)}</td><td className="tabular-nums">{n2(x.weightedPenalty)}</td></tr>
                      );
                    })}
                  </tbody>
                </table>
                <p className="mt-1 text-xs text-rind-500">Groups under 20 % of tasters are not interpreted ({a.penalty.thresholdSource}). Changing sugar changes keeping quality, not only taste: check the water activity and cautions before acting on “too sweet”.</p>
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
