'use client';

import type { UnitPreference, WaterBoilingBasis } from '@/lib/chemistry';
import type { ComputeOutcome } from '@/lib/formulas/compute';
import { EmptyState } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { CautionList } from '@/components/ui/CautionList';
import { ComplianceTable } from './editor/ComplianceTable';
import { ResultRow } from './editor/ResultRow';
import { sucroseTableSourcesFor } from './editor-state';
import { showMass, showNumber, showTemperature, type TemperatureUnit } from '@/lib/format/quantities';

const WATER_BASIS_LABELS: Record<WaterBoilingBasis, string> = {
  measured: 'measured by you',
  altitude: 'from the kitchen altitude (standard atmosphere and the Antoine equation for water)',
  sea_level: 'sea level (no altitude or measured boiling point given)',
};

export interface ResultsPanelProps {
  /** computeFormula's result; null when the formula has no usable line yet. */
  outcome: ComputeOutcome | null;
  massUnits: UnitPreference;
  temperatureUnit: TemperatureUnit;
  /** Extra line under the heading, e.g. how many incomplete lines were left out. */
  notice?: string;
  title?: string;
}

/** The batch figures, each with its source; live in the editor, read-only on the formula page. */
export function ResultsPanel({ outcome, massUnits, temperatureUnit, notice, title = 'Batch results' }: ResultsPanelProps) {
  return (
    <section aria-live="polite" aria-label={title} className="space-y-4">
      <h2 className="font-display text-xl text-damson-900">{title}</h2>
      {notice ? <p className="text-sm text-rind-600">{notice}</p> : null}
      <ResultsBody outcome={outcome} massUnits={massUnits} temperatureUnit={temperatureUnit} />
    </section>
  );
}

function ResultsBody({ outcome, massUnits, temperatureUnit }: Pick<ResultsPanelProps, 'outcome' | 'massUnits' | 'temperatureUnit'>) {
  if (outcome === null) {
    return (
      <EmptyState title="Add your first ingredient">
        Choose an ingredient and type a quantity: the batch weight, set, keeping quality and labelling checks appear here as you type.
      </EmptyState>
    );
  }
  if (!outcome.ok) {
    return (
      <Notice tone="info" title="No results yet">
        <span data-testid="results-problem">{outcome.message}</span>
      </Notice>
    );
  }

  const { massBalance: mb, endPoint, waterActivity, compliance, cautions, settings } = outcome.computation;
  const mass = (g: number | null | undefined) => showMass(g, massUnits);
  const temp = (c: number | null | undefined) => showTemperature(c, temperatureUnit);
  const endPointShown = temperatureUnit === 'C' ? `${endPoint.endPointC.toFixed(1)} °C` : `${endPoint.endPointF.toFixed(1)} °F`;
  const ruleOfThumbShown =
    temperatureUnit === 'C' ? `${endPoint.ruleOfThumbEndPointC.toFixed(1)} °C` : `${endPoint.ruleOfThumbEndPointF.toFixed(1)} °F`;
  const tableSources = sucroseTableSourcesFor(endPoint.targetSolidsPct);
  const evaporating = mb.waterToEvaporateG >= 0;

  return (
    <div className="space-y-5">
      <CautionList cautions={cautions} />

      <div>
        <h3 className="mb-1 text-sm font-semibold uppercase tracking-wide text-rind-600">Mass balance</h3>
        <dl className="grid gap-x-6 sm:grid-cols-2">
          <ResultRow id="total-charge" label="Total charge (everything into the pan)" value={mass(mb.totalChargeG)} source="Sum of the line masses." />
          <ResultRow
            id="solids-in"
            label="Soluble solids in"
            value={mass(mb.solubleSolidsInG)}
            source="Sum of each line's mass × its soluble solids % from the ingredient library."
          />
          <ResultRow id="charge-solids" label="Solids of the raw charge" value={showNumber(mb.chargeSolidsPct, 1, ' %')} source="Soluble solids in ÷ total charge." />
          <ResultRow
            id="finished-mass"
            label={`Finished mass at ${showNumber(mb.targetSolidsPct, 1, ' %')} solids`}
            value={mass(mb.finishedMassG)}
            source="Mass balance: finished mass = soluble solids ÷ target solids fraction."
          />
          <ResultRow
            id="water-to-evaporate"
            label={evaporating ? 'Water to evaporate' : 'Water to add (the charge is already above the target)'}
            value={mass(Math.abs(mb.waterToEvaporateG))}
            source="Total charge − finished mass."
          />
          <ResultRow
            id="jars"
            label="Jars filled"
            value={`${showNumber(mb.jarsFilled, 0)} × ${mass(settings.jarNetFillG)}`}
            source="Whole jars of the net fill set in the formula; the remainder is not counted."
          />
        </dl>
      </div>

      <div>
        <h3 className="mb-1 text-sm font-semibold uppercase tracking-wide text-rind-600">Composition</h3>
        <dl className="grid gap-x-6 sm:grid-cols-2">
          <ResultRow
            id="fruit-per-1000"
            label="Fruit per 1000 g of finished product"
            value={showNumber(mb.fruitPer1000gFinishedG, 0, ' g')}
            source="Fruit mass ÷ finished mass × 1000, the measure of Council Directive 2001/113/EC, Annex I."
          />
          <ResultRow
            id="fruit-sweetener-ratio"
            label="Fruit : sweetener (as weighed)"
            value={mb.fruitToSweetenerRatio === null ? 'No sweetener line' : `${showNumber(mb.fruitToSweetenerRatio, 2)} : 1`}
            source="Fruit mass ÷ sweetener mass."
          />
          <ResultRow
            id="fruit-parts-per-55"
            label="Parts fruit per 55 parts sweetener (US phrasing)"
            value={mb.fruitPartsPer55SweetenerParts === null ? 'No sweetener line' : `${showNumber(mb.fruitPartsPer55SweetenerParts, 1)} : 55`}
            source="The ratio of 21 CFR 150.160(d)(1); the sweetener is counted as its solids, so the water in a syrup or honey does not count."
          />
          <ResultRow
            id="pectin"
            label="Pectin, % of charge / % of finished"
            value={`${showNumber(mb.pectinPctOfCharge, 2, ' %')} / ${showNumber(mb.pectinPctOfFinished, 2, ' %')}`}
            source="Pectin-line mass ÷ total charge and ÷ finished mass."
          />
          <ResultRow
            id="acid"
            label="Acid, % of charge / % of finished"
            value={`${showNumber(mb.acidPctOfCharge, 2, ' %')} / ${showNumber(mb.acidPctOfFinished, 2, ' %')}`}
            source="Acid-line mass ÷ total charge and ÷ finished mass."
          />
          <ResultRow
            id="water-activity"
            label="Estimated water activity (aw) — an estimate, not a measurement"
            value={showNumber(waterActivity.aw, 3)}
            source={`Model: ${waterActivity.model}. Measure aw on the finished product before relying on it.`}
          />
        </dl>
      </div>

      <div>
        <h3 className="mb-1 text-sm font-semibold uppercase tracking-wide text-rind-600">End point</h3>
        <dl className="grid gap-x-6 sm:grid-cols-2">
          <ResultRow
            id="end-point"
            label={`Target end point (${endPoint.basis === 'sucrose_table' ? 'sucrose boiling table' : 'water + 4 °C rule of thumb'})`}
            value={endPointShown}
            source={endPoint.note}
          />
          <ResultRow
            id="water-boiling"
            label="Water boils at"
            value={temp(endPoint.waterBoilingC)}
            source={`Basis: ${WATER_BASIS_LABELS[endPoint.waterBoilingBasis]}.`}
          />
          <ResultRow
            id="syrup-boiling"
            label={`Boiling point of a sucrose syrup at ${showNumber(endPoint.targetSolidsPct, 1, ' %')}`}
            value={endPoint.tableEndPointC === null ? 'Outside the published table' : temp(endPoint.tableEndPointC)}
            source={
              endPoint.tableEndPointC === null
                ? 'The published boiling points of sucrose solutions do not cover these solids.'
                : `From the published boiling points of sucrose solutions (elevation ${showNumber(endPoint.tableElevationC, 2)} °C over water), interpolated: ${tableSources.join('; ')}.`
            }
          />
          <ResultRow
            id="rule-of-thumb"
            label="Rule of thumb: water + 4 °C (8 °F)"
            value={ruleOfThumbShown}
            source="The classic setting-point rule, 104 °C / 220 °F at sea level."
          />
        </dl>
      </div>

      <div>
        <h3 className="mb-2 text-sm font-semibold uppercase tracking-wide text-rind-600">May it be sold under this name?</h3>
        <ComplianceTable report={compliance} />
      </div>
    </div>
  );
}
