/**
 * QC specifications for production batches: defaults derived from a formula's chemistry, the
 * cautions a specification raises, and the check of one batch's readings against it. Pure.
 * Readings are compared at instrument resolution (°Brix and °C to 0.1, pH to 0.01), so a reading
 * shown as on the limit is on the limit.
 */
import { correctBrixTo20C, correctionCaution } from './refractometer';
import { rulesInForce } from './rule-sets';
import { ACID_FOOD_MAX_PH, HM_OPTIMUM, HOT_FILL_MIN_C, PRESERVATION_LABELS, REDUCED_SUGAR_BELOW_PCT, SAFETY_GOVERNANCE_SENTENCE, TRADE_PRACTICE_SOURCE, type Caution, type PreservationMethod } from './guidance';

export { HOT_FILL_MIN_C };
import type { BatchComputation } from './batch';

export interface QcSpec {
  /** Soluble solids window, refractometer °Brix corrected to 20 °C. */
  solidsMinBrix: number;
  solidsMaxBrix: number;
  phMin: number;
  phMax: number;
  minFillTempC: number;
  /** Declared net fill of one jar, g, and the tolerable negative error of one jar, g. */
  netFillG: number;
  netFillToleranceG: number;
  /** Lowest acceptable score on the 1–5 set-test scale, with what the kitchen should see. */
  setMinScore: number;
  setDescription: string;
  shelfLifeMonths: number;
  storageNotes: string;
}

/** Default half-width of the solids window around the target. Common practice, no published source. */
export const SOLIDS_WINDOW_HALF_WIDTH = 1;
/** Default half-width of the pH window around the planned pH. Common practice, no published source. */
export const PH_WINDOW_HALF_WIDTH = 0.2;
/** Margin kept below pH 4.6 for non-HM products. Common practice, no published source. */
export const NON_HM_PH_CEILING = 4.2;

/**
 * Tolerable negative error for one prepackage, by nominal quantity (g): Council Directive
 * 76/211/EEC, Annex I, 2.4, as transposed in the German FPackV § 9 (3) and the Austrian FPVO 1993
 * § 9 (1), which were read. Percentages apply to the nominal quantity and are rounded up to 0.1 g.
 * The bands meet without a jump (9 % of 50 g = 4.5 g, and so on), so each boundary belongs to both.
 */
export const TOLERABLE_NEGATIVE_ERROR: ReadonlyArray<{ fromG: number; toG: number; pct?: number; grams?: number }> = [
  { fromG: 5, toG: 50, pct: 9 },
  { fromG: 50, toG: 100, grams: 4.5 },
  { fromG: 100, toG: 200, pct: 4.5 },
  { fromG: 200, toG: 300, grams: 9 },
  { fromG: 300, toG: 500, pct: 3 },
  { fromG: 500, toG: 1000, grams: 15 },
  { fromG: 1000, toG: 10000, pct: 1.5 },
];

export function tolerableNegativeErrorG(nominalG: number): number | null {
  const row = TOLERABLE_NEGATIVE_ERROR.find((r) => nominalG >= r.fromG && nominalG <= r.toG);
  if (!row) return null;
  if (row.grams !== undefined) return row.grams;
  // Round up to 0.1 g; the small epsilon keeps 3 % of 400 g at 12.0, not 12.1, despite binary floats.
  return Math.ceil((nominalG * (row.pct ?? 0)) / 100 * 10 - 1e-9) / 10;
}

const round = (x: number, decimals: number) => Math.round(x * 10 ** decimals) / 10 ** decimals;

/** The highest legal soluble-solids minimum for the product in its market on the rule date, if any. */
export function legalMinimumSolids(computation: Pick<BatchComputation, 'settings'>): number | null {
  const { ruleSet, ruleDate, productClass } = computation.settings;
  const minimums = rulesInForce(ruleSet, ruleDate)
    .filter((r) => r.metric === 'soluble_solids_pct' && r.productClasses.includes(productClass) && r.minimum !== undefined)
    .map((r) => r.minimum as number);
  return minimums.length ? Math.max(...minimums) : null;
}

function usesHighMethoxylPectin(computation: BatchComputation): boolean {
  return computation.massBalance.lines.some((l) => l.ingredient.kind === 'pectin' && l.massG > 0 &&
    (l.ingredient.pectinType === 'hm_rapid_set' || l.ingredient.pectinType === 'hm_slow_set'));
}

export function isReducedSugar(productClass: string, solidsMinBrix: number): boolean {
  return productClass === 'reduced_sugar_spread' || solidsMinBrix < REDUCED_SUGAR_BELOW_PCT;
}

/** The specification a promotion starts from; the developer and the head of product may tighten it. */
export function defaultQcSpec(computation: BatchComputation): QcSpec {
  const { settings } = computation;
  const target = settings.targetSolidsPct;
  const legalMin = legalMinimumSolids(computation);
  const solidsMin = round(Math.max(target - SOLIDS_WINDOW_HALF_WIDTH, legalMin ?? 0), 1);
  const solidsMax = round(Math.max(target + SOLIDS_WINDOW_HALF_WIDTH, solidsMin + 0.1), 1);

  const hm = usesHighMethoxylPectin(computation);
  const ceiling = hm ? HM_OPTIMUM.phMax + 0.2 : NON_HM_PH_CEILING;
  let phMin: number;
  let phMax: number;
  if (settings.plannedPh !== undefined) {
    phMin = round(Math.max(hm ? HM_OPTIMUM.phMin : 2.5, settings.plannedPh - PH_WINDOW_HALF_WIDTH), 2);
    phMax = round(Math.min(ceiling, settings.plannedPh + PH_WINDOW_HALF_WIDTH), 2);
    if (phMax <= phMin) phMax = round(Math.min(ACID_FOOD_MAX_PH, phMin + 0.1), 2);
  } else {
    phMin = HM_OPTIMUM.phMin;
    phMax = HM_OPTIMUM.phMax;
  }

  const reduced = isReducedSugar(settings.productClass, solidsMin);
  const netFillG = settings.jarNetFillG;
  return {
    solidsMinBrix: solidsMin,
    solidsMaxBrix: solidsMax,
    phMin,
    phMax,
    minFillTempC: HOT_FILL_MIN_C,
    netFillG,
    netFillToleranceG: tolerableNegativeErrorG(netFillG) ?? round(netFillG * 0.015, 1),
    setMinScore: reduced ? 3 : 4,
    setDescription: reduced ? 'Soft, spreadable set that wrinkles when pushed' : 'Clean set: wrinkles clearly and holds a line',
    // Shelf lives: common practice, no published source; each producer validates its own.
    shelfLifeMonths: reduced ? 6 : 12,
    storageNotes: reduced
      ? 'Store cool and dark. Refrigerate after opening and use within 4 weeks.'
      : 'Store cool and dark. Refrigerate after opening.',
  };
}

/** Problems in the specification itself: the numbers a form or an API must refuse. */
export function qcSpecProblems(spec: QcSpec): Array<{ field: keyof QcSpec; message: string }> {
  const problems: Array<{ field: keyof QcSpec; message: string }> = [];
  if (spec.solidsMinBrix >= spec.solidsMaxBrix) problems.push({ field: 'solidsMaxBrix', message: 'The solids maximum must be above the minimum.' });
  if (spec.phMin >= spec.phMax) problems.push({ field: 'phMax', message: 'The pH maximum must be above the minimum.' });
  if (spec.phMax > ACID_FOOD_MAX_PH) {
    problems.push({ field: 'phMax', message: `A preserve specification cannot allow pH above ${ACID_FOOD_MAX_PH}: above it the product is not an acid food and needs a validated low-acid process.` });
  }
  if (spec.netFillToleranceG >= spec.netFillG) problems.push({ field: 'netFillToleranceG', message: 'The fill tolerance must be smaller than the fill.' });
  return problems;
}

/** Cautions a specification carries onto the batch sheet. */
export function qcSpecCautions(spec: QcSpec, productClass: string, preservation?: PreservationMethod): Caution[] {
  const cautions: Caution[] = [];
  cautions.push({
    code: 'SPEC_PH_LIMIT',
    severity: spec.phMax > ACID_FOOD_MAX_PH ? 'danger' : 'info',
    title: `pH must stay at or below ${ACID_FOOD_MAX_PH}`,
    message: `Any batch reading above pH ${ACID_FOOD_MAX_PH} fails and is held, whatever the window says: above it the product is low-acid and can support Clostridium botulinum. ${SAFETY_GOVERNANCE_SENTENCE}`,
    source: '21 CFR 114.3 (acid foods: equilibrium pH 4.6 or below)',
  });
  if (spec.minFillTempC < HOT_FILL_MIN_C) {
    cautions.push({
      code: 'SPEC_FILL_BELOW_HOT_FILL',
      severity: 'danger',
      title: 'Fill temperature below the hot-fill minimum',
      message: `The minimum fill of ${spec.minFillTempC} °C is below the ${HOT_FILL_MIN_C} °C hot-fill minimum. A cooler fill does not pasteurise the jar and headspace; it needs a validated post-fill heat process. ${SAFETY_GOVERNANCE_SENTENCE}`,
      // Common practice, no published source.
      source: TRADE_PRACTICE_SOURCE,
    });
  }
  if (isReducedSugar(productClass, spec.solidsMinBrix)) {
    cautions.push({
      code: 'SPEC_REDUCED_SUGAR_STORAGE',
      severity: preservation ? 'warning' : 'danger',
      title: preservation ? 'Reduced sugar: storage and process matter' : 'Reduced sugar with no preservation stated',
      message: `Below ${REDUCED_SUGAR_BELOW_PCT} % solids sugar does not preserve the product: ${preservation ? `the formula states ${PRESERVATION_LABELS[preservation].toLowerCase()}; it still needs` : 'it needs a validated heat process in sealed jars (or a permitted preservative), and'} a refrigerated-after-opening label and a shorter shelf life. ${SAFETY_GOVERNANCE_SENTENCE}`,
      source: 'Council Directive 2001/113/EC, Annex I and CXS 296-2009 (60 % soluble solids floor)',
    });
  }
  return cautions;
}

export interface BatchReadings {
  brixReading: number;
  brixSampleTempC: number;
  ph: number;
  fillTempC: number;
  /** Mean and lightest of the jars weighed, g (optional: not every batch weighs a sample). */
  netFillMeanG?: number | null;
  netFillMinG?: number | null;
  setTestScore?: number | null;
}

export type QcCheckKey = 'solids' | 'ph' | 'fill_temperature' | 'net_fill' | 'set';
export type QcCheckStatus = 'pass' | 'fail' | 'not_measured';
/** The words screens and CSV exports use for a check's status. */
export const QC_CHECK_STATUS_LABELS: Record<QcCheckStatus, string> = { pass: 'Pass', fail: 'Fail', not_measured: 'Missing' };

export interface QcCheck {
  key: QcCheckKey;
  label: string;
  /** The value compared, after correction and rounding, or null when not measured. */
  value: number | null;
  limit: string;
  status: QcCheckStatus;
  reason: string;
}

export interface BatchCheckResult {
  /** `incomplete`: nothing failed, but a check the spec requires (net fill, set test) was not measured. */
  outcome: 'pass' | 'fail' | 'incomplete';
  checks: QcCheck[];
  /** Set when the 20 °C correction used a table row that was not verified. */
  brixCorrectionNote: string | null;
  correctedBrix20C: number;
}

const f = (x: number, d: number) => x.toFixed(d);

/** Every check of the spec is required: one failure fails the batch, one missing reading leaves it incomplete. */
export function outcomeOfChecks(checks: readonly QcCheck[]): BatchCheckResult['outcome'] {
  if (checks.some((c) => c.status === 'fail')) return 'fail';
  if (checks.some((c) => c.status === 'not_measured')) return 'incomplete';
  return 'pass';
}

export function checkBatchAgainstSpec(spec: QcSpec, r: BatchReadings): BatchCheckResult {
  const correction = correctBrixTo20C(r.brixReading, r.brixSampleTempC);
  const brix = round(correction.correctedBrix20C, 1);
  const ph = round(r.ph, 2);
  const fill = round(r.fillTempC, 1);
  const checks: QcCheck[] = [];

  const solidsLimit = `${f(spec.solidsMinBrix, 1)}–${f(spec.solidsMaxBrix, 1)} °Brix at 20 °C`;
  checks.push({
    key: 'solids', label: 'Soluble solids', value: brix, limit: solidsLimit,
    ...(brix < spec.solidsMinBrix
      ? { status: 'fail' as const, reason: `${f(brix, 1)} °Brix is below the minimum ${f(spec.solidsMinBrix, 1)}: under-cooked, risk of a weak set and of spoilage.` }
      : brix > spec.solidsMaxBrix
        ? { status: 'fail' as const, reason: `${f(brix, 1)} °Brix is above the maximum ${f(spec.solidsMaxBrix, 1)}: over-cooked, risk of a stiff set, darkening or crystallisation.` }
        : { status: 'pass' as const, reason: `${f(brix, 1)} °Brix is within ${solidsLimit}.` }),
  });

  const phLimit = `pH ${f(spec.phMin, 2)}–${f(spec.phMax, 2)}`;
  checks.push({
    key: 'ph', label: 'pH', value: ph, limit: phLimit,
    ...(ph > ACID_FOOD_MAX_PH
      ? { status: 'fail' as const, reason: `pH ${f(ph, 2)} is above ${ACID_FOOD_MAX_PH}: not an acid food. Hold the batch; do not release. ${SAFETY_GOVERNANCE_SENTENCE}` }
      : ph < spec.phMin
        ? { status: 'fail' as const, reason: `pH ${f(ph, 2)} is below ${f(spec.phMin, 2)}: too acid, the gel may weep.` }
        : ph > spec.phMax
          ? { status: 'fail' as const, reason: `pH ${f(ph, 2)} is above ${f(spec.phMax, 2)}: the set may fail.` }
          : { status: 'pass' as const, reason: `pH ${f(ph, 2)} is within ${f(spec.phMin, 2)}–${f(spec.phMax, 2)}.` }),
  });

  checks.push({
    key: 'fill_temperature', label: 'Fill temperature', value: fill, limit: `at least ${f(spec.minFillTempC, 1)} °C`,
    ...(fill < spec.minFillTempC
      ? { status: 'fail' as const, reason: `Filled at ${f(fill, 1)} °C, below the minimum ${f(spec.minFillTempC, 1)} °C: the jar and headspace were not held hot enough. ${SAFETY_GOVERNANCE_SENTENCE}` }
      : { status: 'pass' as const, reason: `Filled at ${f(fill, 1)} °C.` }),
  });

  const lowest = spec.netFillG - spec.netFillToleranceG;
  const fillLimit = `mean ≥ ${f(spec.netFillG, 0)} g, no jar below ${f(lowest, 1)} g`;
  if (r.netFillMeanG == null && r.netFillMinG == null) {
    checks.push({ key: 'net_fill', label: 'Net fill', value: null, limit: fillLimit, status: 'not_measured', reason: 'No jars weighed.' });
  } else {
    const mean = r.netFillMeanG == null ? null : round(r.netFillMeanG, 1);
    const min = r.netFillMinG == null ? null : round(r.netFillMinG, 1);
    const failures: string[] = [];
    if (mean !== null && mean < spec.netFillG) failures.push(`mean ${f(mean, 1)} g is below the declared ${f(spec.netFillG, 0)} g`);
    if (min !== null && min < lowest) failures.push(`lightest jar ${f(min, 1)} g is below ${f(lowest, 1)} g`);
    checks.push({
      key: 'net_fill', label: 'Net fill', value: mean ?? min, limit: fillLimit,
      status: failures.length ? 'fail' : 'pass',
      reason: failures.length ? `${failures.join('; ')}.` : 'Fill within the declared quantity and tolerance.',
    });
  }

  if (r.setTestScore == null) {
    checks.push({ key: 'set', label: 'Set test', value: null, limit: `score ≥ ${spec.setMinScore}`, status: 'not_measured', reason: 'No set test recorded.' });
  } else {
    checks.push({
      key: 'set', label: 'Set test', value: r.setTestScore, limit: `score ≥ ${spec.setMinScore}`,
      ...(r.setTestScore < spec.setMinScore
        ? { status: 'fail' as const, reason: `Set score ${r.setTestScore} is below ${spec.setMinScore} (${spec.setDescription.toLowerCase()}).` }
        : { status: 'pass' as const, reason: `Set score ${r.setTestScore}.` }),
    });
  }

  return {
    outcome: outcomeOfChecks(checks),
    checks,
    correctedBrix20C: brix,
    brixCorrectionNote: correctionCaution(correction),
  };
}
