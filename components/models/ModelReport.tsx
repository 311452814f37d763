import { formatDate } from '@/lib/format/dates';
import { formatP } from '@/lib/results/words';
import type { ModelPageData } from '@/lib/modelling/page-query';
import { runsNeeded } from '@/lib/modelling/fit';
import {
  FACTOR_INFO,
  MODEL_FACTORS,
  MODEL_KIND_LABELS,
  PECTIN_FAMILY_LABELS,
  familySlug,
  inFactorWords,
  termInWords,
  type ModelKindKey,
} from '@/lib/modelling/schema';
import { TableBox } from '@/components/ui/TableBox';
import { EmptyState } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { buttonClass } from '@/components/ui/Button';
import { CELL, HEAD, NUM, NUM_TH, TABLE, TH } from '@/components/results/DataTable';
import { ContourPlot } from './ContourPlot';
import { ResidualCharts } from './ResidualCharts';

const select = 'block w-full rounded-lg bg-white px-3 py-2 text-sm ring-1 ring-inset ring-rind-300';
const n = (x: number | null | undefined, d: number) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(d));
const KINDS: ModelKindKey[] = ['main_effects', 'two_factor_interactions', 'full_quadratic'];

export function ModelReport({ data }: { data: ModelPageData }) {
  const { family, dataset, response, factors } = data;
  const slug = familySlug(family);
  const pickedIds = data.trials.filter((t) => t.selected).map((t) => t.id);
  const allPicked = pickedIds.length === data.trials.length;
  const trialQuery = allPicked ? '' : pickedIds.map((id) => `trials=${id}`).join('&');
  return (
    <div className="space-y-8">
      <form method="get" aria-label="Choose the data and the model" className="grid grid-cols-1 gap-4 rounded-card bg-pith-50 p-4 ring-1 ring-pith-300 lg:grid-cols-2">
        <fieldset className="min-w-0">
          <legend className="mb-1 text-sm font-medium text-rind-700">Trials in the data set</legend>
          <ul className="space-y-1 text-sm">
            {data.trials.map((t) => (
              <li key={t.id}>
                <label className="flex items-start gap-2">
                  <input type="checkbox" name="trials" value={t.id} defaultChecked={t.selected} className="mt-1" />
                  <span className="min-w-0 break-words">{t.code} · {formatDate(t.date)} · {t.title} ({t.variants} variant{t.variants === 1 ? '' : 's'})</span>
                </label>
              </li>
            ))}
          </ul>
        </fieldset>
        <div className="grid min-w-0 grid-cols-1 gap-3 sm:grid-cols-2">
          <label className="text-sm">
            <span className="mb-1 block font-medium text-rind-700">Response</span>
            <select name="response" defaultValue={response?.key ?? ''} className={select}>
              {dataset.responses.map((r) => <option key={r.key} value={r.key}>{r.name}</option>)}
            </select>
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-medium text-rind-700">Model</span>
            <select name="kind" defaultValue={data.kind ?? ''} className={select}>
              <option value="">The largest the data allows</option>
              {KINDS.map((k) => <option key={k} value={k}>{MODEL_KIND_LABELS[k]}</option>)}
            </select>
          </label>
          {data.contour ? (
            <>
              <label className="text-sm">
                <span className="mb-1 block font-medium text-rind-700">Contour across</span>
                <select name="x" defaultValue={data.contour.x} className={select}>
                  {factors.map((f) => <option key={f} value={f}>{FACTOR_INFO[f].name}</option>)}
                </select>
              </label>
              <label className="text-sm">
                <span className="mb-1 block font-medium text-rind-700">Contour up</span>
                <select name="y" defaultValue={data.contour.y} className={select}>
                  {factors.map((f) => <option key={f} value={f}>{FACTOR_INFO[f].name}</option>)}
                </select>
              </label>
            </>
          ) : null}
          <div className="sm:col-span-2"><button type="submit" className={buttonClass('primary')}>Fit</button></div>
        </div>
      </form>

      <section aria-labelledby="dataset-title">
        <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="dataset-title" className="text-xl font-semibold">Data set: {dataset.rows.length} variant{dataset.rows.length === 1 ? '' : 's'}</h2>
          <a href={`/api/v1/models/${slug}/dataset.csv${trialQuery ? `?${trialQuery}` : ''}`} className="text-sm text-damson-700 underline" download>Download the data set (CSV)</a>
        </div>
        <p className="mb-2 text-sm text-rind-600">Factors are computed from each variant’s formula; lab values are the mean of its cooks, tasting values the mean of its tasters (± standard deviation, number of values).</p>
        <TableBox label="Data set">
          <table className={TABLE} data-testid="model-dataset">
            <thead className={HEAD}>
              <tr>
                <th scope="col" className={TH}>Trial</th>
                <th scope="col" className={TH}>Variant</th>
                <th scope="col" className={TH}>Pectin</th>
                {MODEL_FACTORS.map((f) => <th key={f} scope="col" className={NUM_TH}>{FACTOR_INFO[f].name}<span className="block normal-case tracking-normal">{FACTOR_INFO[f].unit}</span></th>)}
                {dataset.responses.map((r) => <th key={r.key} scope="col" className={NUM_TH}>{r.name}<span className="block normal-case tracking-normal">{r.unit}</span></th>)}
              </tr>
            </thead>
            <tbody className="divide-y divide-pith-200">
              {dataset.rows.map((row) => (
                <tr key={row.variantId}>
                  <td className={`${CELL} whitespace-nowrap`}>{row.trialCode} · {formatDate(row.trialDate)}</td>
                  <td className={CELL}>{row.variantLabel}</td>
                  <td className={CELL}>{PECTIN_FAMILY_LABELS[row.pectinFamily]}</td>
                  {MODEL_FACTORS.map((f) => <td key={f} className={NUM}>{n(row.factors[f], FACTOR_INFO[f].decimals)}</td>)}
                  {dataset.responses.map((r) => {
                    const v = row.responses[r.key];
                    return <td key={r.key} className={`${NUM} whitespace-nowrap`}>{v ? `${n(v.mean, r.decimals)}${v.sd !== null ? ` ± ${n(v.sd, r.decimals)}` : ''} (${v.n})` : '—'}</td>;
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
        {dataset.excluded.length ? (
          <details className="mt-2 text-sm text-rind-600">
            <summary>{dataset.excluded.length} variant{dataset.excluded.length === 1 ? '' : 's'} left out</summary>
            <ul className="mt-1 list-disc pl-5">{dataset.excluded.map((e) => <li key={e.variantId}>{e.trialCode} {e.variantLabel}: {e.reason}</li>)}</ul>
          </details>
        ) : null}
      </section>

      <ModelSection data={data} slug={slug} trialQuery={trialQuery} />
    </div>
  );
}

function ModelSection({ data, slug, trialQuery }: { data: ModelPageData; slug: string; trialQuery: string }) {
  const { response, fit, factors } = data;
  if (!response) return <EmptyState title="Nothing measured or tasted yet">Record cooks or run a tasting of these variants; each measure becomes a response to model.</EmptyState>;
  if (factors.length === 0) return <EmptyState title="No factor varies">Every variant has the same sugar ratio, solids, pectin and acid. Plan a trial that changes them.</EmptyState>;
  if (!fit) return null;
  if (!fit.ok) {
    const needed = fit.unfitted.runsNeeded;
    return (
      <EmptyState title={`Too few variants to model ${response.name.toLowerCase()}`}>
        {fit.unfitted.reason} {needed > 0 ? `Cook and test ${needed} more variant${needed === 1 ? '' : 's'} that change ${factors.map((f) => FACTOR_INFO[f].name.toLowerCase()).join(', ')}. A full quadratic in ${factors.length} factor${factors.length === 1 ? '' : 's'} needs ${runsNeeded(factors.length, 'full_quadratic')}.` : ''}
      </EmptyState>
    );
  }
  const model = fit.model;
  const s = model.surface;
  const f = s.fit;
  const warnings = f.warnings.map((w) => inFactorWords(w.message));
  const labels = data.dataset.rows.filter((r) => r.responses[response.key] !== undefined).map((r) => `${r.trialCode} ${r.variantLabel}`);
  const coefficientsHref = `/api/v1/models/${slug}/coefficients.csv?response=${encodeURIComponent(response.key)}${data.kind ? `&kind=${data.kind}` : ''}${trialQuery ? `&${trialQuery}` : ''}`;
  return (
    <>
      <section aria-labelledby="model-title">
        <h2 id="model-title" className="mb-2 text-xl font-semibold">{response.name}: {MODEL_KIND_LABELS[s.kind].toLowerCase()}</h2>
        <p className="mb-3 text-sm text-rind-600">
          Fitted by least squares on {f.observationCount} variants over {factors.map((x) => FACTOR_INFO[x].name.toLowerCase()).join(', ')}. {model.weighting} Coefficients are per coded unit: each factor runs from −1 at the lowest value in the data to +1 at the highest, so their sizes compare.
        </p>
        {warnings.length ? (
          <div className="mb-3"><Notice tone="warning" title="Read the model with care"><ul className="list-disc pl-5">{warnings.map((w) => <li key={w}>{w}</li>)}</ul></Notice></div>
        ) : null}
        <dl className="mb-4 grid grid-cols-2 gap-3 text-sm sm:grid-cols-5" data-testid="model-summary">
          <div><dt className="text-rind-600">Variants</dt><dd className="text-lg font-semibold">{f.observationCount}</dd></div>
          <div><dt className="text-rind-600">R²</dt><dd className="text-lg font-semibold">{n(f.rSquared, 3)}</dd></div>
          <div><dt className="text-rind-600">Adjusted R²</dt><dd className="text-lg font-semibold">{n(f.adjustedRSquared, 3)}</dd></div>
          <div><dt className="text-rind-600">Predicted R² (PRESS)</dt><dd className="text-lg font-semibold">{n(f.predictedRSquared, 3)}</dd></div>
          <div>
            <dt className="text-rind-600">Residual SD</dt>
            <dd className="text-lg font-semibold" data-testid="model-residual-sd">{n(f.residualSdOnScale, response.decimals + 1)}</dd>
            {response.unit ? <dd className="text-xs text-rind-500">{response.unit}</dd> : null}
          </div>
        </dl>
        {f.weighted && f.residualStandardError !== null ? (
          <p className="mb-4 text-sm text-rind-600" data-testid="model-weighted-scatter">
            The residual SD is the typical miss of a variant’s mean, in the response’s own units. Weighed by the panels’ own spread, the misses are {n(f.residualStandardError, 2)} times the standard error each panel gives its mean (1 would mean the means scatter just as the panels predict); the intervals of predictions allow for this.
          </p>
        ) : null}
        <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
          <h3 className="font-semibold">Coefficients</h3>
          <a href={coefficientsHref} className="text-sm text-damson-700 underline" download>Download the coefficients (CSV)</a>
        </div>
        <TableBox label="Coefficients">
          <table className={TABLE} data-testid="model-coefficients">
            <thead className={HEAD}><tr><th scope="col" className={TH}>Term</th><th scope="col" className={NUM_TH}>Estimate</th><th scope="col" className={NUM_TH}>Standard error</th><th scope="col" className={NUM_TH}>t</th><th scope="col" className={NUM_TH}>p</th></tr></thead>
            <tbody className="divide-y divide-pith-200">
              {f.terms.map((t) => (
                <tr key={t.name}>
                  <th scope="row" className={`${CELL} text-left font-normal`}>{termInWords(t.name)}{t.aliasedWith.length ? <span className="block text-xs text-amberline-700">Cannot be told apart from {t.aliasedWith.map(termInWords).join(', ')}</span> : null}</th>
                  <td className={NUM}>{n(t.estimate, 4)}</td>
                  <td className={NUM}>{n(t.standardError, 4)}</td>
                  <td className={NUM}>{n(t.t, 2)}</td>
                  <td className={`${NUM} whitespace-nowrap`}>{t.p === null ? '—' : formatP(t.p)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      </section>

      <section aria-labelledby="anova-title">
        <h3 id="anova-title" className="mb-2 font-semibold">Analysis of variance</h3>
        <TableBox label="Analysis of variance">
          <table className={TABLE} data-testid="model-anova">
            <thead className={HEAD}><tr><th scope="col" className={TH}>Source</th><th scope="col" className={NUM_TH}>{f.weighted ? 'Weighted sum of squares' : 'Sum of squares'}</th><th scope="col" className={NUM_TH}>df</th><th scope="col" className={NUM_TH}>Mean square</th><th scope="col" className={NUM_TH}>F</th><th scope="col" className={NUM_TH}>p</th></tr></thead>
            <tbody className="divide-y divide-pith-200">
              {f.anova ? (
                <>
                  <AnovaRow name="Model" line={f.anova.regression} fValue={f.anova.f} p={f.anova.p} />
                  <AnovaRow name="Residual" line={f.anova.residual} />
                  {f.lackOfFit ? <AnovaRow name="  Lack of fit" line={f.lackOfFit.lackOfFit} fValue={f.lackOfFit.f} p={f.lackOfFit.p} /> : null}
                  {f.lackOfFit ? <AnovaRow name="  Pure error (replicates)" line={f.lackOfFit.pureError} /> : null}
                  {data.curvature ? <AnovaRow name="Curvature (centre against corners)" line={{ sumOfSquares: data.curvature.sumOfSquares, df: 1, meanSquare: data.curvature.sumOfSquares }} fValue={data.curvature.f} p={data.curvature.p} /> : null}
                  <AnovaRow name="Total" line={f.anova.total} />
                </>
              ) : <tr><td className={CELL} colSpan={6}>No residual degrees of freedom: the model passes through every run.</td></tr>}
            </tbody>
          </table>
        </TableBox>
        {f.weighted ? (
          <p className="mt-2 text-sm text-rind-600" data-testid="model-anova-weighted">
            The sums of squares are weighted: each variant’s squared miss counts n / s², its panel size over the spread of its scores, so they are not in the response’s units. The F tests and R² are worked from these weighted sums.
          </p>
        ) : null}
        <p className="mt-2 text-sm text-rind-600">
          {f.lackOfFit ? (f.lackOfFit.p !== null && f.lackOfFit.p < 0.05 ? 'Lack of fit is significant: the model misses a pattern the replicates show; try a larger model or look for an outlier. ' : 'No significant lack of fit: the model’s misses are about as large as the spread between replicate cooks. ') : 'No lack-of-fit test: no variant was repeated at the same formula. '}
          {data.curvature
            ? `Curvature: the ${data.curvature.factorialRuns} corner runs average ${n(Math.abs(data.curvature.factorialMean - data.curvature.centreMean), response.decimals)} ${data.curvature.factorialMean >= data.curvature.centreMean ? 'above' : 'below'} the ${data.curvature.centreRuns} centre runs (${formatP(data.curvature.p)}); ${data.curvature.p !== null && data.curvature.p < 0.05 ? 'the response bends, so square terms belong in the model.' : 'no clear sign that the response bends.'}`
            : 'No curvature test: it needs repeated centre points and corner runs.'}
        </p>
      </section>

      <section aria-labelledby="residuals-title">
        <h3 id="residuals-title" className="mb-2 font-semibold">Residuals</h3>
        <p className="mb-2 text-sm text-rind-600">Look for a funnel (spread growing with the fitted value), a curve, or a drift over time; points beyond ±3 are worth a second look at their cook or tasting.</p>
        <ResidualCharts points={f.fitted.map((fitted, i) => ({ label: labels[i] ?? '', fitted, standardized: f.standardizedResiduals[i], order: i + 1 }))} />
      </section>

      {data.contour ? (
        <section aria-labelledby="contour-title">
          <h3 id="contour-title" className="mb-2 font-semibold">Contour plot</h3>
          <ContourPlot surface={s} x={data.contour.x} y={data.contour.y} fixed={data.contour.fixed} responseName={response.name} decimals={response.decimals} />
        </section>
      ) : null}

      <section aria-labelledby="history-title">
        <h3 id="history-title" className="mb-2 font-semibold">How the model grew</h3>
        <p className="mb-2 text-sm text-rind-600">The same response refitted as each trial joined the data, in the order they were cooked.</p>
        <TableBox label="Model history">
          <table className={TABLE} data-testid="model-history">
            <thead className={HEAD}><tr><th scope="col" className={TH}>Trial added</th><th scope="col" className={NUM_TH}>Variants</th><th scope="col" className={TH}>Model</th><th scope="col" className={NUM_TH}>R²</th><th scope="col" className={NUM_TH}>Predicted R²</th></tr></thead>
            <tbody className="divide-y divide-pith-200">
              {data.history.map((h) => (
                <tr key={h.trialCode}>
                  <td className={CELL}>{h.trialCode} · {formatDate(h.trialDate)}<span className="block text-xs text-rind-500">{h.trialTitle}</span></td>
                  <td className={NUM}>{h.runs}</td>
                  <td className={CELL}>{h.kind ? MODEL_KIND_LABELS[h.kind] : h.note}</td>
                  <td className={NUM}>{n(h.rSquared, 3)}</td>
                  <td className={NUM}>{n(h.predictedRSquared, 3)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      </section>
    </>
  );
}

function AnovaRow({ name, line, fValue, p }: { name: string; line: { sumOfSquares: number; df: number; meanSquare: number | null }; fValue?: number | null; p?: number | null }) {
  return (
    <tr>
      <th scope="row" className={`${CELL} whitespace-pre text-left font-normal`}>{name}</th>
      <td className={NUM}>{n(line.sumOfSquares, 4)}</td>
      <td className={NUM}>{line.df}</td>
      <td className={NUM}>{n(line.meanSquare, 4)}</td>
      <td className={NUM}>{fValue === undefined ? '' : n(fValue, 2)}</td>
      <td className={`${NUM} whitespace-nowrap`}>{p === undefined ? '' : p === null ? '—' : formatP(p)}</td>
    </tr>
  );
}
