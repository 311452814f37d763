import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getTrialComparison } from '@/lib/results/trial-comparison';
import { LAB_MEASURE_LABELS } from '@/lib/results/comparison';
import { formatP } from '@/lib/results/words';
import { TrialHeader } from '@/components/trials/TrialHeader';
import { VariantsTable } from '@/components/trials/VariantsTable';
import { RecommendForm } from '@/components/results/RecommendForm';
import { FactorEffectsCard } from '@/components/results/FactorEffects';
import { DataTable, CELL, HEAD, NUM, NUM_TH, TH } from '@/components/results/DataTable';
import { Notice } from '@/components/ui/Notice';
import { formatDate } from '@/lib/format/dates';
import { trialCosts } from '@/lib/costs/queries';
import { FillMismatchNotice, variantCostTexts } from '@/components/costs/CostSummary';
import { CostAgainstLiking } from '@/components/costs/CostAgainstLiking';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Compare variants' };

const n2 = (x: number | null | undefined, d = 2) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(d));

export default async function ComparePage({ params }: { params: Promise<{ trialId: string }> }) {
  const actor = await requirePage('tastings.read');
  const c = await orNotFound(getTrialComparison(actor, pageId((await params).trialId)));
  const attributes = [...new Set(c.means.map((m) => m.attribute))];
  const labels = c.trial.variants.map((v) => v.label);
  const costs = can(actor.role, 'prices.read') ? await trialCosts(actor, c.trial.id) : null;
  return (
    <>
      <TrialHeader trial={c.trial} />
      <p className="-mt-3 mb-6 text-sm"><Link href={`/trials/${c.trial.id}`} className="text-damson-700 underline">Back to the trial</Link></p>
      {c.recommendation ? (
        <div className="mb-6"><Notice tone="success" title={`Recommended: variant ${c.recommendation.label}`}>{c.recommendation.rationale} — {c.recommendation.byName}, {formatDate(c.recommendation.at)}</Notice></div>
      ) : null}
      <section className="mb-6">
        <h2 className="mb-2 text-xl font-semibold">Predicted and measured</h2>
        <VariantsTable trialId={c.trial.id} variants={c.trial.variants} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} costPerJar={costs ? variantCostTexts(costs) : undefined} />
        {costs ? <div className="mt-2"><FillMismatchNotice results={costs.variants.map((v) => ({ label: `Variant ${v.label}`, result: v.result }))} testId="variant-cost-fill" /></div> : null}
      </section>
      <section className="mb-6" aria-labelledby="sensory-title">
        <h2 id="sensory-title" className="mb-2 text-xl font-semibold">What tasters said</h2>
        {c.sessions.length === 0 ? <p className="text-sm text-rind-600">No tasting with answers yet.</p> : null}
        {c.sessions.map((s) => (
          <div key={s.id} className="mb-3 rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
            <p className="font-medium"><Link href={`/tastings/${s.id}/results`} className="underline">{s.title}</Link></p>
            <ul className="mt-1 space-y-1 text-sm" data-testid="comparison-verdicts">
              {s.verdicts.map((v) => <li key={v.attribute}><strong>{v.attribute}:</strong> {v.verdict.headline}{v.verdict.cautions.length ? <span className="text-amberline-700"> ⚠ {v.verdict.cautions.join(' ')}</span> : null}</li>)}
            </ul>
          </div>
        ))}
        {attributes.length ? (
          <div className="mt-3"><DataTable testId="sensory-means">
            <thead className={HEAD}><tr><th scope="col" className={TH}>Attribute</th>{labels.map((l) => <th key={l} scope="col" className={NUM_TH}>{l}</th>)}</tr></thead>
            <tbody className="divide-y divide-pith-200">{attributes.map((a) => <tr key={a}><th scope="row" className={`${CELL} text-left font-normal`}>{a}</th>{labels.map((l) => <td key={l} className={NUM}>{n2(c.means.find((m) => m.attribute === a && m.label === l)?.mean)}</td>)}</tr>)}</tbody>
          </DataTable></div>
        ) : null}
      </section>
      {costs ? (
        <section className="mb-6" aria-labelledby="cost-liking-title">
          <h2 id="cost-liking-title" className="mb-2 text-xl font-semibold">Cost against liking</h2>
          <CostAgainstLiking costs={costs} means={c.means} />
        </section>
      ) : null}
      {c.effects.length ? (
        <section className="mb-6" aria-labelledby="effects-title">
          <h2 id="effects-title" className="mb-2 text-xl font-semibold">Factor effects</h2>
          <p className="mb-3 text-sm text-rind-600">Least-squares main effects on the variants’ mean scores: the change from the lowest to the highest level tried. Factors that changed together in every variant tasted cannot be told apart and get no effect of their own.</p>
          <div className="grid gap-4 lg:grid-cols-2">
            {c.effects.map((e) => <FactorEffectsCard key={e.attribute} effect={e} />)}
          </div>
        </section>
      ) : null}
      {c.correlations.length ? (
        <section className="mb-6" aria-labelledby="corr-title">
          <h2 id="corr-title" className="mb-2 text-xl font-semibold">Lab measurements against sensory means</h2>
          <DataTable>
            <thead className={HEAD}><tr><th scope="col" className={TH}>Attribute</th><th scope="col" className={TH}>Measure</th><th scope="col" className={NUM_TH}>r</th><th scope="col" className={NUM_TH}>n</th><th scope="col" className={NUM_TH}>p</th></tr></thead>
            <tbody className="divide-y divide-pith-200">{c.correlations.map((x) => <tr key={`${x.attribute}-${x.measure}`}><td className={CELL}>{x.attribute}</td><td className={CELL}>{LAB_MEASURE_LABELS[x.measure]}</td><td className={NUM}>{n2(x.result.r)}</td><td className={NUM}>{x.result.n}</td><td className={`${NUM} whitespace-nowrap`}>{formatP(x.result.p)}</td></tr>)}</tbody>
          </DataTable>
          <p className="mt-1 text-xs text-rind-500">Pearson correlation across variants; with this few variants, read it as a hint, not proof.</p>
        </section>
      ) : null}
      {can(actor.role, 'trials.write') ? (
        <RecommendForm trialId={c.trial.id} variants={c.trial.variants.map((v) => ({ id: v.id, label: v.label, description: v.description }))} current={c.recommendation ? { variantId: c.recommendation.variantId, rationale: c.recommendation.rationale } : null} />
      ) : null}
      {can(actor.role, 'promotion.request') ? (
        <p className="mt-4 text-sm"><Link href={`/trials/${c.trial.id}/promote`} className="font-medium text-damson-700 underline">Request promotion to production</Link> — the evidence on this page goes with it.</p>
      ) : null}
    </>
  );
}
