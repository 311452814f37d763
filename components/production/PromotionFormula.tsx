import { formatMass, type UnitPreference } from '@/lib/chemistry';
import type { PromotionView } from '@/lib/production/schema';
import type { FormulaRevisionView, FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import { RevisionDiff } from '@/components/formulas/RevisionDiff';
import { TableBox } from '@/components/ui/TableBox';
import { showLineMass, showSharePct } from '@/lib/format/quantities';

/** The diff compares revisions; the two sides here are a production version and a variant, under one name. */
const asRevision = (name: string, number: number, f: { settings: FormulaSettingsInput; lines: RevisionLine[] }): FormulaRevisionView => ({
  formulaId: '', number, name, settings: f.settings, lines: f.lines, note: null, createdAt: '', createdBy: { id: '', name: '' },
});

/** The formula the head of product approves, line by line, and what it changes against the version in production. */
export function PromotionFormula({ formula, baseline, variantLabel, massUnits, temperatureUnit }: {
  formula: PromotionView['formula'];
  baseline: PromotionView['baseline'];
  variantLabel: string;
  massUnits: UnitPreference;
  temperatureUnit: 'C' | 'F';
}) {
  if (!formula) return <p className="text-sm text-rind-600">The variant’s formula can no longer be read.</p>;
  const weighed = formula.weighed;
  return (
    <div className="space-y-5">
      {weighed ? (
        // No minimum width: a phone's card (318 px inside at 390 px) is narrower than any fixed one, which
        // cut the "% of batch" column; the names wrap instead, and a table wider still scrolls in its box.
        <TableBox label={`Variant ${variantLabel}, line by line`} framed={false}>
          <table className="w-full text-sm" data-testid="promotion-lines">
            <caption className="pb-2 text-left text-rind-600">Variant {variantLabel}, as weighed for one batch of {formatMass(weighed.totalChargeG, massUnits)}</caption>
            <thead>
              <tr className="border-b border-pith-300 text-left text-rind-600">
                <th scope="col" className="py-1 pr-4 font-medium">Ingredient</th>
                <th scope="col" className="whitespace-nowrap py-1 pr-4 text-right font-medium">{massUnits === 'metric' ? 'Grams' : 'Weight'}</th>
                <th scope="col" className="whitespace-nowrap py-1 text-right font-medium">% of batch</th>
              </tr>
            </thead>
            <tbody>
              {weighed.lines.map((l, i) => (
                <tr key={`${l.name}-${i}`} className="border-b border-pith-200">
                  <th scope="row" className="py-1 pr-4 text-left font-normal">{l.name}</th>
                  <td className="whitespace-nowrap py-1 pr-4 text-right tabular-nums">{showLineMass(l.grams, massUnits)}</td>
                  <td className="whitespace-nowrap py-1 text-right tabular-nums">{showSharePct(l.pctOfBatch)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      ) : <p className="text-sm text-ember-700">These lines cannot be weighed out: the formula does not compute.</p>}
      {baseline ? (
        <RevisionDiff
          before={asRevision(baseline.productName, baseline.version, baseline)}
          after={asRevision(baseline.productName, baseline.version + 1, formula)}
          massUnits={massUnits}
          temperatureUnit={temperatureUnit}
          title={`Against ${baseline.productName} v${baseline.version}, line by line`}
          sideLabels={{ before: `v${baseline.version}`, after: `variant ${variantLabel}` }}
        />
      ) : <p className="text-sm text-rind-600">Nothing of this product is in production yet, so there is nothing to compare the lines with.</p>}
    </div>
  );
}
