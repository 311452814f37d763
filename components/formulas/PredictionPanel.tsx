'use client';

import { useMemo } from 'react';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import type { EditorFamilyModel } from '@/lib/modelling/schema';
import { predictForFormula, type EditorPrediction, type ResponsePredictionView } from '@/lib/modelling/editor-predictions';
import { intervalText, responseRange } from '@/lib/modelling/predict';
import { unitNote } from '@/lib/format/words';
import type { FeatureLine } from '@/lib/modelling/features';
import { Notice } from '@/components/ui/Notice';
import type { EditorComputation, LineDraft } from './editor-state';

export const PREDICTIONS_ANCHOR = 'formula-predictions';

/** Sensory attributes by their library key, in the order the phone's bar shows them. */
const FIRST_SHOWN = ['overall-liking', 'set-firmness', 'tartness'];

export interface PredictionInputs {
  /** The workspace's fitted family models (the page reads them once; nothing is fetched while typing). */
  models: readonly EditorFamilyModel[];
  computed: EditorComputation;
  drafts: readonly LineDraft[];
  settings: FormulaSettingsInput;
}

/** The editor's predictions, recomputed when the formula changes (a few dot products per response). */
export function useFormulaPrediction({ models, computed, drafts, settings }: PredictionInputs): EditorPrediction {
  return useMemo(() => {
    const outcome = computed.outcome;
    if (!outcome?.ok || models.length === 0) return { state: 'no_formula' };
    const idByKey = new Map(drafts.map((d) => [d.key, d.ingredientId]));
    const lines: FeatureLine[] = computed.lines.map((line, i) => ({
      ingredientId: idByKey.get(computed.lineKeys[i]) ?? '',
      ingredient: line.ingredient,
      quantity: line.quantity,
      unit: line.unit === 'pct_fruit' ? 'pct_fruit' : 'g',
    }));
    return predictForFormula(models, settings, lines, outcome.computation);
  }, [models, computed, drafts, settings]);
}

function fixed(value: number, decimals: number): string {
  return value.toFixed(decimals);
}

function PredictedRow({ row }: { row: ResponsePredictionView }) {
  const { response, value } = row;
  return (
    <div className="min-w-0 border-t border-pith-200 py-2 first:border-t-0">
      <dt className="text-sm font-medium text-rind-700">
        {response.name}{unitNote(response.name, response.unit) ? <span className="text-xs font-normal text-rind-500"> ({response.unit})</span> : null}
      </dt>
      {value.inRegion ? (
        <dd className="mt-0.5 text-sm">
          <span className="text-lg font-semibold tabular-nums text-damson-900" data-testid="predicted-value">{fixed(value.estimate, response.decimals)}</span>
          {value.interval ? (
            <span className="ml-2 text-rind-600">
              95 % prediction interval {intervalText(value.interval, responseRange(response), response.decimals)}
            </span>
          ) : (
            <span className="ml-2 text-rind-600">no interval: the trials leave no spread to estimate it from</span>
          )}
        </dd>
      ) : (
        <dd className="mt-0.5 text-sm text-amberline-700">No prediction. {value.reason}</dd>
      )}
    </div>
  );
}

/**
 * Predicted set, tartness, liking and any other modelled response for the formula being typed,
 * from the response surfaces fitted on the family's trials, each with its 95 % prediction interval.
 * Outside the region the trials cover there is no number, only the reason.
 */
export function PredictionPanel(props: PredictionInputs) {
  const prediction = useFormulaPrediction(props);
  if (props.models.length === 0) return null;
  return (
    <section id={PREDICTIONS_ANCHOR} aria-labelledby="predictions-title" className="scroll-mt-4" data-testid="prediction-panel">
      <h2 id="predictions-title" className="text-lg font-semibold">Predicted from your trials</h2>
      <PanelBody prediction={prediction} />
    </section>
  );
}

function PanelBody({ prediction }: { prediction: EditorPrediction }) {
  if (prediction.state === 'no_formula') {
    return <p className="mt-2 text-sm text-rind-600">Predictions appear once the formula has results.</p>;
  }
  if (prediction.state === 'no_model') {
    return (
      <p className="mt-2 text-sm text-rind-600">
        {prediction.family ? `No model for ${prediction.family.name} yet: it needs cooked and tasted trials of this product and fruit.` : 'Add a fruit line to see predictions.'}
      </p>
    );
  }
  return (
    <div className="mt-2">
      <p className="text-sm text-rind-600">
        From the trials of <span className="font-medium">{prediction.family.name}</span>.
      </p>
      {prediction.outside ? (
        <div className="mt-3" data-testid="prediction-withdrawn">
          <Notice tone="warning" title="No prediction for this formula">{prediction.outside}</Notice>
        </div>
      ) : (
        <dl className="mt-2">
          {prediction.responses.map((row) => <PredictedRow key={row.response.key} row={row} />)}
        </dl>
      )}
      <p className="mt-2 text-xs text-rind-500">
        A new batch cooked and tasted as in the trials should fall within the interval 19 times in 20. No number is given where the formula leaves the range the trials covered, or combines the factors unlike any trial (leverage test).
      </p>
    </div>
  );
}

/** One line for the phone's sticky results bar: the first two predictions, linking to the panel. */
export function PredictionSummary(props: PredictionInputs) {
  const prediction = useFormulaPrediction(props);
  if (prediction.state !== 'ready') return null;
  // What a developer checks first: liking and the set, then the rest in the model's order.
  const rank = (key: string | null) => { const i = FIRST_SHOWN.indexOf(key ?? ''); return i < 0 ? FIRST_SHOWN.length : i; };
  const shown = [...prediction.responses].sort((a, b) => rank(a.response.libraryKey) - rank(b.response.libraryKey)).slice(0, 2);
  return (
    <p className="mt-1 truncate text-xs" data-testid="prediction-summary">
      <a href={`#${PREDICTIONS_ANCHOR}`} className="font-semibold text-damson-700 underline underline-offset-2">Predicted</a>{' '}
      {prediction.outside
        ? <span className="text-amberline-700">none: outside the trials</span>
        : shown.map((r) => `${r.response.name} ${r.value.inRegion ? fixed(r.value.estimate, r.response.decimals) : '–'}`).join(' · ')}
    </p>
  );
}
