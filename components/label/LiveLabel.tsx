'use client';

/**
 * The formula editor's live label: rebuilt from the same computation as the results panel on
 * every keystroke, with the library's label data of each line's ingredient.
 */
import { useMemo } from 'react';
import { buildLabel, labelInputFor } from '@/lib/label';
import { ChemistryInputError } from '@/lib/chemistry';
import { toLabelData } from '@/lib/ingredients/label-data';
import type { ComputableLine, ComputeOutcome } from '@/lib/formulas/compute';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import type { EditorIngredient } from '@/lib/ingredients/schema';
import { LabelPanel } from './LabelPanel';

/** The editor's lines carry library views; a line without label data counts as unknown. */
const labelDataOf = (line: ComputableLine) => ('labelData' in line.ingredient ? toLabelData(line.ingredient as EditorIngredient) : null);

export function LiveLabel({ settings, outcome, lines }: { settings: FormulaSettingsInput; outcome: ComputeOutcome | null; lines: ComputableLine[] }) {
  const result = useMemo(() => {
    if (!outcome?.ok) return null;
    try {
      return { label: buildLabel(labelInputFor(settings, outcome.computation.massBalance, lines.map(labelDataOf))) };
    } catch (err) {
      if (err instanceof ChemistryInputError) return { problem: err.message };
      throw err;
    }
  }, [settings, outcome, lines]);
  return (
    <section id="live-label" aria-labelledby="live-label-title">
      <h2 id="live-label-title" className="text-lg font-semibold">Label</h2>
      <p className="mb-4 text-sm text-rind-600">Follows the formula as you type. Claims are checked against a typical jam; the label page lets you choose another reference.</p>
      {!result ? (
        <p className="text-sm text-rind-600">The label appears once the formula has results.</p>
      ) : 'problem' in result ? (
        <p className="text-sm text-ember-700">{result.problem}</p>
      ) : (
        <LabelPanel label={result.label} heading="Live label" />
      )}
    </section>
  );
}
