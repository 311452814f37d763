/**
 * Nutrients per 100 g of finished product, from the formula's mass balance. Pure.
 *
 * Every nutrient is summed over the lines as grams × value/100. Boiling removes water and nothing
 * else, so the finished water is Σ water − (Σ line mass − finished mass); when the target solids
 * are below the charge's, that difference is negative and the water to add is counted in. Batch
 * totals are divided by finished mass/100.
 * Source: the method of docs/nutrition-check-values.md ("Check values"), which follows the
 * recipe calculation of USDA SR28 (no nutrient losses; water by evaporation only).
 */
import { ChemistryInputError, requireFiniteNumber } from '@/lib/chemistry/errors';
import { NUTRIENT_KEYS, type FinishedNutrients, type LabelInput, type LabelLine, type NutrientKey, type NutrientValues } from './types';

/** Largest line accepted, g (1000 t): past it the figures are typing errors, not batches. */
export const MAX_LINE_GRAMS = 1e9;

/**
 * Upper bounds per 100 g of an ingredient. Grams cannot pass 100; energy cannot pass pure fat
 * (37 kJ/9 kcal per g, Regulation (EU) 1169/2011 Annex XIV); sodium cannot pass pure sodium
 * chloride (39.3 % sodium, from the atomic masses 22.99 and 35.45); cholesterol cannot pass 100 g.
 */
const NUTRIENT_MAXIMUM: Record<NutrientKey, number> = {
  waterG: 100, energyKcal: 900, energyKj: 3700, proteinG: 100, fatG: 100, saturatesG: 100,
  carbohydrateG: 100, sugarsG: 100, sucroseG: 100, glucoseG: 100, fructoseG: 100, fibreG: 100,
  polyolsG: 100, organicAcidsG: 100, sodiumMg: 39340, cholesterolMg: 100_000,
};

function requireLines(input: LabelInput): LabelLine[] {
  if (!input || typeof input !== 'object') throw new ChemistryInputError('input', 'the label input is missing');
  if (!Array.isArray(input.lines) || input.lines.length === 0) {
    throw new ChemistryInputError('lines', 'a label needs at least one formula line');
  }
  input.lines.forEach((line, index) => validateLine(line, `lines[${index}]`));
  return input.lines;
}

function validateLine(line: LabelLine, path: string): void {
  if (!line || typeof line !== 'object') throw new ChemistryInputError(path, 'line is missing');
  const grams = requireFiniteNumber(line.grams, `${path}.grams`);
  if (grams < 0) throw new ChemistryInputError(`${path}.grams`, 'a line cannot weigh less than 0 g');
  if (grams > MAX_LINE_GRAMS) throw new ChemistryInputError(`${path}.grams`, 'a line cannot weigh more than 1000 tonnes');
  const ingredient = line.ingredient;
  if (!ingredient || typeof ingredient !== 'object') throw new ChemistryInputError(`${path}.ingredient`, 'ingredient is missing');
  if (typeof ingredient.labelName !== 'string') throw new ChemistryInputError(`${path}.ingredient.labelName`, 'the ingredient needs a name');
  const nutrients = ingredient.nutrients;
  if (!nutrients || typeof nutrients !== 'object') throw new ChemistryInputError(`${path}.ingredient.nutrients`, 'the composition is missing');
  for (const key of NUTRIENT_KEYS) {
    const value: unknown = nutrients[key];
    if (value === null) continue;
    const field = `${path}.ingredient.nutrients.${key}`;
    const number = requireFiniteNumber(value, field);
    if (number < 0) throw new ChemistryInputError(field, 'a nutrient cannot be negative');
    if (number > NUTRIENT_MAXIMUM[key]) throw new ChemistryInputError(field, `at most ${NUTRIENT_MAXIMUM[key]} per 100 g`);
  }
}

function requireFinishedMass(input: LabelInput): number {
  const massBalance = input.massBalance;
  if (!massBalance || typeof massBalance !== 'object') throw new ChemistryInputError('massBalance', 'the mass balance is missing');
  const finished = requireFiniteNumber(massBalance.finishedMassG, 'massBalance.finishedMassG');
  if (finished <= 0) throw new ChemistryInputError('massBalance.finishedMassG', 'the finished mass must be more than 0 g');
  return finished;
}

interface BatchSum { totalG: number; known: boolean; unknownFrom: string[] }

/** Σ grams × value/100 over the lines that know the nutrient; the others are named. */
function sumNutrient(lines: LabelLine[], key: NutrientKey): BatchSum {
  let totalG = 0;
  let known = false;
  const unknownFrom: string[] = [];
  for (const line of lines) {
    // A line weighing nothing contributes nothing, so its unknowns do not make a figure incomplete.
    if (line.grams === 0) continue;
    const value = line.ingredient.nutrients[key];
    if (value === null) {
      if (!unknownFrom.includes(line.ingredient.labelName)) unknownFrom.push(line.ingredient.labelName);
      continue;
    }
    known = true;
    totalG += (line.grams * value) / 100;
  }
  return { totalG, known, unknownFrom };
}

/** The lines and finished mass of a label input, checked; throws ChemistryInputError otherwise. */
export function checkedLabelInput(input: LabelInput): { lines: LabelLine[]; finishedMassG: number } {
  const lines = requireLines(input);
  return { lines, finishedMassG: requireFinishedMass(input) };
}

/** Per 100 g of finished product, unrounded. Throws ChemistryInputError on input it cannot use. */
export function finishedNutrients(input: LabelInput): FinishedNutrients {
  const { lines, finishedMassG } = checkedLabelInput(input);
  const chargeG = lines.reduce((total, line) => total + line.grams, 0);
  if (chargeG <= 0) throw new ChemistryInputError('lines', 'the lines weigh 0 g in total');
  // Negative when water has to be added to reach the target.
  const waterLostG = chargeG - finishedMassG;
  const perHundred = finishedMassG / 100;

  const values = {} as NutrientValues;
  const unknownFrom: FinishedNutrients['unknownFrom'] = {};
  for (const key of NUTRIENT_KEYS) {
    const sum = sumNutrient(lines, key);
    if (sum.unknownFrom.length > 0) unknownFrom[key] = sum.unknownFrom;
    if (!sum.known) {
      values[key] = null;
      continue;
    }
    const batchG = key === 'waterG' ? finishedWater(sum, waterLostG, finishedMassG) : sum.totalG;
    values[key] = batchG === null ? null : batchG / perHundred;
  }
  return { ...values, unknownFrom };
}

/**
 * Finished water, g per batch. With every water figure known, more water boiled off than the
 * lines hold means the finished mass is below their dry matter: the inputs contradict each other.
 * With some figures unknown the shortfall may be the unknown water, so the figure is withheld (null).
 */
function finishedWater(sum: BatchSum, waterLostG: number, finishedMassG: number): number | null {
  const waterG = sum.totalG - waterLostG;
  // Rounding noise of a few µg must not trip the check.
  const tolerance = 1e-9 * Math.max(1, finishedMassG);
  if (waterG >= -tolerance) return Math.max(0, waterG);
  if (sum.unknownFrom.length > 0) return null;
  throw new ChemistryInputError(
    'massBalance.finishedMassG',
    'the finished mass is below the dry matter of the ingredients: more water would have to boil off than they hold',
  );
}
