import { ChemistryInputError, requireFiniteNumber } from './errors';

/**
 * Temperature corrections for sucrose refractometer readings (°Brix to add to the reading).
 * Source: OIV Compendium of International Methods of Analysis, method OIV-MA-AS2-02
 * ("Evaluation by refractometry of the sugar concentration in grape musts…"), Table I.
 * Rows 10–17 °C were read from the published table (OIV Compendium of International Methods of
 * Wine and Must Analysis, "Evaluation of Sugar by Refractometry", Table I, as reproduced on
 * yumpu.com, document 12038601, p. 49). Rows 18, 19 and 21–25 °C fell outside the part that was
 * read: they are recalled (memory) and flagged in every result that uses them. Row 20 °C is zero
 * by definition. The published table also has a 75 % column, not used here.
 */
export const BRIX_COLUMNS_PCT: readonly number[] = [10, 15, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65, 70];

interface CorrectionRow {
  tempC: number;
  corrections: readonly number[];
  fromMemory: boolean;
}

export const BRIX_TEMPERATURE_CORRECTIONS: readonly CorrectionRow[] = [
  { tempC: 10, fromMemory: false, corrections: [-0.59, -0.62, -0.65, -0.67, -0.69, -0.71, -0.72, -0.73, -0.74, -0.75, -0.75, -0.75, -0.75] },
  { tempC: 11, fromMemory: false, corrections: [-0.54, -0.57, -0.59, -0.61, -0.63, -0.64, -0.65, -0.66, -0.67, -0.68, -0.68, -0.68, -0.68] },
  { tempC: 12, fromMemory: false, corrections: [-0.49, -0.51, -0.53, -0.55, -0.56, -0.57, -0.58, -0.59, -0.60, -0.60, -0.61, -0.61, -0.60] },
  { tempC: 13, fromMemory: false, corrections: [-0.43, -0.45, -0.47, -0.48, -0.50, -0.51, -0.52, -0.52, -0.53, -0.53, -0.53, -0.53, -0.53] },
  { tempC: 14, fromMemory: false, corrections: [-0.38, -0.39, -0.40, -0.42, -0.43, -0.44, -0.44, -0.45, -0.45, -0.46, -0.46, -0.46, -0.46] },
  { tempC: 15, fromMemory: false, corrections: [-0.32, -0.33, -0.34, -0.35, -0.36, -0.37, -0.37, -0.38, -0.38, -0.38, -0.38, -0.38, -0.38] },
  { tempC: 16, fromMemory: false, corrections: [-0.26, -0.27, -0.28, -0.28, -0.29, -0.30, -0.30, -0.30, -0.31, -0.31, -0.31, -0.31, -0.31] },
  { tempC: 17, fromMemory: false, corrections: [-0.20, -0.20, -0.21, -0.21, -0.22, -0.22, -0.23, -0.23, -0.23, -0.23, -0.23, -0.23, -0.23] },
  { tempC: 18, fromMemory: true, corrections: [-0.14, -0.14, -0.14, -0.14, -0.15, -0.15, -0.15, -0.15, -0.15, -0.16, -0.16, -0.16, -0.16] },
  { tempC: 19, fromMemory: true, corrections: [-0.07, -0.07, -0.07, -0.07, -0.07, -0.08, -0.08, -0.08, -0.08, -0.08, -0.08, -0.08, -0.08] },
  { tempC: 20, fromMemory: false, corrections: [0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0] },
  { tempC: 21, fromMemory: true, corrections: [0.07, 0.07, 0.07, 0.07, 0.08, 0.08, 0.08, 0.08, 0.08, 0.08, 0.08, 0.08, 0.08] },
  { tempC: 22, fromMemory: true, corrections: [0.14, 0.14, 0.15, 0.15, 0.15, 0.15, 0.15, 0.16, 0.16, 0.16, 0.16, 0.16, 0.16] },
  { tempC: 23, fromMemory: true, corrections: [0.21, 0.22, 0.22, 0.23, 0.23, 0.23, 0.23, 0.24, 0.24, 0.24, 0.24, 0.24, 0.24] },
  { tempC: 24, fromMemory: true, corrections: [0.29, 0.29, 0.30, 0.30, 0.31, 0.31, 0.31, 0.31, 0.31, 0.32, 0.32, 0.32, 0.32] },
  { tempC: 25, fromMemory: true, corrections: [0.36, 0.37, 0.38, 0.38, 0.39, 0.39, 0.40, 0.40, 0.40, 0.40, 0.40, 0.40, 0.40] },
];

export const BRIX_CORRECTION_RANGE = {
  minTempC: BRIX_TEMPERATURE_CORRECTIONS[0].tempC,
  maxTempC: BRIX_TEMPERATURE_CORRECTIONS[BRIX_TEMPERATURE_CORRECTIONS.length - 1].tempC,
  minBrix: BRIX_COLUMNS_PCT[0],
  maxBrix: BRIX_COLUMNS_PCT[BRIX_COLUMNS_PCT.length - 1],
} as const;

export interface BrixCorrection {
  readingBrix: number;
  sampleTempC: number;
  correctionBrix: number;
  correctedBrix20C: number;
  /** True when a recalled (unverified) table row took part in the interpolation. */
  usedRecalledValues: boolean;
  source: string;
}

function bracket(values: readonly number[], x: number): [number, number] {
  for (let i = 1; i < values.length; i += 1) {
    if (x <= values[i]) return [i - 1, i];
  }
  return [values.length - 2, values.length - 1];
}

/** Corrects a sucrose-refractometer reading to 20 °C by bilinear interpolation in the table. */
export function correctBrixTo20C(readingBrix: number, sampleTempC: number): BrixCorrection {
  requireFiniteNumber(readingBrix, 'readingBrix');
  requireFiniteNumber(sampleTempC, 'sampleTempC');
  const range = BRIX_CORRECTION_RANGE;
  if (readingBrix < range.minBrix || readingBrix > range.maxBrix) {
    throw new ChemistryInputError('readingBrix', `the correction table covers ${range.minBrix}–${range.maxBrix} °Brix`);
  }
  if (sampleTempC < range.minTempC || sampleTempC > range.maxTempC) {
    throw new ChemistryInputError('sampleTempC', `the correction table covers ${range.minTempC}–${range.maxTempC} °C; bring the sample nearer 20 °C`);
  }
  const temps = BRIX_TEMPERATURE_CORRECTIONS.map((r) => r.tempC);
  const [r0, r1] = bracket(temps, sampleTempC);
  const [c0, c1] = bracket(BRIX_COLUMNS_PCT, readingBrix);
  const rowLow = BRIX_TEMPERATURE_CORRECTIONS[r0];
  const rowHigh = BRIX_TEMPERATURE_CORRECTIONS[r1];
  const tT = (sampleTempC - rowLow.tempC) / (rowHigh.tempC - rowLow.tempC);
  const tB = (readingBrix - BRIX_COLUMNS_PCT[c0]) / (BRIX_COLUMNS_PCT[c1] - BRIX_COLUMNS_PCT[c0]);
  const low = rowLow.corrections[c0] + tB * (rowLow.corrections[c1] - rowLow.corrections[c0]);
  const high = rowHigh.corrections[c0] + tB * (rowHigh.corrections[c1] - rowHigh.corrections[c0]);
  const correctionBrix = low + tT * (high - low);
  // A row only counts as used when its interpolation weight is non-zero.
  const usedRecalledValues = (rowLow.fromMemory && tT < 1) || (rowHigh.fromMemory && tT > 0);
  return {
    readingBrix,
    sampleTempC,
    correctionBrix,
    correctedBrix20C: readingBrix + correctionBrix,
    usedRecalledValues,
    source: 'OIV-MA-AS2-02, Table I (temperature correction for sucrose refractometry)',
  };
}

/**
 * Beyond this distance from 20 °C a corrected reading close to a limit is worth reading again at
 * 20 °C: the table's step and the sample warming or cooling on the prism both grow with the gap.
 * Common practice, no published source. (Which rows were recalled is kept in `usedRecalledValues`
 * for code and tests; a screen does not speak of it.)
 */
export const CORRECTION_CAUTION_FROM_C = 3;

/** The one caution a screen shows beside a corrected reading, or null. */
export function correctionCaution(correction: Pick<BrixCorrection, 'sampleTempC'>): string | null {
  const gap = correction.sampleTempC - 20;
  if (Math.abs(gap) < CORRECTION_CAUTION_FROM_C) return null;
  return `Read ${Math.round(Math.abs(gap) * 10) / 10} °C ${gap > 0 ? 'above' : 'below'} 20 °C: if the result is close to a limit, bring the sample to 20 °C and read again.`;
}
