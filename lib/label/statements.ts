/**
 * The statements the jam rules put on the label, and the check of a measured Brix against the
 * stated sugar. PURE.
 *
 * Council Directive 2001/113/EC Art. 2(3) and 2(4): English text as adopted (legislation.gov.uk
 * copy, read up to "…for the finished product, subject"); the rest of point 4 — the ± 3 degree
 * tolerance and the exemption — read in the German consolidated text and rendered here:
 * - "The labelling shall indicate the fruit content by including the words 'prepared with … g of
 *   fruit per 100 g' of the finished product, after deduction of the weight of water used in
 *   preparing the aqueous extracts, if appropriate."
 * - "The labelling shall indicate the total sugar content by the words 'total sugar content … g
 *   per 100 g', the figure indicated representing the value determined by refractometer at 20 °C
 *   for the finished product, subject to a tolerance of ± 3 refractometric degrees." The second
 *   subparagraph spares the statement where a nutrition claim for sugars is on the label.
 * Directive (EU) 2024/1438 (from 14 June 2026) replaces the Directive 2000/13/EC reference by
 * Regulation (EU) No 1169/2011 and raises the fruit minimums; what it does to points 3 and 4
 * could not be read (its amending text was reachable only in part), so both editions compute the
 * statements the same way and only the edition label changes (memory, unverified).
 */
import { ChemistryInputError, requireFiniteNumber } from '@/lib/chemistry/errors';
import { EU_2024_AMENDMENT_FROM } from '@/lib/chemistry/rule-sets';
import { PRODUCT_CLASS_NAMES } from '@/lib/chemistry/types';
import type { LabelInput } from './types';
import { validateLabelInput } from './validate';

/** ± refractometric degrees between the stated and the measured value (Art. 2(4)). */
export const STATED_SUGAR_TOLERANCE_DEGREES = 3;

/** Product classes the Directive's reserved names cover (Annex I); a reduced-sugar spread is not one of them. */
const DIRECTIVE_CLASSES = new Set(['jam', 'extra_jam', 'jelly', 'marmalade']);

export interface JamStatement {
  /** The text for the label, in the Directive's words. */
  text: string;
  /** The figure printed, after rounding. */
  statedValue: number;
  /** The figure before rounding. */
  exactValue: number;
  /** Whether the rules require it on this product. */
  required: boolean;
  reason: string;
  source: string;
}

export interface JamStatements {
  edition: string;
  fruit: JamStatement | null;
  totalSugar: JamStatement;
  notes: string[];
}

export interface StatementOptions {
  /** Water added to make aqueous extracts (jelly), deducted from the fruit (Art. 2(3)). */
  extractionWaterG?: number;
  /** A nutrition claim for sugars is on the label: the total sugar statement is then not required (Art. 2(4), second subparagraph). */
  sugarsClaimMade?: boolean;
}

function statementEdition(isoDate: string): string {
  return isoDate.slice(0, 10) < EU_2024_AMENDMENT_FROM
    ? 'Council Directive 2001/113/EC, Article 2'
    : 'Council Directive 2001/113/EC, Article 2, as amended by Directive (EU) 2024/1438';
}

/**
 * Fruit per 100 g, rounded down to a whole gram: the label never claims more fruit than was used
 * (common practice, no published source; the Directive sets no rounding).
 */
export function fruitPer100g(input: LabelInput, extractionWaterG = 0): number {
  validateLabelInput(input);
  const finished = input.massBalance.finishedMassG;
  const extraction = requireFiniteNumber(extractionWaterG, 'extractionWaterG');
  if (extraction < 0) throw new ChemistryInputError('extractionWaterG', 'extraction water cannot be negative');
  const fruitG = input.lines.filter((l) => l.ingredient.kind === 'fruit').reduce((t, l) => t + l.grams, 0);
  if (extraction > fruitG) throw new ChemistryInputError('extractionWaterG', 'extraction water cannot exceed the fruit weighed');
  return ((fruitG - extraction) / finished) * 100;
}

/**
 * Total sugar as stated: the refractometer value at 20 °C of the finished product. Before a cook
 * it is the formula's target soluble solids; printed as a whole number (rounded half up), which
 * keeps the printed value within 0.5 of the target, well inside the ± 3 tolerance.
 */
export function statedTotalSugar(targetSolidsPct: number): number {
  const target = requireFiniteNumber(targetSolidsPct, 'targetSolidsPct');
  if (target <= 0 || target >= 100) throw new ChemistryInputError('targetSolidsPct', 'target soluble solids must be above 0 and below 100 %');
  return Math.round(target);
}

/** The two statements of Art. 2(3)–(4) for a formula. */
export function jamStatements(input: LabelInput, options: StatementOptions = {}): JamStatements {
  validateLabelInput(input);
  const settings = input.settings;
  const notes: string[] = [];
  const inScope = settings.ruleSet === 'eu' && DIRECTIVE_CLASSES.has(settings.productClass);
  const scopeReason = settings.ruleSet !== 'eu'
    ? 'These statements are required by the EU jam rules; other markets do not require them.'
    : `A ${PRODUCT_CLASS_NAMES[settings.productClass]} is not one of the Directive's reserved names, so the statements are optional.`;
  const source = statementEdition(settings.ruleDate);

  const exactFruit = fruitPer100g(input, options.extractionWaterG ?? 0);
  const hasFruit = input.lines.some((l) => l.ingredient.kind === 'fruit' && l.grams > 0);
  const statedFruit = Math.floor(exactFruit + 1e-9);
  const fruit: JamStatement | null = hasFruit
    ? {
      text: `Prepared with ${statedFruit} g of fruit per 100 g`,
      statedValue: statedFruit,
      exactValue: exactFruit,
      required: inScope,
      reason: inScope ? 'Required on every jam, jelly and marmalade (Article 2(3)).' : scopeReason,
      source: `${source}(3)`,
    }
    : null;
  if (!hasFruit) notes.push('The formula has no fruit line, so there is no fruit statement.');
  if ((options.extractionWaterG ?? 0) > 0) notes.push('The water used to make the aqueous extracts is deducted from the fruit.');

  const exactSugar = requireFiniteNumber(input.massBalance.targetSolidsPct, 'massBalance.targetSolidsPct');
  const statedSugar = statedTotalSugar(exactSugar);
  const sugarRequired = inScope && !options.sugarsClaimMade;
  const totalSugar: JamStatement = {
    text: `Total sugar content ${statedSugar} g per 100 g`,
    statedValue: statedSugar,
    exactValue: exactSugar,
    required: sugarRequired,
    reason: !inScope
      ? scopeReason
      : options.sugarsClaimMade
        ? 'Not required while a nutrition claim for sugars is on the label (Article 2(4), second subparagraph).'
        : `Required; the figure is the refractometer value at 20 °C of the finished product, within ± ${STATED_SUGAR_TOLERANCE_DEGREES} degrees (Article 2(4)).`,
    source: `${source}(4)`,
  };
  notes.push('The sugar figure is the planned Brix; confirm it on the finished product by refractometer at 20 °C.');
  return { edition: source, fruit, totalSugar, notes };
}

export interface StatedSugarComparison {
  stated: number;
  measuredBrix: number;
  /** Measured − stated, refractometric degrees. */
  difference: number;
  tolerance: number;
  withinTolerance: boolean;
  message: string;
}

function requireBrix(value: unknown, field: string): number {
  const n = requireFiniteNumber(value, field);
  if (n < 0 || n > 100) throw new ChemistryInputError(field, 'must be between 0 and 100 °Brix');
  return n;
}

/**
 * A cook's or batch's measured Brix against the stated total sugar; pass the reading corrected to
 * 20 °C (lib/chemistry/refractometer.ts), as the statement is. Within when the
 * difference is at most ± 3 refractometric degrees (Art. 2(4)); exactly 3 is within.
 */
export function compareStatedSugar(stated: number, measuredBrix: number): StatedSugarComparison {
  const s = requireBrix(stated, 'stated');
  const m = requireBrix(measuredBrix, 'measuredBrix');
  const difference = m - s;
  // Rounded to 0.01 degree first so 68.0 − 65.0 stays exactly 3 through float noise.
  const rounded = Math.round(difference * 100) / 100;
  const withinTolerance = Math.abs(rounded) <= STATED_SUGAR_TOLERANCE_DEGREES;
  const direction = rounded > 0 ? 'above' : 'below';
  const message = rounded === 0
    ? `Measured ${m} °Brix equals the stated ${s} g per 100 g.`
    : `Measured ${m} °Brix is ${Math.abs(rounded)} ${direction} the stated ${s} g per 100 g: ${withinTolerance ? 'within' : 'outside'} the ± ${STATED_SUGAR_TOLERANCE_DEGREES} tolerance.`;
  return { stated: s, measuredBrix: m, difference: rounded, tolerance: STATED_SUGAR_TOLERANCE_DEGREES, withinTolerance, message };
}
