'use client';

import type { ReactNode } from 'react';
import type { OverallComplianceStatus, UnitPreference } from '@/lib/chemistry';
import type { ComputeOutcome } from '@/lib/formulas/compute';
import { showMass, showNumber, showTemperature, type TemperatureUnit } from '@/lib/format/quantities';

const COMPLIANCE_SHORT: Record<OverallComplianceStatus, string> = {
  compliant: 'Meets the rules',
  non_compliant: 'Fails a rule',
  incomplete: 'Not all checked',
  not_applicable: 'No rule applies',
};

const COMPLIANCE_TONE: Record<OverallComplianceStatus, string> = {
  compliant: 'text-leaf-700',
  non_compliant: 'text-ember-700',
  incomplete: 'text-amberline-700',
  not_applicable: 'text-rind-600',
};

/**
 * The key results on a phone, stuck to the bottom of the screen while the lines are typed: on a
 * narrow screen the full results sit below the whole form. Hidden on wide screens, where the
 * results panel stays beside the form.
 */
export function KeyResultsBar({
  outcome,
  massUnits,
  temperatureUnit,
  resultsAnchor,
  children,
}: {
  outcome: ComputeOutcome | null;
  massUnits: UnitPreference;
  temperatureUnit: TemperatureUnit;
  /** The id of the full results panel, linked from the bar. */
  resultsAnchor: string;
  /** More key figures under the chemistry's (the predictions from the family's model). */
  children?: ReactNode;
}) {
  const c = outcome?.ok ? outcome.computation : null;
  return (
    <div
      className="key-results-bar no-print sticky bottom-0 z-10 -mx-4 border-t border-pith-300 bg-pith-50/95 px-4 py-2 shadow-card backdrop-blur sm:-mx-8 sm:px-8 lg:hidden"
      data-testid="key-results"
      aria-label="Key results"
      role="region"
    >
      {c ? (
        <dl className="grid grid-cols-3 gap-x-3 gap-y-1 text-xs sm:grid-cols-5">
          <KeyFigure label="Batch" value={showMass(c.massBalance.finishedMassG, massUnits)} />
          <KeyFigure label="Solids" value={`${showNumber(c.massBalance.chargeSolidsPct, 1)} → ${showNumber(c.massBalance.targetSolidsPct, 1, ' %')}`} />
          <KeyFigure label="pH" value={c.settings.plannedPh === undefined ? 'Not planned' : `${showNumber(c.settings.plannedPh, 2)} planned`} />
          <KeyFigure label="End point" value={showTemperature(c.endPoint.endPointC, temperatureUnit)} />
          <div className="col-span-2 min-w-0 sm:col-span-1">
            <dt className="text-rind-500">Rules</dt>
            <dd className={`truncate font-semibold ${COMPLIANCE_TONE[c.compliance.overall]}`}>{COMPLIANCE_SHORT[c.compliance.overall]}</dd>
          </div>
        </dl>
      ) : (
        <p className="text-xs text-rind-600">{outcome && !outcome.ok ? outcome.message : 'Results appear here as you type the lines.'}</p>
      )}
      {children}
      <a href={`#${resultsAnchor}`} className="mt-1 inline-flex min-h-8 items-center text-xs font-semibold text-damson-700 underline underline-offset-2">
        All results and cautions
      </a>
    </div>
  );
}

function KeyFigure({ label, value }: { label: string; value: string }) {
  return (
    <div className="min-w-0">
      <dt className="text-rind-500">{label}</dt>
      <dd className="truncate font-semibold tabular-nums text-damson-900">{value}</dd>
    </div>
  );
}
