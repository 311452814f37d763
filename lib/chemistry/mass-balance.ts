import { ChemistryInputError, requireFiniteNumber } from './errors';
import { isMassUnit, toGrams } from './units';
import type { FormulaLineInput, FormulaSettings, IngredientComposition } from './types';

export interface ResolvedLine {
  index: number;
  ingredient: IngredientComposition;
  massG: number;
  solidsG: number;
}

export interface MassBalance {
  lines: ResolvedLine[];
  totalChargeG: number;
  solubleSolidsInG: number;
  /** Soluble solids of the uncooked charge, % w/w. */
  chargeSolidsPct: number;
  targetSolidsPct: number;
  finishedMassG: number;
  /** Negative when the target is below the charge solids: water would have to be added. */
  waterToEvaporateG: number;
  jarsFilled: number;
  fruitMassG: number;
  fruitPer1000gFinishedG: number;
  sweetenerMassG: number;
  sweetenerSolidsG: number;
  /** Fruit mass ÷ sweetener mass as weighed; null without sweetener. */
  fruitToSweetenerRatio: number | null;
  /** Parts of fruit per 55 parts of sweetener solids (21 CFR 150.160 phrasing); null without sweetener. */
  fruitPartsPer55SweetenerParts: number | null;
  pectinMassG: number;
  pectinPctOfCharge: number;
  pectinPctOfFinished: number;
  acidMassG: number;
  acidPctOfCharge: number;
  acidPctOfFinished: number;
  /** Σ pectin mass × grade: grams of sugar the pectin is rated to set (0 when no grade is given). */
  pectinRatedSugarCapacityG: number;
}

const JAR_COUNT_EPSILON = 1e-9;

function validateComposition(ingredient: IngredientComposition, path: string): void {
  if (!ingredient || typeof ingredient !== 'object') {
    throw new ChemistryInputError(path, 'ingredient is missing');
  }
  const solidsPct = requireFiniteNumber(ingredient.solidsPct, `${path}.solidsPct`);
  if (solidsPct < 0 || solidsPct > 100) {
    throw new ChemistryInputError(`${path}.solidsPct`, 'soluble solids must be between 0 and 100 %');
  }
  if (ingredient.pectinGrade !== undefined) {
    const grade = requireFiniteNumber(ingredient.pectinGrade, `${path}.pectinGrade`);
    if (grade <= 0) throw new ChemistryInputError(`${path}.pectinGrade`, 'pectin grade must be positive');
  }
}

export function validateSettings(settings: FormulaSettings): void {
  if (!settings || typeof settings !== 'object') {
    throw new ChemistryInputError('settings', 'settings are missing');
  }
  const target = requireFiniteNumber(settings.targetSolidsPct, 'settings.targetSolidsPct');
  if (target <= 0 || target >= 100) {
    throw new ChemistryInputError('settings.targetSolidsPct', 'target soluble solids must be above 0 and below 100 %');
  }
  const jar = requireFiniteNumber(settings.jarNetFillG, 'settings.jarNetFillG');
  if (jar <= 0) throw new ChemistryInputError('settings.jarNetFillG', 'jar net fill must be positive');
  if (typeof settings.ruleDate !== 'string' || !/^\d{4}-\d{2}-\d{2}/.test(settings.ruleDate) ||
      Number.isNaN(Date.parse(settings.ruleDate))) {
    throw new ChemistryInputError('settings.ruleDate', 'rule date must be an ISO date such as 2026-06-14');
  }
  if (settings.altitudeM !== undefined) {
    const altitude = requireFiniteNumber(settings.altitudeM, 'settings.altitudeM');
    // The standard-atmosphere formula used for boiling point is for the troposphere (< 11 km).
    if (altitude < -500 || altitude > 11000) {
      throw new ChemistryInputError('settings.altitudeM', 'altitude must be between -500 and 11000 m');
    }
  }
  if (settings.measuredWaterBoilingC !== undefined) {
    const bp = requireFiniteNumber(settings.measuredWaterBoilingC, 'settings.measuredWaterBoilingC');
    if (bp < 60 || bp > 105) {
      throw new ChemistryInputError('settings.measuredWaterBoilingC', 'a measured water boiling point must be between 60 and 105 °C');
    }
  }
  if (settings.plannedPh !== undefined) {
    const ph = requireFiniteNumber(settings.plannedPh, 'settings.plannedPh');
    if (ph < 0 || ph > 14) throw new ChemistryInputError('settings.plannedPh', 'pH must be between 0 and 14');
  }
  if (settings.sucroseInversionPct !== undefined) {
    const inverted = requireFiniteNumber(settings.sucroseInversionPct, 'settings.sucroseInversionPct');
    if (inverted < 0 || inverted > 100) throw new ChemistryInputError('settings.sucroseInversionPct', 'the inverted share of sucrose must be between 0 and 100 %');
  }
}

/**
 * Resolves every line to grams. `pct_fruit` lines are a percentage of the total mass of the
 * fruit lines given in mass units, so fruit itself cannot be given as `pct_fruit`.
 */
export function resolveLines(lines: FormulaLineInput[]): ResolvedLine[] {
  if (!Array.isArray(lines) || lines.length === 0) {
    throw new ChemistryInputError('lines', 'a formula needs at least one line');
  }
  let fruitMassG = 0;
  lines.forEach((line, index) => {
    const path = `lines[${index}]`;
    if (!line || typeof line !== 'object') throw new ChemistryInputError(path, 'line is missing');
    validateComposition(line.ingredient, `${path}.ingredient`);
    const quantity = requireFiniteNumber(line.quantity, `${path}.quantity`);
    if (quantity < 0) throw new ChemistryInputError(`${path}.quantity`, 'quantity cannot be negative');
    if (line.unit === 'pct_fruit') {
      if (line.ingredient.kind === 'fruit') {
        throw new ChemistryInputError(`${path}.unit`, 'fruit cannot be given as a percentage of fruit');
      }
    } else if (isMassUnit(line.unit)) {
      if (line.ingredient.kind === 'fruit') fruitMassG += toGrams(quantity, line.unit);
    } else {
      throw new ChemistryInputError(`${path}.unit`, `unknown unit "${String(line.unit)}"`);
    }
  });

  return lines.map((line, index) => {
    let massG: number;
    if (line.unit === 'pct_fruit') {
      if (fruitMassG <= 0) {
        throw new ChemistryInputError(`lines[${index}].unit`, 'percent of fruit needs at least one fruit line with a mass');
      }
      massG = (line.quantity / 100) * fruitMassG;
    } else {
      massG = toGrams(line.quantity, line.unit);
    }
    return { index, ingredient: line.ingredient, massG, solidsG: massG * (line.ingredient.solidsPct / 100) };
  });
}

function sumMass(lines: ResolvedLine[], predicate: (line: ResolvedLine) => boolean): number {
  return lines.filter(predicate).reduce((total, line) => total + line.massG, 0);
}

/** Jars filled: whole jars only; the epsilon keeps 4 × 250 g from flooring to 3 through rounding noise. */
export function jarsFromFinishedMass(finishedMassG: number, jarNetFillG: number): number {
  return Math.max(0, Math.floor(finishedMassG / jarNetFillG + JAR_COUNT_EPSILON));
}

/**
 * Batch mass balance: finished mass = soluble solids in ÷ target solids fraction;
 * evaporation = total charge − finished mass.
 */
export function computeMassBalance(lines: FormulaLineInput[], settings: FormulaSettings): MassBalance {
  validateSettings(settings);
  const resolved = resolveLines(lines);
  const totalChargeG = resolved.reduce((total, line) => total + line.massG, 0);
  if (totalChargeG <= 0) throw new ChemistryInputError('lines', 'the total charge must be more than 0 g');
  const solubleSolidsInG = resolved.reduce((total, line) => total + line.solidsG, 0);
  if (solubleSolidsInG <= 0) {
    throw new ChemistryInputError('lines', 'the formula has no soluble solids, so no finished mass can be computed');
  }
  const targetFraction = settings.targetSolidsPct / 100;
  const finishedMassG = solubleSolidsInG / targetFraction;

  const fruitMassG = sumMass(resolved, (l) => l.ingredient.kind === 'fruit');
  const sweeteners = resolved.filter((l) => l.ingredient.kind === 'sweetener');
  const sweetenerMassG = sweeteners.reduce((t, l) => t + l.massG, 0);
  const sweetenerSolidsG = sweeteners.reduce((t, l) => t + l.solidsG, 0);
  const pectinMassG = sumMass(resolved, (l) => l.ingredient.kind === 'pectin');
  const acidMassG = sumMass(resolved, (l) => l.ingredient.kind === 'acid');
  const pectinRatedSugarCapacityG = resolved
    .filter((l) => l.ingredient.kind === 'pectin' && l.ingredient.pectinGrade !== undefined)
    .reduce((t, l) => t + l.massG * (l.ingredient.pectinGrade ?? 0), 0);

  // 21 CFR 150.160(d)(1) states the ratio as parts by weight of fruit to 55 parts by weight of the
  // saccharine (sweetener) ingredient. We count the sweetener as its solids, not as weighed, so the
  // water in a syrup or honey does not inflate the sweetener side; sucrose is the same either way.
  // 21 CFR 150.140 (jelly) says the weight of an optional saccharine ingredient means the weight of
  // its solids (as summarised from the GPO text by law.foodmate.net); the matching clause of
  // 150.160 was not read, so applying it to jams is our reading (memory).
  // The fruit side is the fruit as weighed (single strength); concentrated fruit would need the
  // regulation's own adjustment, which this module does not make.
  const fruitPartsPer55SweetenerParts = sweetenerSolidsG > 0 ? (fruitMassG / sweetenerSolidsG) * 55 : null;

  return {
    lines: resolved,
    totalChargeG,
    solubleSolidsInG,
    chargeSolidsPct: (solubleSolidsInG / totalChargeG) * 100,
    targetSolidsPct: settings.targetSolidsPct,
    finishedMassG,
    waterToEvaporateG: totalChargeG - finishedMassG,
    jarsFilled: jarsFromFinishedMass(finishedMassG, settings.jarNetFillG),
    fruitMassG,
    fruitPer1000gFinishedG: (fruitMassG / finishedMassG) * 1000,
    sweetenerMassG,
    sweetenerSolidsG,
    fruitToSweetenerRatio: sweetenerMassG > 0 ? fruitMassG / sweetenerMassG : null,
    fruitPartsPer55SweetenerParts,
    pectinMassG,
    pectinPctOfCharge: (pectinMassG / totalChargeG) * 100,
    pectinPctOfFinished: (pectinMassG / finishedMassG) * 100,
    acidMassG,
    acidPctOfCharge: (acidMassG / totalChargeG) * 100,
    acidPctOfFinished: (acidMassG / finishedMassG) * 100,
    pectinRatedSugarCapacityG,
  };
}
