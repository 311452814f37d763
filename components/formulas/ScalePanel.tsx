'use client';

import { useId, useState } from 'react';
import {
  ChemistryInputError,
  ROUNDING_SHARE_LIMIT,
  scaleFormula,
  toGrams,
  type MassUnit,
  type ScaledFormula,
  type UnitPreference,
} from '@/lib/chemistry';
import { toChemistrySettings, type ComputableLine } from '@/lib/formulas/compute';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import { inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { friendlyComputeMessage, parseDecimal } from './editor-state';
import { formatEntryNumber, showMass, showMassDelta, showNumber, formatSigned } from '@/lib/format/quantities';
import { TableBox } from '@/components/ui/TableBox';

type TargetKind = 'total_charge' | 'finished_mass' | 'jar_count';

const TARGET_LABELS: Record<TargetKind, string> = {
  total_charge: 'Kettle total charge',
  finished_mass: 'Finished mass',
  jar_count: 'Number of jars',
};

const MASS_UNITS: readonly MassUnit[] = ['g', 'kg', 'oz', 'lb'];

export interface ScalePanelProps {
  /** The formula's lines in grams or % of fruit, as fed to computeFormula. */
  lines: ComputableLine[];
  settings: FormulaSettingsInput;
  massUnits: UnitPreference;
}

type ScaleOutcome = { ok: true; scaled: ScaledFormula } | { ok: false; field: string; message: string } | null;

function checkPositive(text: string, what: string, wholeNumber = false): { value: number } | { error: string } {
  const value = parseDecimal(text);
  if (value === null) return { error: `Enter ${what}.` };
  if (Number.isNaN(value)) return { error: `${what.charAt(0).toUpperCase()}${what.slice(1)} must be a number.` };
  if (value <= 0) return { error: `${what.charAt(0).toUpperCase()}${what.slice(1)} must be more than 0.` };
  if (wholeNumber && !Number.isInteger(value)) return { error: 'Enter a whole number of jars.' };
  return { value };
}

/** Scales the current formula to a kettle, a finished mass or a jar count, rounded to the scale's step. */
export function ScalePanel({ lines, settings, massUnits }: ScalePanelProps) {
  const uid = useId();
  const metric = massUnits === 'metric';
  const [kind, setKind] = useState<TargetKind>('total_charge');
  const [targetText, setTargetText] = useState('');
  const [targetUnit, setTargetUnit] = useState<MassUnit>(metric ? 'kg' : 'lb');
  const [stepText, setStepText] = useState(metric ? '1' : '0.1');
  const [stepUnit, setStepUnit] = useState<MassUnit>(metric ? 'g' : 'oz');

  const target = kind === 'jar_count' ? checkPositive(targetText, 'a number of jars', true) : checkPositive(targetText, 'a target mass');
  const step = checkPositive(stepText, 'a scale step');
  const targetError = targetText.trim() === '' ? undefined : 'error' in target ? target.error : undefined;
  const stepError = 'error' in step ? step.error : undefined;

  const result = runScale();

  function runScale(): ScaleOutcome {
    if (lines.length === 0 || 'error' in target || 'error' in step) return null;
    try {
      const scaled = scaleFormula(
        lines.map((l) => ({ ingredient: l.ingredient, quantity: l.quantity, unit: l.unit })),
        toChemistrySettings(settings),
        kind === 'jar_count' ? { kind, jars: target.value } : { kind, mass: target.value, unit: targetUnit },
        { step: step.value, unit: stepUnit },
      );
      return { ok: true, scaled };
    } catch (err) {
      if (err instanceof ChemistryInputError) return { ok: false, field: err.field, message: friendlyComputeMessage(err.field, err.message, []) };
      throw err;
    }
  }

  const field = (suffix: string) => `${uid}-${suffix}`;

  return (
    <section aria-labelledby={field('title')} className="@container space-y-4">
      <h2 id={field('title')} className="font-display text-xl text-damson-900">
        Scale this formula
      </h2>
      {lines.length === 0 ? <p className="text-sm text-rind-600">Add ingredients with quantities to scale the formula.</p> : null}

      {/* Columns follow the card, not the window: beside the refractometer card it is half the page wide. */}
      <div className="grid gap-3 @sm:grid-cols-2 @3xl:grid-cols-4">
        <div>
          <label htmlFor={field('kind')} className="mb-1 block text-sm font-medium text-rind-700">
            Scale to
          </label>
          <select id={field('kind')} value={kind} onChange={(e) => setKind(e.target.value as TargetKind)} className={`${inputClass} min-h-10`}>
            {(Object.keys(TARGET_LABELS) as TargetKind[]).map((k) => (
              <option key={k} value={k}>
                {TARGET_LABELS[k]}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor={field('target')} className="mb-1 block text-sm font-medium text-rind-700">
            {kind === 'jar_count' ? 'Jars' : `${TARGET_LABELS[kind]} (${targetUnit})`}
          </label>
          <div className="flex gap-2">
            <input
              id={field('target')}
              inputMode="decimal"
              value={targetText}
              onChange={(e) => setTargetText(e.target.value)}
              aria-invalid={targetError ? true : undefined}
              aria-describedby={targetError ? field('target-err') : undefined}
              className={`${inputClass} min-h-10`}
            />
            {kind === 'jar_count' ? null : (
              <select
                aria-label="Target unit"
                value={targetUnit}
                onChange={(e) => setTargetUnit(e.target.value as MassUnit)}
                className={`${inputClass} min-h-10 max-w-24`}
              >
                {MASS_UNITS.map((u) => (
                  <option key={u} value={u}>
                    {u}
                  </option>
                ))}
              </select>
            )}
          </div>
          {targetError ? (
            <p id={field('target-err')} role="alert" className="mt-1 text-sm text-ember-700">
              {targetError}
            </p>
          ) : null}
        </div>
        <div className="sm:col-span-2">
          <label htmlFor={field('step')} className="mb-1 block text-sm font-medium text-rind-700">
            Scale step (the smallest change your scale shows)
          </label>
          <div className="flex gap-2">
            <input
              id={field('step')}
              inputMode="decimal"
              value={stepText}
              onChange={(e) => setStepText(e.target.value)}
              aria-invalid={stepError ? true : undefined}
              aria-describedby={stepError ? field('step-err') : undefined}
              className={`${inputClass} min-h-10 max-w-32`}
            />
            <select aria-label="Scale step unit" value={stepUnit} onChange={(e) => setStepUnit(e.target.value as MassUnit)} className={`${inputClass} min-h-10 max-w-24`}>
              {MASS_UNITS.map((u) => (
                <option key={u} value={u}>
                  {u}
                </option>
              ))}
            </select>
          </div>
          {stepError ? (
            <p id={field('step-err')} role="alert" className="mt-1 text-sm text-ember-700">
              {stepError}
            </p>
          ) : null}
        </div>
      </div>

      {lines.length > 0 && targetText.trim() === '' ? <p className="text-sm text-rind-600">Enter a target to see the weights to put on the scale.</p> : null}
      {result && !result.ok ? <Notice tone="danger">{result.message}</Notice> : null}
      {result && result.ok ? <ScaledTable scaled={result.scaled} massUnits={massUnits} targetSolidsPct={settings.targetSolidsPct} jarsAsked={kind === 'jar_count' && 'value' in target ? target.value : null} /> : null}
    </section>
  );
}

/** Decimals of a step written in its unit: 5 → 0, 0.1 → 1, 0.05 → 2. */
function decimalsOf(step: number): number {
  return Math.min(6, Math.max(0, -Math.floor(Math.log10(step) + 1e-9)));
}

function ScaledTable({ scaled, massUnits, targetSolidsPct, jarsAsked }: { scaled: ScaledFormula; massUnits: UnitPreference; targetSolidsPct: number; jarsAsked: number | null }) {
  const unit = scaled.resolution.unit;
  const effect = scaled.effectOfRounding;
  const finer = scaled.lines.filter((l) => l.finerStep);
  return (
    <div className="space-y-4" data-testid="scale-result">
      <p className="text-sm text-rind-600">Scale factor × {showNumber(scaled.scaleFactor, 4)}</p>
      <TableBox label="Scaled lines">
        <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm">
          <caption className="sr-only">Scaled lines: exact and rounded weights</caption>
          <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
            <tr>
              <th scope="col" className="px-3 py-2">Ingredient</th>
              <th scope="col" className="px-3 py-2 text-right">Exact</th>
              <th scope="col" className="px-3 py-2 text-right">Weigh out ({unit})</th>
              <th scope="col" className="px-3 py-2 text-right">Step</th>
              <th scope="col" className="px-3 py-2 text-right">Rounding error</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-pith-200">
            {scaled.lines.map((l) => (
              <tr key={l.index} data-testid={`scaled-line-${l.index}`}>
                <th scope="row" className="px-3 py-2 text-left font-medium">{l.name}</th>
                <td className="px-3 py-2 text-right tabular-nums">{showMass(l.exactG, massUnits)}</td>
                <td className="px-3 py-2 text-right font-semibold tabular-nums">
                  {formatEntryNumber(l.roundedInResolutionUnit, decimalsOf(l.stepInResolutionUnit) + 2)} {unit}
                </td>
                <td className={`px-3 py-2 text-right tabular-nums ${l.finerStep ? 'font-semibold' : 'text-rind-500'}`}>
                  {formatEntryNumber(l.stepInResolutionUnit, 6)} {unit}{l.finerStep ? ', finer scale' : ''}
                </td>
                <td className="px-3 py-2 text-right tabular-nums">{showMassDelta(l.roundingErrorG, massUnits)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableBox>
      <dl className="grid gap-2 text-sm sm:grid-cols-2">
        <EffectRow label="Total charge" exact={showMass(scaled.exact.totalChargeG, massUnits)} rounded={showMass(scaled.rounded.totalChargeG, massUnits)} delta={showMassDelta(effect.totalChargeDeltaG, massUnits)} />
        <EffectRow label="Soluble solids" exact={showMass(scaled.exact.solubleSolidsInG, massUnits)} rounded={showMass(scaled.rounded.solubleSolidsInG, massUnits)} delta={showMassDelta(effect.solubleSolidsDeltaG, massUnits)} />
        <EffectRow label={`Finished mass at ${showNumber(targetSolidsPct, 1, ' %')}`} exact={showMass(scaled.exact.finishedMassG, massUnits)} rounded={showMass(scaled.rounded.finishedMassG, massUnits)} delta={showMassDelta(effect.finishedMassDeltaG, massUnits)} />
        <div data-testid="scale-planned-evaporation">
          <dt className="text-rind-600">Solids if you evaporate the planned water ({showMass(scaled.exact.totalChargeG - scaled.exact.finishedMassG, massUnits)})</dt>
          <dd className="tabular-nums">
            {showNumber(effect.solidsPctIfPlannedEvaporation, 2, ' %')} ({formatSigned(effect.solidsPctDeltaIfPlannedEvaporation, 2)} points against the target)
          </dd>
        </div>
      </dl>
      {finer.length || effect.noticeableLines.length ? (
        <p className="text-sm text-rind-700" data-testid="scale-finer-lines">
          {finer.length ? <>Weighed on a finer scale, so rounding moves no line by more than {ROUNDING_SHARE_LIMIT * 100} %: {finer.map((l) => l.name).join(', ')}. </> : null}
          {effect.noticeableLines.length ? <strong>Rounding changes {effect.noticeableLines.map((l) => `${l.name} by ${formatSigned(l.roundingErrorPct, 0)} %`).join(', ')} of its exact weight.</strong> : null}
        </p>
      ) : null}
      <p className="text-xs text-rind-500">
        Rounded weights are the exact ones rounded to the nearest {formatEntryNumber(scaled.resolution.step, 6)} {unit} ({showMass(toGrams(scaled.resolution.step, unit), massUnits)}){finer.length ? ', or to the finer step shown' : ''}{jarsAsked !== null ? `, and up where needed so the batch fills the ${showNumber(jarsAsked, 0)} jars` : ''}. Jars:{' '}
        {showNumber(scaled.exact.jarsFilled, 0)} exact, {showNumber(scaled.rounded.jarsFilled, 0)} rounded.
      </p>
    </div>
  );
}

function EffectRow({ label, exact, rounded, delta }: { label: string; exact: string; rounded: string; delta: string }) {
  return (
    <div>
      <dt className="text-rind-600">{label}</dt>
      <dd className="tabular-nums">
        {exact} exact → {rounded} rounded ({delta})
      </dd>
    </div>
  );
}
