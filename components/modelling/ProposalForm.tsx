'use client';

import { formatDate } from '@/lib/format/dates';
import { useMemo, useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { inputClass } from '@/components/ui/Field';
import { useFormAction } from '@/components/ui/useFormAction';
import { createProposalTrialAction } from '@/lib/trials/actions';
import { FACTOR_INFO, type FamilyModel, type ModelFactor } from '@/lib/modelling/schema';
import { intervalText, responseRange } from '@/lib/modelling/predict';
import { unitNote } from '@/lib/format/words';
import { costPerJarProblem, describePoint, pointsAround, proposalCosting, proposeFormulas, type FruitMinimum, type PointsAround, type ProposalBase, type ProposalOutcome, type ProposalRequest } from '@/lib/modelling/proposals';
import { fillMismatchOf, fillMismatchText, formatCost } from '@/lib/costing';
import type { EditorCostBasis } from '@/lib/costs/schema';
import { defaultDraft, GOAL_KIND_LABELS, readProposalDraft, type GoalDraft, type GoalKind, type ProposalDraft } from './proposal-draft';

const GOAL_KINDS = Object.keys(GOAL_KIND_LABELS) as GoalKind[];

function ErrorText({ id, message }: { id: string; message?: string }) {
  return message ? <p id={id} className="mt-1 text-xs text-ember-700">{message}</p> : null;
}

function NumberBox({ label, value, onChange, error, id }: { label: string; value: string; onChange: (v: string) => void; error?: boolean; id: string }) {
  return (
    <label className="block text-xs text-rind-600">
      {label}
      <input id={id} inputMode="decimal" value={value} aria-invalid={error || undefined} onChange={(e) => onChange(e.target.value)} className={`${inputClass} mt-1`} />
    </label>
  );
}

/**
 * "Propose a formula": goals per response, the ranges the search may use, the fruit minimum and the
 * pH window and, for users who may see prices, a cost ceiling per jar; the best formulas inside the
 * data's region with their predictions (and cost per jar); one click makes a trial of the proposal
 * and a few points around it. The search runs here, on the family's fitted surfaces; only the trial
 * is a request.
 */
export function ProposalForm({ model, base, formulaId, formulaName, fruitMinimum, canCreateTrial, cost }: {
  model: FamilyModel;
  base: ProposalBase;
  formulaId: string;
  formulaName: string;
  fruitMinimum: FruitMinimum | null;
  canCreateTrial: boolean;
  /** The day's prices and the formula's pack format; absent for users who may not see prices. */
  cost?: { basis: EditorCostBasis; packFormatId: string | null };
}) {
  const costing = useMemo(() => (cost ? proposalCosting(cost.basis, cost.packFormatId) : null), [cost]);
  const currency = costing?.currency ?? null;
  const costProblem = useMemo(() => (costing ? costPerJarProblem(base, costing) : null), [base, costing]);
  const fillMismatch = costing ? fillMismatchOf(costing.prices.packFormat, base.settings.jarNetFillG) : null;
  const router = useRouter();
  const [draft, setDraft] = useState<ProposalDraft>(() => defaultDraft(model, fruitMinimum?.value ?? null));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [result, setResult] = useState<{ outcome: ProposalOutcome; request: ProposalRequest; around: PointsAround[] } | null>(null);
  const [searchError, setSearchError] = useState<string>();
  const { pending, error: trialError, fields: trialFields, run } = useFormAction(createProposalTrialAction);

  const setGoal = (key: string, patch: Partial<GoalDraft>) => setDraft((d) => ({ ...d, goals: { ...d.goals, [key]: { ...d.goals[key], ...patch } } }));
  const setFactor = (name: ModelFactor, side: 'low' | 'high', value: string) => setDraft((d) => ({ ...d, factors: { ...d.factors, [name]: { ...d.factors[name], [side]: value } } }));

  function search() {
    setSearchError(undefined);
    const read = readProposalDraft(model, draft, currency);
    if (!read.ok) {
      setErrors(read.errors);
      return;
    }
    setErrors({});
    try {
      const outcome = proposeFormulas(model, base, read.request, costing);
      // The trial's points around each proposal, held to the cost ceiling as the proposal is.
      const ceiling = costing && read.request.costCeilingPerJarMinor !== undefined ? { costing, perJarMinor: read.request.costCeilingPerJarMinor } : undefined;
      const around = outcome.proposals.map((p) => pointsAround(model, base, p.point, read.request.factors, { ceiling }));
      setResult({ outcome, request: read.request, around });
    } catch (err) {
      setResult(null);
      setSearchError(err instanceof Error ? err.message : 'The search failed.');
    }
  }

  async function makeTrial(index: number) {
    if (!result) return;
    const proposal = result.outcome.proposals[index];
    const around = result.around[index].points;
    const res = await run({
      formulaId,
      title: `Proposal for ${formulaName}`.slice(0, 160),
      question: `Does the proposed formula (${describePoint(proposal.point)}) give the predicted result, and how do the points around it compare?`,
      // Plain objects: the optimiser's points have no prototype, which a server action cannot receive.
      points: [proposal.point, ...around].map((point) => ({ ...point })),
    });
    if (res?.ok) router.push(`/trials/${res.data.trialId}`);
  }

  const goalResponses = model.responses.filter((r) => r.key in draft.goals);
  return (
    <div className="space-y-6">
      <section aria-labelledby="goals-title" className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
        <h2 id="goals-title" className="text-lg font-semibold">Goals</h2>
        <p className="mt-1 text-sm text-rind-600">For each response, say what you want and what is still acceptable; importance weighs the goals against each other (1 to 10).</p>
        <ErrorText id="goals-error" message={errors.goals} />
        <div className="mt-3 space-y-3">
          {goalResponses.map((response) => {
            const g = draft.goals[response.key];
            const key = `goal.${response.key}`;
            const fieldId = (f: string) => `${key}.${f}`.replace(/[^a-zA-Z0-9]/g, '-');
            return (
              <fieldset key={response.key} className="rounded-lg bg-white p-3 ring-1 ring-pith-300">
                <legend className="px-1 text-sm font-medium">{response.name}{unitNote(response.name, response.unit) ? <span className="text-xs font-normal text-rind-500"> ({response.unit})</span> : null}</legend>
                <div className="grid grid-cols-2 gap-3 sm:grid-cols-6">
                  <label className="col-span-2 block text-xs text-rind-600">
                    Goal
                    <select value={g.kind} onChange={(e) => setGoal(response.key, { kind: e.target.value as GoalKind })} className={`${inputClass} mt-1`} aria-label={`Goal for ${response.name}`}>
                      {GOAL_KINDS.map((k) => <option key={k} value={k}>{GOAL_KIND_LABELS[k]}</option>)}
                    </select>
                  </label>
                  {g.kind !== 'none' ? (
                    <>
                      <NumberBox id={fieldId('low')} label={g.kind === 'maximise' ? 'Least acceptable' : g.kind === 'minimise' ? 'Fully satisfying' : 'Lowest acceptable'} value={g.low} onChange={(v) => setGoal(response.key, { low: v })} error={!!errors[`${key}.low`]} />
                      {g.kind === 'target' ? <NumberBox id={fieldId('target')} label="Target" value={g.target} onChange={(v) => setGoal(response.key, { target: v })} error={!!errors[`${key}.target`]} /> : null}
                      {g.kind === 'band' ? (
                        <>
                          <NumberBox id={fieldId('bandLow')} label="Band from" value={g.bandLow} onChange={(v) => setGoal(response.key, { bandLow: v })} error={!!errors[`${key}.bandLow`]} />
                          <NumberBox id={fieldId('bandHigh')} label="Band to" value={g.bandHigh} onChange={(v) => setGoal(response.key, { bandHigh: v })} error={!!errors[`${key}.bandHigh`]} />
                        </>
                      ) : null}
                      <NumberBox id={fieldId('high')} label={g.kind === 'maximise' ? 'Fully satisfying' : g.kind === 'minimise' ? 'Least acceptable' : 'Highest acceptable'} value={g.high} onChange={(v) => setGoal(response.key, { high: v })} error={!!errors[`${key}.high`]} />
                      <NumberBox id={fieldId('importance')} label="Importance" value={g.importance} onChange={(v) => setGoal(response.key, { importance: v })} error={!!errors[`${key}.importance`]} />
                    </>
                  ) : null}
                </div>
                {['low', 'target', 'bandLow', 'bandHigh', 'high', 'importance'].map((f) => <ErrorText key={f} id={`${fieldId(f)}-error`} message={errors[`${key}.${f}`]} />)}
              </fieldset>
            );
          })}
        </div>
      </section>

      <section aria-labelledby="limits-title" className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
        <h2 id="limits-title" className="text-lg font-semibold">Ranges and constraints</h2>
        <p className="mt-1 text-sm text-rind-600">The search stays inside these ranges and inside what the trials covered. For reduced-sugar work, lower the sugar ratio and the target soluble solids.</p>
        <div className="mt-3 grid grid-cols-1 gap-3 sm:grid-cols-2">
          {model.factors.map((name) => (
            <div key={name} className="rounded-lg bg-white p-3 ring-1 ring-pith-300">
              <p className="text-sm font-medium">{FACTOR_INFO[name].name} <span className="text-xs font-normal text-rind-500">({FACTOR_INFO[name].unit})</span></p>
              <div className="mt-1 grid grid-cols-2 gap-3">
                <NumberBox id={`factor-${name}-low`} label="Lowest" value={draft.factors[name]?.low ?? ''} onChange={(v) => setFactor(name, 'low', v)} error={!!errors[`factor.${name}.low`]} />
                <NumberBox id={`factor-${name}-high`} label="Highest" value={draft.factors[name]?.high ?? ''} onChange={(v) => setFactor(name, 'high', v)} error={!!errors[`factor.${name}.high`]} />
              </div>
              <ErrorText id={`factor-${name}-error`} message={errors[`factor.${name}.low`] ?? errors[`factor.${name}.high`]} />
            </div>
          ))}
          <div className="rounded-lg bg-white p-3 ring-1 ring-pith-300">
            <NumberBox id="fruit-minimum" label="Fruit at least (g per 1000 g of finished product)" value={draft.fruitMinimum} onChange={(v) => setDraft((d) => ({ ...d, fruitMinimum: v }))} error={!!errors.fruitMinimum} />
            <p className="mt-1 text-xs text-rind-500">{fruitMinimum ? fruitMinimum.basis : 'The formula’s rule set states no fruit minimum per 1000 g; enter your own if one applies.'}</p>
            <ErrorText id="fruit-minimum-error" message={errors.fruitMinimum} />
          </div>
          <div className="rounded-lg bg-white p-3 ring-1 ring-pith-300">
            <div className="grid grid-cols-2 gap-3">
              <NumberBox id="ph-low" label="pH at least" value={draft.phLow} onChange={(v) => setDraft((d) => ({ ...d, phLow: v }))} error={!!errors.ph} />
              <NumberBox id="ph-high" label="pH at most" value={draft.phHigh} onChange={(v) => setDraft((d) => ({ ...d, phHigh: v }))} error={!!errors.ph} />
            </div>
            <p className="mt-1 text-xs text-rind-500">Held on the model of measured pH. Above pH 4.6 a preserve needs a validated process; follow your local codes and licensed practice.</p>
            <ErrorText id="ph-error" message={errors.ph} />
          </div>
          {costing ? (
            <div className="rounded-lg bg-white p-3 ring-1 ring-pith-300">
              <NumberBox id="cost-ceiling" label={`Cost ceiling per jar${currency ? ` (${currency})` : ''}, optional`} value={draft.costCeiling} onChange={(v) => setDraft((d) => ({ ...d, costCeiling: v }))} error={!!errors.costCeiling} />
              <p className="mt-1 text-xs text-rind-500">
                {costProblem ?? `Ingredients and packaging of ${costing.prices.packFormat?.name ?? ''} at the prices of ${formatDate(costing.prices.asOf)}, as the formula’s cost panel shows them.`}
              </p>
              {fillMismatch ? <p className="mt-1 text-xs text-amberline-700" data-testid="proposal-cost-fill">{fillMismatchText(fillMismatch)}</p> : null}
              <ErrorText id="cost-ceiling-error" message={errors.costCeiling} />
            </div>
          ) : null}
        </div>
        <Button className="mt-4" type="button" onClick={search}>Find the best formula</Button>
        {Object.keys(errors).length ? <div className="mt-3"><Notice tone="danger">Some fields need attention; they are marked above. Nothing was searched.</Notice></div> : null}
        {searchError ? <div className="mt-3"><Notice tone="danger">{searchError}</Notice></div> : null}
      </section>

      {result ? (
        <section aria-labelledby="proposals-title" className="space-y-4" aria-live="polite">
          <h2 id="proposals-title" className="text-lg font-semibold">Proposals</h2>
          {result.outcome.notes.map((n) => <Notice key={n} tone="warning">{n}</Notice>)}
          {result.outcome.proposals.length === 0 ? <Notice tone="warning">{result.outcome.message ?? 'No proposal.'}</Notice> : null}
          {result.outcome.proposals.map((p, i) => (
            <article key={i} className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" data-testid="proposal">
              <h3 className="font-semibold">{i === 0 ? 'Best proposal' : `Proposal ${i + 1}`} <span className="text-sm font-normal text-rind-600">(overall desirability {p.desirability.toFixed(2)} of 1)</span></h3>
              <dl className="mt-2 grid grid-cols-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
                {model.factors.map((f) => (
                  <div key={f} className="min-w-0"><dt className="inline text-rind-600">{FACTOR_INFO[f].name}: </dt><dd className="inline font-medium">{p.point[f].toFixed(FACTOR_INFO[f].decimals)} {FACTOR_INFO[f].unit}</dd></div>
                ))}
                <div className="min-w-0"><dt className="inline text-rind-600">Fruit: </dt><dd className="inline font-medium">{p.fruitPer1000g.toFixed(0)} g per 1000 g{result.request.fruitMinimumPer1000g !== undefined ? ` (at least ${result.request.fruitMinimumPer1000g})` : ''}</dd></div>
                {p.costPerJarMinor !== null && currency ? <div className="min-w-0"><dt className="inline text-rind-600">Cost per jar: </dt><dd className="inline font-medium">{formatCost(p.costPerJarMinor, currency)}{result.request.costCeilingPerJarMinor !== undefined ? ` (at most ${formatCost(result.request.costCeilingPerJarMinor, currency)})` : ''}</dd></div> : null}
                {p.ph ? <div className="min-w-0"><dt className="inline text-rind-600">Predicted pH: </dt><dd className="inline font-medium">{p.ph.estimate.toFixed(2)}{p.ph.prediction ? ` (95 % prediction interval ${intervalText(p.ph.prediction, responseRange({ key: 'lab:measuredPh', scale: null }), 2)})` : ''}</dd></div> : null}
              </dl>
              <ul className="mt-3 space-y-1 text-sm">
                {p.responses.map((r) => (
                  <li key={r.key}>
                    <span className="text-rind-600">{r.name}:</span> <span className="font-semibold">{r.estimate.toFixed(r.decimals)}</span>
                    {r.prediction ? <span className="text-rind-600"> (95 % prediction interval {intervalText(r.prediction, responseRange({ key: r.key, scale: model.responses.find((m) => m.key === r.key)?.scale ?? null }), r.decimals)})</span> : null}
                  </li>
                ))}
              </ul>
              {canCreateTrial && result.around[i].overCeiling > 0 ? (
                <p className="mt-3 text-xs text-rind-600" data-testid="around-over-ceiling">
                  {result.around[i].overCeiling === 1 ? '1 point' : `${result.around[i].overCeiling} points`} around this proposal cost more per jar than the ceiling and are left out of its trial.
                </p>
              ) : null}
              {canCreateTrial ? (
                <Button className="mt-4" type="button" disabled={pending} onClick={() => void makeTrial(i)}>
                  {pending ? 'Creating the trial…' : 'Make a trial of this proposal'}
                </Button>
              ) : null}
            </article>
          ))}
          {trialError ? <Notice tone="danger">{trialError} {Object.values(trialFields).flat().join(' ')}</Notice> : null}
          <p className="text-xs text-rind-500">The trial gets the base formula as variant A, the proposal as B and up to four points around it (one factor a tenth of its range down or up), each inside what the trials covered and, with a cost ceiling, at or under it.</p>
        </section>
      ) : null}
    </div>
  );
}
