import { checkCompliance } from './compliance';
import { estimateEndPoint } from './end-point';
import { buildGuidance } from './guidance';
import { computeMassBalance } from './mass-balance';
import { estimateWaterActivityFromSugars } from './water-activity';
import type { ComplianceReport } from './compliance';
import type { EndPointEstimate } from './end-point';
import type { Caution } from './guidance';
import type { MassBalance } from './mass-balance';
import type { FormulaLineInput, FormulaSettings } from './types';
import type { WaterActivityEstimate } from './water-activity';

/** One plain, JSON-serialisable result: masses in g, temperatures in °C (°F copies are labelled). */
export interface BatchComputation {
  settings: FormulaSettings;
  massBalance: MassBalance;
  endPoint: EndPointEstimate;
  waterActivity: WaterActivityEstimate;
  compliance: ComplianceReport;
  cautions: Caution[];
}

export function computeBatch(lines: FormulaLineInput[], settings: FormulaSettings): BatchComputation {
  const massBalance = computeMassBalance(lines, settings);
  const endPoint = estimateEndPoint({
    targetSolidsPct: settings.targetSolidsPct,
    altitudeM: settings.altitudeM,
    measuredWaterBoilingC: settings.measuredWaterBoilingC,
  });
  // The real mix of sucrose, glucose and fructose where the library knows an ingredient's sugars;
  // modelled from the ingredient's kind elsewhere; with the stated share of sucrose inverted during
  // the boil (none unless the settings say so).
  const waterActivity = estimateWaterActivityFromSugars(
    massBalance.lines.map((line) => ({ line, sugars: lines[line.index]?.ingredient.sugars ?? null })),
    massBalance.finishedMassG,
    { sucroseInversionFraction: (settings.sucroseInversionPct ?? 0) / 100 },
  );
  const compliance = checkCompliance(massBalance, settings);
  const cautions = buildGuidance({ massBalance, settings, aw: waterActivity.aw });
  return { settings: { ...settings }, massBalance, endPoint, waterActivity, compliance, cautions };
}
