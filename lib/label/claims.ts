/**
 * Sugar claims of Regulation (EC) No 1924/2006, Annex (nutrition claims and their conditions), as
 * amended by Commission Regulation (EU) No 1047/2012. PURE. Every check works on unrounded values
 * per 100 g of finished product and returns met / not met / cannot tell with the figures used.
 *
 * Wording read: LOW SUGARS ("no more than 5 g of sugars per 100 g for solids"), SUGARS-FREE ("no
 * more than 0,5 g of sugars per 100 g"), WITH NO ADDED SUGARS (no added mono- or disaccharides or
 * any other food used for its sweetening properties; "CONTAINS NATURALLY OCCURRING SUGARS" where
 * sugars are naturally present) — legislation.gov.uk copy of the Annex and a manufacturer's
 * quotation of it. REDUCED [NUTRIENT]: a reduction of at least 30 % compared to a similar product;
 * 1047/2012 adds that "reduced sugars" may only be made if the energy of the product is equal to
 * or less than that of the similar product (read in a French law firm's summary and a consumer
 * association's summary of 1047/2012; the Annex text itself was not reached, memory).
 */
import type { FinishedNutrients, LabelInput, NutrientKey } from './types';
import { validateLabelInput } from './validate';

export type ClaimStatus = 'met' | 'not_met' | 'cannot_tell';
export type SugarClaim = 'low_sugars' | 'sugars_free' | 'no_added_sugars' | 'reduced_sugars';

export interface ClaimFigure {
  label: string;
  value: number | null;
  unit: string;
}

export interface ClaimCheck {
  claim: SugarClaim;
  /** The claim as the Annex words it, for the screen. */
  title: string;
  status: ClaimStatus;
  requirement: string;
  figures: ClaimFigure[];
  /** Wording that must go with the claim on the label, when the claim is used. */
  accompanyingStatement: string | null;
  source: string;
  note?: string;
}

/** A product the "reduced" claim is compared with: another formula, or a typical jam. */
export interface ClaimReference {
  name: string;
  sugarsG: number | null;
  energyKj: number | null;
  /** True when some of the reference's ingredients had no sugar value (its figure is a lower bound). */
  sugarsIncomplete: boolean;
  source: string;
}

/** The product a claim is checked for: its nutrients, and its energy as declared (EU factors), kJ per 100 g. */
export interface ClaimSubject {
  nutrients: FinishedNutrients;
  energyKj: number | null;
  /** True when the energy figure leaves out an ingredient with unknown composition (a lower bound). */
  energyIncomplete?: boolean;
}

export const LOW_SUGARS_MAX_G = 5;
export const SUGARS_FREE_MAX_G = 0.5;
export const REDUCED_MIN_FRACTION = 0.3;

const ANNEX = 'Regulation (EC) No 1924/2006, Annex';
const ANNEX_1047 = 'Regulation (EC) No 1924/2006, Annex, as amended by Regulation (EU) No 1047/2012';

/**
 * A typical jam to compare with: USDA SR28 NDB 19297 "Jams and preserves", sugars 48.50 g per
 * 100 g; energy 1169.60 kJ per 100 g by the EU Annex XIV factors, as worked in
 * docs/nutrition-check-values.md section (c) (the SR28 printed 1163 kJ uses other factors).
 */
export const TYPICAL_JAM_REFERENCE: ClaimReference = {
  name: 'Typical jam (USDA "Jams and preserves")',
  sugarsG: 48.5,
  energyKj: 1169.6,
  sugarsIncomplete: false,
  source: 'USDA National Nutrient Database for Standard Reference, Legacy Release 28, NDB 19297; energy by Regulation (EU) No 1169/2011 Annex XIV factors',
};

function isIncomplete(nutrients: FinishedNutrients, key: NutrientKey): boolean {
  return (nutrients.unknownFrom?.[key]?.length ?? 0) > 0;
}

/** The Annex reference from another formula's finished nutrients. */
export function referenceFromNutrients(name: string, nutrients: FinishedNutrients, energyKj: number | null, source: string): ClaimReference {
  return { name, sugarsG: nutrients.sugarsG, energyKj, sugarsIncomplete: isIncomplete(nutrients, 'sugarsG'), source };
}

/**
 * "value ≤ limit" when `value` may be a lower bound (incomplete): over the limit is certain, under
 * it is not.
 */
function atMost(value: number | null, incomplete: boolean, limit: number): ClaimStatus {
  if (value === null) return 'cannot_tell';
  if (value > limit) return 'not_met';
  return incomplete ? 'cannot_tell' : 'met';
}

function unknownNote(nutrients: FinishedNutrients, key: NutrientKey): string | undefined {
  const names = nutrients.unknownFrom?.[key];
  if (nutrients[key] === null) return 'No ingredient has a sugar value, so the claim cannot be checked.';
  return names && names.length > 0 ? `Sugar values are missing for ${names.join(', ')}; the figure may be higher.` : undefined;
}

function sugarLimitCheck(claim: 'low_sugars' | 'sugars_free', nutrients: FinishedNutrients): ClaimCheck {
  const limit = claim === 'low_sugars' ? LOW_SUGARS_MAX_G : SUGARS_FREE_MAX_G;
  return {
    claim,
    title: claim === 'low_sugars' ? 'Low sugars' : 'Sugars-free',
    status: atMost(nutrients.sugarsG, isIncomplete(nutrients, 'sugarsG'), limit),
    requirement: `No more than ${limit} g of sugars per 100 g`,
    figures: [
      { label: 'Sugars', value: nutrients.sugarsG, unit: 'g per 100 g' },
      { label: 'Limit', value: limit, unit: 'g per 100 g' },
    ],
    accompanyingStatement: null,
    source: ANNEX,
    note: unknownNote(nutrients, 'sugarsG'),
  };
}

export function checkLowSugars(nutrients: FinishedNutrients): ClaimCheck {
  return sugarLimitCheck('low_sugars', nutrients);
}

export function checkSugarsFree(nutrients: FinishedNutrients): ClaimCheck {
  return sugarLimitCheck('sugars_free', nutrients);
}

/**
 * WITH NO ADDED SUGARS: no line may be a sugar or other food used to sweeten. A sweetener line
 * that is a food additive (an E number: polyols, intense sweeteners) is not a sugar; every other
 * sweetener line (sugar, syrups, honey) is.
 */
export function checkNoAddedSugars(input: LabelInput, nutrients: FinishedNutrients): ClaimCheck {
  validateLabelInput(input);
  const added = input.lines.filter((l) => l.grams > 0 && l.ingredient.kind === 'sweetener' && !l.ingredient.additive);
  const addedG = added.reduce((t, l) => t + l.grams, 0);
  const naturallyPresent = nutrients.sugarsG === null || nutrients.sugarsG > 0;
  const names = [...new Set(added.map((l) => l.ingredient.labelName))];
  return {
    claim: 'no_added_sugars',
    title: 'With no added sugars',
    status: added.length > 0 ? 'not_met' : 'met',
    requirement: 'No added mono- or disaccharides and no other food used for its sweetening properties',
    figures: [
      { label: 'Sugars and sweetening foods added', value: addedG, unit: 'g in the batch' },
      { label: 'Sugars', value: nutrients.sugarsG, unit: 'g per 100 g' },
    ],
    accompanyingStatement: naturallyPresent ? 'Contains naturally occurring sugars' : null,
    source: ANNEX,
    note: added.length > 0
      ? `Added: ${names.join(', ')}.`
      : 'A fruit juice or concentrate added to sweeten counts as added sugar; check the fruit lines.',
  };
}

/**
 * REDUCED SUGARS against `reference`: at least 30 % less sugar per 100 g, and energy no higher
 * than the reference's (1047/2012). Incomplete figures are bounds: our sugar may be higher, the
 * reference's may be higher; the result says "cannot tell" where a bound decides nothing.
 */
export function checkReducedSugars(subject: ClaimSubject, reference: ClaimReference | null): ClaimCheck {
  const own = subject.nutrients.sugarsG;
  const ownIncomplete = isIncomplete(subject.nutrients, 'sugarsG');
  const figures: ClaimFigure[] = [
    { label: 'Sugars', value: own, unit: 'g per 100 g' },
    { label: `Sugars in ${reference?.name ?? 'the reference'}`, value: reference?.sugarsG ?? null, unit: 'g per 100 g' },
  ];
  const base = {
    claim: 'reduced_sugars' as const,
    title: 'Reduced sugars',
    requirement: 'At least 30 % less sugar than a similar product, and energy no higher than that product\'s',
    accompanyingStatement: null,
    source: ANNEX_1047,
  };
  if (!reference) return { ...base, status: 'cannot_tell', figures, note: 'Choose a product to compare with.' };
  const ref = reference.sugarsG;
  if (own === null || ref === null) return { ...base, status: 'cannot_tell', figures, note: 'A sugar figure is unknown.' };
  if (ref <= 0) return { ...base, status: 'not_met', figures, note: 'The reference has no sugar to reduce.' };

  const reduction = (ref - own) / ref;
  // A negative reduction is an increase: said as such, never as "-28.3 % lower".
  figures.push(
    reduction < 0 ? { label: 'Increase', value: -reduction * 100, unit: '%' } : { label: 'Reduction', value: reduction * 100, unit: '%' },
    { label: 'Required reduction', value: REDUCED_MIN_FRACTION * 100, unit: '%' },
  );
  // Our sugar is a lower bound when incomplete (the true reduction is smaller); the reference's
  // is a lower bound when incomplete (the true reduction is larger).
  const reductionMet = reduction >= REDUCED_MIN_FRACTION - 1e-12;
  let sugarStatus: ClaimStatus;
  if (reductionMet) sugarStatus = ownIncomplete ? 'cannot_tell' : 'met';
  else sugarStatus = reference.sugarsIncomplete ? 'cannot_tell' : 'not_met';

  figures.push(
    { label: 'Energy', value: subject.energyKj, unit: 'kJ per 100 g' },
    { label: `Energy of ${reference.name}`, value: reference.energyKj, unit: 'kJ per 100 g' },
  );
  const energyStatus = reference.energyKj === null
    ? 'cannot_tell'
    : atMost(subject.energyKj, subject.energyIncomplete === true, reference.energyKj);

  const notes: string[] = [];
  if (sugarStatus !== 'met') notes.push(reductionMet ? 'Some sugar values are missing; the reduction may be smaller.' : sugarStatus === 'not_met' ? sugarShortfall(reduction, reference.name) : 'The reference\'s sugar figure is incomplete.');
  if (energyStatus === 'not_met') notes.push('The energy is higher than the reference\'s, which the claim does not allow.');
  if (energyStatus === 'cannot_tell') notes.push('The energy of one of the two products is not known.');
  const status: ClaimStatus = sugarStatus === 'not_met' || energyStatus === 'not_met'
    ? 'not_met'
    : sugarStatus === 'met' && energyStatus === 'met' ? 'met' : 'cannot_tell';
  return { ...base, status, figures, note: notes.length ? notes.join(' ') : undefined };
}

function sugarShortfall(reduction: number, referenceName: string): string {
  if (reduction < 0) return `Sugar is ${round1(-reduction * 100)} % higher than in ${referenceName}, not lower: the claim does not apply.`;
  if (reduction === 0) return `Sugar is the same as in ${referenceName}: the claim does not apply.`;
  return `Sugar is ${round1(reduction * 100)} % lower; at least 30 % is needed.`;
}

function round1(value: number): number {
  return Math.round(value * 10) / 10;
}

/** All four sugar claims for a formula; `reference` is the user's choice for "reduced sugars". */
export function sugarClaimChecks(input: LabelInput, subject: ClaimSubject, reference: ClaimReference | null): ClaimCheck[] {
  return [
    checkLowSugars(subject.nutrients),
    checkSugarsFree(subject.nutrients),
    checkNoAddedSugars(input, subject.nutrients),
    checkReducedSugars(subject, reference),
  ];
}
