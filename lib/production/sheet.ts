/**
 * The batch sheet of a production version: the formula scaled to the kettle, weights rounded to
 * the scale, the end point for the kitchen's altitude, and the QC targets. Pure.
 */
import {
  computeMassBalance, formatMass, qcSpecCautions, toGrams, resolveWaterBoilingPoint, scaleFormula, STANDARD_PRESSURE_PA, waterBoilingPointAtPressureC,
  type Caution, type QcSpec, type ScaledFormula, type ScaleTarget,
} from '@/lib/chemistry';
import { chemistryFieldPath, storedValueProblem, toChemistrySettings } from '@/lib/formulas/compute';
import { ValidationFailed } from '@/lib/errors';
import type { FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import type { ProductionProcess, BatchSheetQuery } from './schema';

export interface SheetSource {
  productName: string;
  productCode: string;
  version: number;
  settings: FormulaSettingsInput;
  lines: RevisionLine[];
  process: ProductionProcess;
  spec: QcSpec;
}

export interface BatchSheet {
  title: string;
  scaled: ScaledFormula;
  /** The developer's sea-level end point moved by the kitchen's drop in the boiling point of water. */
  endPoint: { seaLevelC: number; kitchenC: number; waterBoilingC: number; altitudeM: number | null };
  fillTempC: number;
  cookNotes: string;
  spec: QcSpec;
  cautions: Caution[];
  steps: string[];
}

/**
 * The largest kettle charge a batch sheet scales to: 5 t, beyond any open pan or vacuum kettle of a
 * preserve kitchen. Common practice, no published source.
 */
export const SHEET_MAX_CHARGE_G = 5_000_000;

/** The batch a query asks for: its kettle charge and finished mass in grams (the formula's own without an amount). */
function askedBatch(source: Pick<SheetSource, 'settings' | 'lines'>, query: BatchSheetQuery) {
  const settings = toChemistrySettings(source.settings);
  const base = computeMassBalance(source.lines, settings);
  const finishedPerCharge = base.finishedMassG / base.totalChargeG;
  const finishedG =
    query.amount === undefined ? base.finishedMassG
      : query.target === 'jar_count' ? query.amount * settings.jarNetFillG
        : query.target === 'finished_mass' ? toGrams(query.amount, query.unit)
          : toGrams(query.amount, query.unit) * finishedPerCharge;
  return { jarNetFillG: settings.jarNetFillG, finishedPerCharge, finishedG, chargeG: finishedG / finishedPerCharge };
}

const unitSystemOf = (unit: BatchSheetQuery['unit']) => (unit === 'lb' || unit === 'oz' ? 'imperial' : 'metric');

/**
 * Why a batch sheet cannot be scaled to the amount asked, in words for the amount field; null when it can.
 * The batch must fill at least one jar of the formula's net fill, and its kettle charge stay within
 * SHEET_MAX_CHARGE_G. Non-finite or non-positive amounts are refused by the query schema before this.
 */
export function sheetAmountProblem(source: Pick<SheetSource, 'settings' | 'lines'>, query: BatchSheetQuery): string | null {
  if (query.amount === undefined) return null;
  const { jarNetFillG, finishedPerCharge, finishedG, chargeG } = askedBatch(source, query);
  const unit = unitSystemOf(query.unit);
  if (!Number.isFinite(chargeG) || chargeG > SHEET_MAX_CHARGE_G) {
    return `That batch is too large: a batch sheet scales to a kettle charge of at most ${formatMass(SHEET_MAX_CHARGE_G, unit)}.`;
  }
  if (finishedG < jarNetFillG) {
    const oneJar = query.target === 'total_charge' ? jarNetFillG / finishedPerCharge : jarNetFillG;
    return `That batch is too small to fill one ${jarNetFillG} g jar: scale to at least ${formatMass(Math.ceil(oneJar), unit)} ${query.target === 'total_charge' ? 'of kettle charge' : 'of finished product'}.`;
  }
  return null;
}

/**
 * A scale step is at most a tenth of the kettle charge (common practice, no published source: a
 * scale that reads in steps that coarse cannot weigh the batch, and every line would fall back to a
 * finer scale anyway). The charge is the scaled one, or the formula's own when no amount is given.
 */
export const SHEET_STEP_SHARE_MAX = 0.1;

export function sheetStepProblem(source: Pick<SheetSource, 'settings' | 'lines'>, query: BatchSheetQuery): string | null {
  // A stored value the chemistry cannot use (a jar fill of 1e-320 g) is named by buildBatchSheet instead.
  if (storedValueProblem(source.settings, source.lines)) return null;
  const { chargeG } = askedBatch(source, query);
  const stepG = toGrams(query.step, query.stepUnit);
  if (stepG > chargeG * SHEET_STEP_SHARE_MAX) {
    const unit = unitSystemOf(query.stepUnit);
    return `A scale step of ${query.step} ${query.stepUnit} is too coarse for a kettle charge of ${formatMass(chargeG, unit)}: use a scale that reads to ${formatMass(chargeG * SHEET_STEP_SHARE_MAX, unit)} or finer.`;
  }
  return null;
}

export function buildBatchSheet(source: SheetSource, query: BatchSheetQuery): BatchSheet {
  // A version frozen before today's bounds may hold a value scaling would divide by: no sheet until corrected.
  const problem = storedValueProblem(source.settings, source.lines);
  if (problem) {
    const message = `This version holds a value that needs correcting, so the sheet is not scaled: ${problem.rule}`;
    throw new ValidationFailed(message, { [chemistryFieldPath(problem.field)]: [message] });
  }
  const settings = toChemistrySettings(source.settings);
  const target: ScaleTarget =
    query.amount === undefined
      ? { kind: 'total_charge', mass: computeMassBalance(source.lines, settings).totalChargeG, unit: 'g' }
      : query.target === 'jar_count'
        ? { kind: 'jar_count', jars: Math.round(query.amount) }
        : { kind: query.target, mass: query.amount, unit: query.unit };
  const scaled = scaleFormula(source.lines, settings, target, { step: query.step, unit: query.stepUnit });
  const altitudeM = query.altitudeM ?? source.settings.altitudeM ?? null;
  const water = resolveWaterBoilingPoint(altitudeM === null ? {} : { altitudeM });
  const seaLevelWaterC = waterBoilingPointAtPressureC(STANDARD_PRESSURE_PA);
  const kitchenC = source.process.endPointSeaLevelC - (seaLevelWaterC - water.waterBoilingC);
  const sugarLines = scaled.lines.filter((_, i) => source.lines[i]?.ingredient.kind === 'sweetener').map((l) => l.name);
  const pectinLines = scaled.lines.filter((_, i) => source.lines[i]?.ingredient.kind === 'pectin').map((l) => l.name);
  const acidLines = scaled.lines.filter((_, i) => source.lines[i]?.ingredient.kind === 'acid').map((l) => l.name);
  const steps = [
    'Check the scale reads zero and weigh every line; tick each as it goes in.',
    ...(pectinLines.length ? [`Dry-blend the ${pectinLines.join(', ')} with about five times its weight of the sugar so it does not clump.`] : []),
    'Heat the fruit to a rolling boil.',
    ...(pectinLines.length ? ['Add the pectin–sugar blend while stirring hard, then boil for a minute.'] : []),
    ...(sugarLines.length ? [`Add the remaining ${sugarLines.join(', ')} and bring back to the boil.`] : []),
    `Boil to ${kitchenC.toFixed(1)} °C, then check a cooled sample on the refractometer: ${source.spec.solidsMinBrix.toFixed(1)}–${source.spec.solidsMaxBrix.toFixed(1)} °Brix at 20 °C.`,
    ...(acidLines.length ? [`Add the ${acidLines.join(', ')} at the end of the boil (acid added early breaks the pectin down).`] : []),
    `Check the pH of a cooled sample: ${source.spec.phMin.toFixed(2)}–${source.spec.phMax.toFixed(2)}.`,
    `Fill hot, at ${source.spec.minFillTempC.toFixed(0)} °C or above, into clean, hot jars; cap at once.`,
    `Check-weigh jars against ${source.spec.netFillG.toFixed(0)} g net (tolerance ${source.spec.netFillToleranceG.toFixed(1)} g).`,
    'Record the readings against the lot code.',
  ];
  return {
    title: `${source.productName} — ${source.productCode} v${source.version}`,
    scaled,
    endPoint: { seaLevelC: source.process.endPointSeaLevelC, kitchenC, waterBoilingC: water.waterBoilingC, altitudeM },
    fillTempC: source.process.fillTempC,
    cookNotes: source.process.cookNotes,
    spec: source.spec,
    cautions: qcSpecCautions(source.spec, source.settings.productClass, source.settings.preservation ?? undefined),
    steps,
  };
}
