/**
 * US Nutrition Facts per serving (21 CFR 101.9), for jams, jellies and preserves. Pure.
 *
 * Serving: the reference amount for jams and jellies is 1 tbsp (21 CFR 101.12(b) Table 2, "Honey,
 * jams, jellies, fruit butter, molasses …", label statement "1 tbsp (__ g)"), and 1 tbsp of jam
 * weighs 20 g (the figure; USDA SR28 gives 20 g for 1 tbsp of 19297 "Jams and preserves"
 * — memory).
 */
import { ChemistryInputError, requireFiniteNumber } from '@/lib/chemistry/errors';
import type { FinishedNutrients, LabelInput, NutrientKey } from './types';
import { checkedLabelInput } from './nutrition';
import { formatToStep, incompleteNote, roundToStep, unionOfNames } from './rounding';

export const US_SERVING_G = 20;
export const US_SERVING_LABEL = '1 Tbsp (20g)';

/**
 * Daily Values for adults and children ≥ 4 years: the DRVs of 21 CFR 101.9(c)(9) as amended in
 * 2016 (fat 78 g, saturated fat 20 g, cholesterol 300 mg, sodium 2300 mg, total carbohydrate
 * 275 g, dietary fiber 28 g, added sugars 50 g, protein 50 g). Total sugars and trans fat have none.
 */
export const US_DAILY_VALUES = {
  totalFat: 78, saturatedFat: 20, cholesterol: 300, sodium: 2300, totalCarbohydrate: 275, dietaryFiber: 28, addedSugars: 50, protein: 50,
} as const;

export type UsRowNutrient =
  | 'totalFat' | 'saturatedFat' | 'transFat' | 'cholesterol' | 'sodium' | 'totalCarbohydrate'
  | 'dietaryFiber' | 'totalSugars' | 'addedSugars' | 'protein';

export interface UsAmount {
  /** Unrounded, per serving. */
  value: number;
  /** Rounded per 21 CFR 101.9(c); null when the label says "less than …". */
  labelValue: number | null;
  /** As printed: "0 g", "less than 1 g", "13 g", "5 mg". */
  label: string;
}

export interface UsFactsRow {
  nutrient: UsRowNutrient;
  /** As on the panel: "Total Fat", "Includes Added Sugars". */
  name: string;
  /** 0 for a main row, 1 under it ("Saturated Fat"), 2 under that ("Includes Added Sugars"). */
  indent: 0 | 1 | 2;
  unit: 'g' | 'mg';
  amount: UsAmount | null;
  /** The printed amount, or "not known". */
  label: string;
  /** % Daily Value, rounded to 1 %; null when the row has none or it is not declared. */
  dailyValuePct: number | null;
  unknownFrom: string[];
  incomplete: boolean;
  note: string | null;
}

export interface UsNutritionFacts {
  servingSizeG: number;
  servingSizeLabel: string;
  /** Rounded per 21 CFR 101.9(b)(8)(i). */
  servingsPerContainer: number;
  servingsPerContainerLabel: string;
  calories: { value: number | null; labelValue: number | null; label: string; unknownFrom: string[]; incomplete: boolean; note: string | null };
  /** How calories are computed, in words. */
  caloriesMethod: string;
  rows: UsFactsRow[];
  /**
   * "Not a significant source of …" lines for the foot of the panel: trans fat when it need not be
   * declared (21 CFR 101.9(c)(2)(ii), its row is then left off), added sugars under 1 g a serving
   * (101.9(c)(6)(iii), where the statement may replace the row).
   */
  notSignificantStatements: string[];
  complete: boolean;
}

/**
 * 21 CFR 101.9(b)(8)(i): servings per container to the nearest whole number, except between 2 and
 * 5 servings, to the nearest 0.5; a rounded count is preceded by "about". 101.9(b)(6): a package
 * holding less than 200 % of the reference amount is one serving (the whole package).
 */
export function usServingsPerContainer(netFillG: number): { servings: number; servingG: number; label: string; exact: boolean } {
  const fill = requireFiniteNumber(netFillG, 'settings.jarNetFillG');
  if (fill <= 0) throw new ChemistryInputError('settings.jarNetFillG', 'jar net fill must be positive');
  if (fill < 2 * US_SERVING_G) return { servings: 1, servingG: fill, label: '1 serving per container', exact: true };
  const raw = fill / US_SERVING_G;
  const servings = raw >= 2 && raw <= 5 ? roundToStep(raw, 0.5) : roundToStep(raw, 1);
  const exact = Math.abs(servings - raw) < 1e-9;
  return { servings, servingG: US_SERVING_G, label: `${exact ? '' : 'about '}${servings} servings per container`, exact };
}

/** 21 CFR 101.9(c)(1): < 5 → 0; ≤ 50 → nearest 5; > 50 → nearest 10. */
export function usCalories(value: number): number {
  if (value < 5) return 0;
  return roundToStep(value, value <= 50 ? 5 : 10);
}

function grams(labelValue: number | null, label: string, value: number): UsAmount {
  return { value, labelValue, label };
}

/** 21 CFR 101.9(c)(2), (2)(i), (2)(ii): fats < 0.5 g → 0; < 5 g → nearest 0.5 g; ≥ 5 g → nearest 1 g. */
export function usFatAmount(value: number): UsAmount {
  if (value < 0.5) return grams(0, '0 g', value);
  const step = value < 5 ? 0.5 : 1;
  const rounded = roundToStep(value, step);
  return grams(rounded, `${rounded} g`, value);
}

/** 21 CFR 101.9(c)(3): < 2 mg → 0; 2–5 mg → "less than 5 mg"; > 5 mg → nearest 5 mg. */
export function usCholesterolAmount(value: number): UsAmount {
  if (value < 2) return { value, labelValue: 0, label: '0 mg' };
  if (value <= 5) return { value, labelValue: null, label: 'less than 5 mg' };
  const rounded = roundToStep(value, 5);
  return { value, labelValue: rounded, label: `${rounded} mg` };
}

/** 21 CFR 101.9(c)(4): < 5 mg → 0; 5–140 mg → nearest 5 mg; > 140 mg → nearest 10 mg. */
export function usSodiumAmount(value: number): UsAmount {
  if (value < 5) return { value, labelValue: 0, label: '0 mg' };
  const rounded = roundToStep(value, value <= 140 ? 5 : 10);
  return { value, labelValue: rounded, label: `${rounded} mg` };
}

/**
 * 21 CFR 101.9(c)(6), (6)(i), (6)(ii), (6)(iii) and (7): total carbohydrate, dietary fiber, total
 * sugars, added sugars and protein: < 0.5 g → 0; < 1 g → "less than 1 g"; ≥ 1 g → nearest 1 g.
 */
export function usGramAmount(value: number): UsAmount {
  if (value < 0.5) return grams(0, '0 g', value);
  if (value < 1) return grams(null, 'less than 1 g', value);
  const rounded = roundToStep(value, 1);
  return grams(rounded, `${formatToStep(value, 1)} g`, value);
}

/**
 * % DV to the nearest 1 %. 21 CFR 101.9(d)(7)(ii) lets it be computed from the declared amount or
 * the actual one (memory); we use the declared amount so "0 g" never sits beside "1 %", and the
 * actual amount where the declaration is "less than 1 g".
 */
export function usDailyValuePct(amount: number, dailyValue: number): number {
  return roundToStep((amount / dailyValue) * 100, 1);
}

/**
 * Calories by 21 CFR 101.9(c)(1)(i)(B): the general factors 4, 4 and 9 kcal/g for protein, total
 * carbohydrate and total fat, on the amounts before rounding. Total carbohydrate is by difference
 * (101.9(c)(6): total weight − protein − fat − moisture − ash), so it includes the fibre; the
 * method that subtracts insoluble fibre, (C), needs a soluble/insoluble split our data lacks.
 */
export const US_CALORIES_METHOD = 'General factors: 4 kcal/g protein, 4 kcal/g total carbohydrate (fibre included), 9 kcal/g fat';

/**
 * Added sugars, g per 100 g finished. 21 CFR 101.9(c)(6)(iii) (2016 final rule, 81 FR 33980):
 * added sugars are "sugars that are either added during the processing of foods, or are packaged
 * as such, and include sugars (free, mono- and disaccharides), sugars from syrups and honey, and
 * sugars from concentrated fruit or vegetable juices that are in excess of what would be expected
 * from the same volume of 100 percent fruit or vegetable juice of the same type", with the
 * exception that "fruit juice concentrates which are used to formulate the fruit component of
 * jellies, jams, or preserves in accordance with the standard of identities set forth in
 * §§ 150.140 and 150.160 … or the fruit component of fruit spreads shall not be labeled as added
 * sugars" (wording from memory; the definition and the jams/jellies exclusion are confirmed by
 * FDA's "added sugars" Q&A, which points to that paragraph). So: sugars of the sweetener lines
 * (sugar, syrups, honey) are added; the fruit's own sugars — fresh, frozen, or concentrated as the
 * fruit component — are not. Other lines (pectin, acid) are not counted: the brief names the
 * sweetener lines, and a pectin's standardising sugar is a few hundredths of a gram per serving.
 */
export function addedSugarsPer100g(input: LabelInput): { value: number; unknownFrom: string[] } {
  const { lines, finishedMassG } = checkedLabelInput(input);
  let batchG = 0;
  const unknownFrom: string[] = [];
  for (const line of lines) {
    if (line.ingredient.kind !== 'sweetener' || line.grams === 0) continue;
    const sugars = line.ingredient.nutrients.sugarsG;
    if (sugars === null) {
      if (!unknownFrom.includes(line.ingredient.labelName)) unknownFrom.push(line.ingredient.labelName);
      continue;
    }
    batchG += (line.grams * sugars) / 100;
  }
  return { value: batchG / (finishedMassG / 100), unknownFrom };
}

interface RowSpec {
  nutrient: UsRowNutrient;
  name: string;
  indent: 0 | 1 | 2;
  unit: 'g' | 'mg';
  per100: number | null;
  unknownFrom: string[];
  round: (value: number) => UsAmount;
  dailyValue: number | null;
  /** Why the row is empty when no data can exist for it. */
  missingReason?: string;
}

function facts(spec: RowSpec, servingG: number): UsFactsRow {
  const amount = spec.per100 === null ? null : spec.round((spec.per100 * servingG) / 100);
  const unknownFrom = spec.unknownFrom;
  return {
    nutrient: spec.nutrient,
    name: spec.name,
    indent: spec.indent,
    unit: spec.unit,
    amount,
    label: amount?.label ?? 'not known',
    dailyValuePct: amount !== null && spec.dailyValue !== null ? usDailyValuePct(amount.labelValue ?? amount.value, spec.dailyValue) : null,
    unknownFrom,
    incomplete: unknownFrom.length > 0,
    note: spec.missingReason ?? incompleteNote(unknownFrom),
  };
}

/**
 * 21 CFR 101.9(c)(2)(ii): trans fat need not be declared for a food with less than 0.5 g total fat a
 * serving that makes no claim about fat, fatty acids or cholesterol; the panel then carries "Not a
 * significant source of trans fat". Setwell checks only sugar claims, so no fat claim is ever made.
 */
export const US_TRANS_FAT_EXEMPT_BELOW_FAT_G = 0.5;

/** The Nutrition Facts per serving, with % DV. Throws ChemistryInputError on a bad jar fill. */
export function usNutritionFacts(n: FinishedNutrients, input: LabelInput): UsNutritionFacts {
  const added = addedSugarsPer100g(input);
  if (!input.settings || typeof input.settings !== 'object') throw new ChemistryInputError('settings', 'settings are missing');
  const serving = usServingsPerContainer(input.settings.jarNetFillG);
  const servingG = serving.servingG;
  const unknown = (key: NutrientKey) => n.unknownFrom[key] ?? [];
  // Only a fat figure known for every ingredient can lift the trans fat declaration.
  const fatPerServingG = n.fatG === null || unknown('fatG').length > 0 ? null : (n.fatG * servingG) / 100;
  const transFatExempt = fatPerServingG !== null && fatPerServingG < US_TRANS_FAT_EXEMPT_BELOW_FAT_G;
  // Sodium is held in mg per 100 g; the others in g.
  const specs: RowSpec[] = [
    { nutrient: 'totalFat', name: 'Total Fat', indent: 0, unit: 'g', per100: n.fatG, unknownFrom: unknown('fatG'), round: usFatAmount, dailyValue: US_DAILY_VALUES.totalFat },
    { nutrient: 'saturatedFat', name: 'Saturated Fat', indent: 1, unit: 'g', per100: n.saturatesG, unknownFrom: unknown('saturatesG'), round: usFatAmount, dailyValue: US_DAILY_VALUES.saturatedFat },
    ...(transFatExempt ? [] : [{ nutrient: 'transFat', name: 'Trans Fat', indent: 1, unit: 'g', per100: null, unknownFrom: [], round: usFatAmount, dailyValue: null,
      missingReason: 'Not known: the ingredient data holds no trans fat figures' } satisfies RowSpec]),
    // 101.9(c)(3): under 2 mg a serving it may be stated as zero, which is what usCholesterolAmount gives.
    { nutrient: 'cholesterol', name: 'Cholesterol', indent: 0, unit: 'mg', per100: n.cholesterolMg, unknownFrom: unknown('cholesterolMg'), round: usCholesterolAmount, dailyValue: US_DAILY_VALUES.cholesterol },
    { nutrient: 'sodium', name: 'Sodium', indent: 0, unit: 'mg', per100: n.sodiumMg, unknownFrom: unknown('sodiumMg'), round: usSodiumAmount, dailyValue: US_DAILY_VALUES.sodium },
    { nutrient: 'totalCarbohydrate', name: 'Total Carbohydrate', indent: 0, unit: 'g', per100: n.carbohydrateG, unknownFrom: unknown('carbohydrateG'), round: usGramAmount, dailyValue: US_DAILY_VALUES.totalCarbohydrate },
    { nutrient: 'dietaryFiber', name: 'Dietary Fiber', indent: 1, unit: 'g', per100: n.fibreG, unknownFrom: unknown('fibreG'), round: usGramAmount, dailyValue: US_DAILY_VALUES.dietaryFiber },
    { nutrient: 'totalSugars', name: 'Total Sugars', indent: 1, unit: 'g', per100: n.sugarsG, unknownFrom: unknown('sugarsG'), round: usGramAmount, dailyValue: null },
    { nutrient: 'addedSugars', name: 'Includes Added Sugars', indent: 2, unit: 'g', per100: added.value, unknownFrom: added.unknownFrom, round: usGramAmount, dailyValue: US_DAILY_VALUES.addedSugars },
    // % DV for protein is not required without a protein claim (21 CFR 101.9(c)(7)(i)), so none is given.
    { nutrient: 'protein', name: 'Protein', indent: 0, unit: 'g', per100: n.proteinG, unknownFrom: unknown('proteinG'), round: usGramAmount, dailyValue: null },
  ];
  const rows = specs.map((spec) => facts(spec, servingG));

  const caloriesUnknown = unionOfNames(unknown('proteinG'), unknown('carbohydrateG'), unknown('fatG'));
  const kcal = n.proteinG === null || n.carbohydrateG === null || n.fatG === null
    ? null
    : ((4 * n.proteinG + 4 * n.carbohydrateG + 9 * n.fatG) * servingG) / 100;
  const caloriesLabelValue = kcal === null ? null : usCalories(kcal);

  const addedRow = rows.find((r) => r.nutrient === 'addedSugars');
  // 101.9(c)(6)(iii): below 1 g per serving the row may be left off, with this statement instead.
  const notSignificantStatements = [
    ...(transFatExempt ? ['Not a significant source of trans fat'] : []),
    ...(addedRow?.amount && addedRow.amount.value < 1 && !addedRow.incomplete ? ['Not a significant source of added sugars'] : []),
  ];

  return {
    servingSizeG: servingG,
    servingSizeLabel: servingG === US_SERVING_G ? US_SERVING_LABEL : `1 container (${formatToStep(servingG, 1)}g)`,
    servingsPerContainer: serving.servings,
    servingsPerContainerLabel: serving.label,
    calories: {
      value: kcal,
      labelValue: caloriesLabelValue,
      label: caloriesLabelValue === null ? 'not known' : String(caloriesLabelValue),
      unknownFrom: caloriesUnknown,
      incomplete: caloriesUnknown.length > 0,
      note: incompleteNote(caloriesUnknown),
    },
    caloriesMethod: US_CALORIES_METHOD,
    rows,
    notSignificantStatements,
    // Trans fat, where it must be declared, is never known from our data; its row says so, and `complete`
    // speaks only of the figures that are computed.
    complete: caloriesUnknown.length === 0 && rows.every((r) => !r.incomplete),
  };
}
