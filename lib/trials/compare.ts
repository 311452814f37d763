/**
 * A cook's measurements beside the formula's predictions. Pure. Tolerances are kitchen rules
 * of thumb (common practice, no published source); the pH limits are published (see guidance).
 */
import { correctBrixTo20C, correctionCaution, ChemistryInputError, type BatchComputation } from '@/lib/chemistry';
import { ACID_FOOD_MAX_PH, LM_SET_PH_MIN, setPhWindow } from '@/lib/chemistry';
import { compareStatedSugar, statedTotalSugar } from '@/lib/label/statements';

export type ComparisonFlag = 'ok' | 'watch' | 'out' | 'danger' | 'unknown';

export interface ComparisonRow {
  key: 'finished_mass' | 'jars' | 'solids' | 'sugar_statement' | 'end_point' | 'ph';
  label: string;
  unit: 'g' | 'jars' | '°Brix' | '°C' | 'pH';
  predicted: number | null;
  measured: number | null;
  difference: number | null;
  flag: ComparisonFlag;
  note: string;
}

export interface CookComparison {
  /** Predicted figures are scaled to this cook's batch size (the charge) when it is given. */
  scale: number;
  correctedBrix: number | null;
  brixNote: string | null;
  rows: ComparisonRow[];
}

export interface CookReadings {
  batchSizeG?: number | null;
  brixReading?: number | null;
  brixSampleTempC?: number | null;
  ph?: number | null;
  endPointTempC?: number | null;
  yieldJars?: number | null;
  yieldG?: number | null;
}

/** Common practice, no published source: how far a measurement may sit from its prediction. */
export const TOLERANCES = { massPct: 5, solidsBrix: 1, endPointC: 1 } as const;

function row(key: ComparisonRow['key'], label: string, unit: ComparisonRow['unit'], predicted: number | null, measured: number | null, flag: ComparisonFlag, note: string): ComparisonRow {
  return { key, label, unit, predicted, measured, difference: predicted !== null && measured !== null ? measured - predicted : null, flag, note };
}

export function compareCook(computation: BatchComputation | null, cook: CookReadings, plannedPh?: number | null): CookComparison {
  const mb = computation?.massBalance;
  const scale = mb && cook.batchSizeG ? cook.batchSizeG / mb.totalChargeG : 1;

  let correctedBrix: number | null = null;
  let brixNote: string | null = null;
  if (cook.brixReading != null && cook.brixSampleTempC != null) {
    try {
      const c = correctBrixTo20C(cook.brixReading, cook.brixSampleTempC);
      correctedBrix = c.correctedBrix20C;
      const caution = correctionCaution(c);
      brixNote = `Corrected to 20 °C from ${cook.brixReading} °Brix at ${cook.brixSampleTempC} °C (${c.source}).${caution ? ` ${caution}` : ''}`;
    } catch (err) {
      if (!(err instanceof ChemistryInputError)) throw err;
      brixNote = `Not corrected: ${err.message}. Raw reading shown.`;
      correctedBrix = null;
    }
  }

  const rows: ComparisonRow[] = [];
  if (mb) {
    const predictedMass = mb.finishedMassG * scale;
    const mass = cook.yieldG ?? null;
    const massOff = mass !== null && Math.abs(mass - predictedMass) > (TOLERANCES.massPct / 100) * predictedMass;
    rows.push(row('finished_mass', 'Finished mass', 'g', predictedMass, mass, mass === null ? 'unknown' : massOff ? 'watch' : 'ok',
      massOff ? (mass! > predictedMass ? 'More than predicted: the batch may be under-boiled (solids below target).' : 'Less than predicted: over-boiled, or losses in the pan and filling.') : `Within ±${TOLERANCES.massPct} % of the prediction (common practice).`));
    const predictedJars = Math.floor((mb.finishedMassG * scale) / (computation!.settings.jarNetFillG || 1));
    rows.push(row('jars', 'Jars filled', 'jars', predictedJars, cook.yieldJars ?? null, cook.yieldJars == null ? 'unknown' : cook.yieldJars < predictedJars - 1 ? 'watch' : 'ok', 'Predicted from the finished mass and the jar net fill.'));
  }
  const targetSolids = computation?.settings.targetSolidsPct ?? null;
  const measuredSolids = correctedBrix ?? cook.brixReading ?? null;
  const solidsOff = targetSolids !== null && measuredSolids !== null && Math.abs(measuredSolids - targetSolids) > TOLERANCES.solidsBrix;
  rows.push(row('solids', 'Soluble solids', '°Brix', targetSolids, measuredSolids, measuredSolids === null ? 'unknown' : solidsOff ? 'out' : 'ok',
    brixNote ?? (solidsOff ? 'Off the target by more than 1 °Brix (common practice).' : 'Refractometer reading against the target solids.')));
  // The label's "total sugar content" is the target refractometer value; a measured Brix must sit within its tolerance.
  if (targetSolids !== null && targetSolids > 0 && targetSolids < 100) {
    const stated = statedTotalSugar(targetSolids);
    const check = measuredSolids !== null && measuredSolids >= 0 && measuredSolids <= 100 ? compareStatedSugar(stated, Math.round(measuredSolids * 10) / 10) : null;
    rows.push(row('sugar_statement', 'Total sugar on the label', '°Brix', stated, check ? check.measuredBrix : null, check === null ? 'unknown' : check.withinTolerance ? 'ok' : 'out',
      check ? `${check.message} (Directive 2001/113/EC, refractometer value at 20 °C).` : `The label states ${stated} g per 100 g; a refractometer reading checks it.`));
  }
  const endPoint = computation?.endPoint.endPointC ?? null;
  const epOff = endPoint !== null && cook.endPointTempC != null && Math.abs(cook.endPointTempC - endPoint) > TOLERANCES.endPointC;
  rows.push(row('end_point', 'End-point temperature', '°C', endPoint, cook.endPointTempC ?? null, cook.endPointTempC == null ? 'unknown' : epOff ? 'watch' : 'ok',
    epOff ? 'More than 1 °C from the predicted end point (common practice): check the thermometer and the water boiling point.' : 'Against the predicted end point for this kitchen.'));
  const ph = cook.ph ?? null;
  // The setting window depends on the pectin: high-methoxyl needs acid, low-methoxyl sets with calcium.
  const set = setPhWindow(mb?.lines ?? []);
  const window = set.lowMethoxylOnly
    ? { ...set, why: `low-methoxyl pectin sets with calcium across pH ${LM_SET_PH_MIN}–6.5, and ${ACID_FOOD_MAX_PH} is the acid-food limit (21 CFR 114.3)` }
    : { ...set, why: 'where high-methoxyl pectin sets (McGee, On Food and Cooking)' };
  let phFlag: ComparisonFlag = 'unknown';
  let phNote = 'No pH measured.';
  if (ph !== null) {
    if (ph > ACID_FOOD_MAX_PH) {
      phFlag = 'danger';
      phNote = 'Above pH 4.6: not an acid food (21 CFR 114.3). Do not sell or store this batch without a validated process. Local food-safety codes and licensed practice govern.';
    } else if (ph < window.min || ph > window.max) {
      phFlag = 'out';
      phNote = `Outside pH ${window.min}–${window.max}, ${window.why}.`;
    } else {
      phFlag = 'ok';
      phNote = `Within pH ${window.min}–${window.max}, ${window.why}.`;
    }
  }
  rows.push(row('ph', 'pH', 'pH', plannedPh ?? null, ph, phFlag, phNote));
  return { scale, correctedBrix, brixNote, rows };
}
