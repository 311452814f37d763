/**
 * The EU nutrition declaration per 100 g: Regulation (EU) No 1169/2011 Art. 30 and Annex XV
 * (order and names), energy by the Annex XIV conversion factors, salt = sodium × 2.5 (Annex I
 * point 11), label values rounded per the European Commission's "Guidance document for competent
 * authorities for the control of compliance with EU legislation … with regard to the setting of
 * tolerances for nutrient values declared on a label" (December 2012), section 4 rounding table.
 * Pure.
 */
import type { FinishedNutrients, NutrientKey } from './types';
import { formatToStep, incompleteNote, roundToStep, unionOfNames } from './rounding';

export type EuRowNutrient = 'energy' | 'fat' | 'saturates' | 'carbohydrate' | 'sugars' | 'polyols' | 'fibre' | 'protein' | 'salt';

export interface EuAmount {
  unit: 'kJ' | 'kcal' | 'g';
  /** Unrounded, per 100 g. */
  value: number;
  /** Rounded per the 2012 guidance; null when the label says "<…" instead of a number. */
  labelValue: number | null;
  /** As printed: "1156 kJ", "0.2 g", "<0.5 g". */
  label: string;
}

export interface EuDeclarationRow {
  nutrient: EuRowNutrient;
  /** Annex XV wording, for the screen: "Energy", "of which saturates". */
  name: string;
  /** "of which …" rows sit under their parent. */
  subRow: boolean;
  /** Energy has kJ then kcal; the others one amount in g. Null when no ingredient has a figure. */
  amounts: EuAmount[] | null;
  /** The row's printed value: "1156 kJ / 272 kcal", "0.2 g", or "not known". */
  label: string;
  /** Ingredients without a figure for this row: the figure is a lower bound and says so. */
  unknownFrom: string[];
  incomplete: boolean;
  /** "Incomplete: no figure for pectin"; null when complete. */
  note: string | null;
}

export interface EuDeclaration {
  basis: 'per 100 g';
  rows: EuDeclarationRow[];
  /** Unrounded energy per 100 g (null when carbohydrate, protein or fat is known for no ingredient). */
  energyKj: number | null;
  energyKcal: number | null;
  /** The carbohydrate that is declared and feeds energy: carbohydrate by difference − fibre. */
  availableCarbohydrateG: number | null;
  saltG: number | null;
  /** True when no row is incomplete. */
  complete: boolean;
}

/**
 * Regulation (EU) 1169/2011 Annex XIV conversion factors, per gram. Salatrims, alcohol and
 * erythritol are not in our composition data and so do not appear.
 */
export const EU_ENERGY_FACTORS = {
  carbohydrate: { kJ: 17, kcal: 4 },
  polyols: { kJ: 10, kcal: 2.4 },
  protein: { kJ: 17, kcal: 4 },
  fat: { kJ: 37, kcal: 9 },
  organicAcids: { kJ: 13, kcal: 3 },
  fibre: { kJ: 8, kcal: 2 },
} as const;

/** Regulation (EU) 1169/2011 Annex I point 11: salt = sodium × 2.5. */
export const SALT_PER_SODIUM = 2.5;

type RoundingClass = 'macronutrient' | 'saturates' | 'salt';

/**
 * 2012 guidance, section 4 rounding table:
 * - fat, carbohydrate, sugars, protein, fibre, polyols: ≥ 10 g → nearest 1 g; < 10 g → nearest
 *   0.1 g; ≤ 0.5 g (or not detectable) → "0" or "<0.5 g";
 * - saturates: ≥ 10 g → 1 g; < 10 g → 0.1 g; ≤ 0.1 g → "0" or "<0.1 g";
 * - salt: ≥ 1 g → nearest 0.1 g; < 1 g → nearest 0.01 g; ≤ 0.0125 g → "0" or "<0.01 g".
 * We print "0 g" only for a true zero and "<…" for a small positive amount, which the table allows
 * and which does not make a trace look like none.
 * The table itself was not re-read here: the "0"/"<…" limits (0.5 g, 0.1 g, 0.0125 g) match
 * published secondary summaries of it; the step limits (10 g; 1 g for salt) are from memory.
 */
const ROUNDING: Record<RoundingClass, { wholeFrom: number; wholeStep: number; fineStep: number; negligibleUpTo: number; negligibleLabel: string }> = {
  macronutrient: { wholeFrom: 10, wholeStep: 1, fineStep: 0.1, negligibleUpTo: 0.5, negligibleLabel: '<0.5 g' },
  saturates: { wholeFrom: 10, wholeStep: 1, fineStep: 0.1, negligibleUpTo: 0.1, negligibleLabel: '<0.1 g' },
  salt: { wholeFrom: 1, wholeStep: 0.1, fineStep: 0.01, negligibleUpTo: 0.0125, negligibleLabel: '<0.01 g' },
};

/** One amount in grams, rounded per the guidance for its class. */
export function euGramAmount(value: number, rounding: RoundingClass): EuAmount {
  const rule = ROUNDING[rounding];
  if (value === 0) return { unit: 'g', value, labelValue: 0, label: '0 g' };
  if (value <= rule.negligibleUpTo) return { unit: 'g', value, labelValue: null, label: rule.negligibleLabel };
  const step = value >= rule.wholeFrom ? rule.wholeStep : rule.fineStep;
  return { unit: 'g', value, labelValue: roundToStep(value, step), label: `${formatToStep(value, step)} g` };
}

/** Energy to the nearest 1 kJ and 1 kcal (2012 guidance, section 4). */
export function euEnergyAmounts(kJ: number, kcal: number): EuAmount[] {
  return [
    { unit: 'kJ', value: kJ, labelValue: roundToStep(kJ, 1), label: `${formatToStep(kJ, 1)} kJ` },
    { unit: 'kcal', value: kcal, labelValue: roundToStep(kcal, 1), label: `${formatToStep(kcal, 1)} kcal` },
  ];
}

/**
 * Which carbohydrate feeds energy. Annex I point 7: "carbohydrate" is carbohydrate metabolised by
 * humans, and includes polyols. Our carbohydrate figure is by difference (USDA SR28), which holds
 * the fibre, so: available carbohydrate = carbohydrate − fibre. Fibre then counts on its own at
 * 8 kJ/2 kcal. Polyols stay inside the declared carbohydrate (point 7) but take their own factor,
 * 10 kJ/2.4 kcal, instead of 17/4. Organic acids are added at 13 kJ/3 kcal and not subtracted:
 * in the library they are recorded for acid ingredients (citric acid) that carry no carbohydrate
 * figure, while fruit entries keep their acids inside carbohydrate by difference with no separate
 * figure, so subtracting would remove carbohydrate the acid never contributed.
 * Source: docs/nutrition-check-values.md, "Check values" (EU energy, example (a)).
 */
export function availableCarbohydrate(n: FinishedNutrients): number | null {
  if (n.carbohydrateG === null) return null;
  return Math.max(0, n.carbohydrateG - (n.fibreG ?? 0));
}

function euEnergy(n: FinishedNutrients, available: number | null): { kJ: number; kcal: number } | null {
  if (available === null || n.proteinG === null || n.fatG === null) return null;
  const polyols = Math.min(n.polyolsG ?? 0, available);
  const grams = {
    carbohydrate: available - polyols,
    polyols,
    protein: n.proteinG,
    fat: n.fatG,
    organicAcids: n.organicAcidsG ?? 0,
    fibre: n.fibreG ?? 0,
  };
  let kJ = 0;
  let kcal = 0;
  for (const part of Object.keys(EU_ENERGY_FACTORS) as Array<keyof typeof EU_ENERGY_FACTORS>) {
    kJ += grams[part] * EU_ENERGY_FACTORS[part].kJ;
    kcal += grams[part] * EU_ENERGY_FACTORS[part].kcal;
  }
  return { kJ, kcal };
}

function row(nutrient: EuRowNutrient, name: string, subRow: boolean, amounts: EuAmount[] | null, unknownFrom: string[]): EuDeclarationRow {
  const label = amounts === null ? 'not known' : amounts.map((amount) => amount.label).join(' / ');
  return { nutrient, name, subRow, amounts, label, unknownFrom, incomplete: unknownFrom.length > 0, note: incompleteNote(unknownFrom) };
}

function gramRow(nutrient: EuRowNutrient, name: string, subRow: boolean, value: number | null, rounding: RoundingClass, unknownFrom: string[]): EuDeclarationRow {
  return row(nutrient, name, subRow, value === null ? null : [euGramAmount(value, rounding)], unknownFrom);
}

/** The declaration in Annex XV order; fibre and polyols appear when the data has them. */
export function euDeclaration(n: FinishedNutrients): EuDeclaration {
  const unknown = (key: NutrientKey) => n.unknownFrom[key] ?? [];
  const available = availableCarbohydrate(n);
  const energy = euEnergy(n, available);
  const salt = n.sodiumMg === null ? null : (n.sodiumMg / 1000) * SALT_PER_SODIUM;
  // Polyols and organic acids are rarely listed; being inside carbohydrate by difference, a missing
  // figure changes only their factor, not the mass counted, so it does not make energy incomplete.
  const energyUnknown = unionOfNames(unknown('carbohydrateG'), unknown('fibreG'), unknown('proteinG'), unknown('fatG'));
  const carbohydrateUnknown = unionOfNames(unknown('carbohydrateG'), unknown('fibreG'));

  const rows: EuDeclarationRow[] = [
    row('energy', 'Energy', false, energy === null ? null : euEnergyAmounts(energy.kJ, energy.kcal), energyUnknown),
    gramRow('fat', 'Fat', false, n.fatG, 'macronutrient', unknown('fatG')),
    gramRow('saturates', 'of which saturates', true, n.saturatesG, 'saturates', unknown('saturatesG')),
    gramRow('carbohydrate', 'Carbohydrate', false, available, 'macronutrient', carbohydrateUnknown),
    gramRow('sugars', 'of which sugars', true, n.sugarsG, 'macronutrient', unknown('sugarsG')),
  ];
  if (n.polyolsG !== null && n.polyolsG > 0) {
    rows.push(gramRow('polyols', 'of which polyols', true, n.polyolsG, 'macronutrient', unknown('polyolsG')));
  }
  if (n.fibreG !== null) rows.push(gramRow('fibre', 'Fibre', false, n.fibreG, 'macronutrient', unknown('fibreG')));
  rows.push(gramRow('protein', 'Protein', false, n.proteinG, 'macronutrient', unknown('proteinG')));
  rows.push(gramRow('salt', 'Salt', false, salt, 'salt', unknown('sodiumMg')));

  return {
    basis: 'per 100 g',
    rows,
    energyKj: energy?.kJ ?? null,
    energyKcal: energy?.kcal ?? null,
    availableCarbohydrateG: available,
    saltG: salt,
    complete: rows.every((r) => !r.incomplete),
  };
}
