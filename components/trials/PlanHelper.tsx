'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { inputClass } from '@/components/ui/Field';
import { CENTRE_RUNS, planDesign, PlanError, SURFACE_DESIGNS, type DesignKind, type FactorSpec } from '@/lib/trials/plan';
import { FACTOR_LABELS, TRIAL_FACTORS, type TrialFactor } from '@/lib/trials/vocabulary';
import { planVariantsAction } from '@/lib/trials/actions';
import { useFormAction } from '@/components/ui/useFormAction';
import { readDecimal } from '@/lib/format/numbers';

type Draft = Record<TrialFactor, { on: boolean; low: string; high: string }>;

function suggest(base: number | null, factor: TrialFactor): { low: string; high: string } {
  if (base === null || base <= 0) return { low: '', high: '' };
  // Soluble solids move in points of Brix, not in proportion (±20 % of 60 °Brix is no jam).
  if (factor === 'target_solids') return { low: Math.max(base - 3, 1).toFixed(1), high: Math.min(base + 3, 99).toFixed(1) };
  const d = factor === 'sugar_ratio' ? 2 : 1;
  return { low: (base * 0.8).toFixed(d), high: (base * 1.2).toFixed(d) };
}

const DESIGN_CHOICES: Array<{ kind: DesignKind; label: string; hint: string }> = [
  { kind: 'full_factorial', label: 'Full factorial (2^k)', hint: 'Every combination of low and high; up to three factors.' },
  { kind: 'one_factor_at_a_time', label: 'One factor at a time', hint: 'Each factor low and high, the rest as in the base.' },
  { kind: 'central_composite_face_centred', label: 'Central composite, face-centred', hint: 'Corners, one factor at a time at low and high, and centre runs; every level stays within low…high. Two to four factors.' },
  { kind: 'central_composite_rotatable', label: 'Central composite, rotatable', hint: 'As face-centred, but the single-factor runs go beyond low and high so the prediction is equally good in every direction.' },
  { kind: 'box_behnken', label: 'Box–Behnken', hint: 'Each pair of factors at low and high with the rest at the centre, plus centre runs; no extreme corners. Three or four factors.' },
];

const designLabel = (kind: DesignKind) => DESIGN_CHOICES.find((d) => d.kind === kind)!.label;

/**
 * Lays out the variants before they are made: the same planRuns the server uses runs here,
 * so the preview is exactly what will be created.
 */
export function PlanHelper({ trialId, baseLevels }: { trialId: string; baseLevels: Record<TrialFactor, number | null> }) {
  const router = useRouter();
  const [kind, setKind] = useState<DesignKind>('full_factorial');
  const [centre, setCentre] = useState(false);
  const [centreRuns, setCentreRuns] = useState(String(CENTRE_RUNS.default));
  const [draft, setDraft] = useState<Draft>(() =>
    Object.fromEntries(TRIAL_FACTORS.map((f) => [f, { on: f === 'sugar_ratio', ...suggest(baseLevels[f], f) }])) as Draft,
  );
  const { pending: busy, error, fields, run } = useFormAction(planVariantsAction, { fieldPrefix: 'plan' });
  const [added, setAdded] = useState<string>();

  const specs: FactorSpec[] = TRIAL_FACTORS.filter((f) => draft[f].on).map((f) => ({ factor: f, low: readDecimal(draft[f].low) ?? Number.NaN, high: readDecimal(draft[f].high) ?? Number.NaN }));
  const surface = SURFACE_DESIGNS.includes(kind);
  const centreRunCount = Number(centreRuns);
  // Cheap to compute (at most 30 runs), so it is simply recomputed on every render.
  const preview = (() => {
    try {
      const { runs, warnings } = planDesign(kind, specs, { centrePoint: centre, centreRuns: centreRunCount, baseLevels: Object.fromEntries(Object.entries(baseLevels).filter(([, v]) => v !== null)) as Partial<Record<TrialFactor, number>> });
      return { ok: true as const, runs, warnings };
    } catch (err) {
      if (err instanceof PlanError) return { ok: false as const, message: err.message };
      throw err;
    }
  })();

  async function generate() {
    setAdded(undefined);
    const res = await run(trialId, surface ? { kind, factors: specs, centreRuns: centreRunCount } : { kind, factors: specs, centrePoint: centre });
    if (res?.ok) {
      const { created, skipped } = res.data;
      setAdded(`Added variants ${created.join(', ')}.${skipped.length ? ` Left out the runs already in the trial as ${skipped.join(', ')}.` : ''}`);
      router.refresh();
    }
  }

  return (
    <section aria-labelledby="plan-title" className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
      <h2 id="plan-title" className="text-lg font-semibold">Plan helper</h2>
      <p className="mt-1 text-sm text-rind-600">Choose the factors and their levels; the variants are the base formula with only those lines scaled.</p>
      <fieldset className="mt-4">
        <legend className="text-sm font-medium text-rind-700">Design</legend>
        <div className="mt-2 grid grid-cols-1 gap-1 text-sm sm:grid-cols-2">
          {DESIGN_CHOICES.map((d) => (
            <label key={d.kind} className="flex min-h-10 items-start gap-2 py-1">
              <input type="radio" name="design" className="mt-1" checked={kind === d.kind} onChange={() => setKind(d.kind)} />
              <span>{d.label}<span className="block text-xs text-rind-500">{d.hint}</span></span>
            </label>
          ))}
        </div>
        <div className="mt-2 text-sm">
          {surface ? (
            <label className="flex min-h-10 flex-wrap items-center gap-2">
              Centre runs (replicates of the centre)
              <input aria-label="Centre runs" inputMode="numeric" value={centreRuns} onChange={(e) => setCentreRuns(e.target.value)} className={`${inputClass} w-20`} />
            </label>
          ) : (
            <label className="flex min-h-10 items-center gap-2"><input type="checkbox" checked={centre} onChange={(e) => setCentre(e.target.checked)} /> Add a centre point</label>
          )}
        </div>
      </fieldset>
      <div className="mt-4 space-y-3">
        {TRIAL_FACTORS.map((f) => (
          <div key={f} className="grid items-end gap-3 rounded-lg bg-white p-3 ring-1 ring-pith-300 sm:grid-cols-[1fr_7rem_7rem]">
            <label className="flex min-h-10 items-center gap-2 text-sm">
              <input type="checkbox" checked={draft[f].on} onChange={(e) => setDraft({ ...draft, [f]: { ...draft[f], on: e.target.checked } })} />
              <span>
                <span className="font-medium">{FACTOR_LABELS[f].name}</span> <span className="text-rind-500">({FACTOR_LABELS[f].unit})</span>
                <span className="block text-xs text-rind-500">Base: {baseLevels[f] === null ? 'no such line in the base' : baseLevels[f]!.toFixed(f === 'sugar_ratio' ? 2 : 1)}</span>
              </span>
            </label>
            {(['low', 'high'] as const).map((side) => (
              <label key={side} className="text-xs text-rind-600">
                {side === 'low' ? 'Low level' : 'High level'}
                <input
                  aria-label={`${FACTOR_LABELS[f].name} ${side} level`}
                  inputMode="decimal"
                  disabled={!draft[f].on}
                  value={draft[f][side]}
                  onChange={(e) => setDraft({ ...draft, [f]: { ...draft[f], [side]: e.target.value } })}
                  className={`${inputClass} mt-1 disabled:bg-pith-100`}
                />
              </label>
            ))}
          </div>
        ))}
      </div>
      <div className="mt-4" aria-live="polite">
        {preview.ok ? (
          <>
            <p className="text-sm font-medium">{designLabel(kind)}: {preview.runs.length} run{preview.runs.length === 1 ? '' : 's'}, each a new variant (a run already in the trial is left out):</p>
            {preview.warnings.map((w) => <p key={w} className="mt-1 text-sm text-rind-600">{w}</p>)}
            <ol className="mt-1 list-decimal pl-6 text-sm text-rind-700" data-testid="plan-preview">
              {preview.runs.map((r, i) => <li key={i}>{r.description}</li>)}
            </ol>
          </>
        ) : (
          <Notice tone="warning">{preview.message}</Notice>
        )}
      </div>
      {added ? <div className="mt-3"><Notice tone="success">{added}</Notice></div> : null}
      {error ? <div className="mt-3"><Notice tone="danger">{Object.keys(fields).length ? Object.values(fields).flat().join(' ') : error}</Notice></div> : null}
      <Button className="mt-4" type="button" disabled={!preview.ok || busy} onClick={generate}>
        {busy ? 'Adding…' : 'Add these variants'}
      </Button>
    </section>
  );
}
