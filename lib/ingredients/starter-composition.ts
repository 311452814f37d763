/**
 * Label data of the starter library, per 100 g, keyed by the starter entry's `typicalKey`
 * (lib/chemistry/typical-ingredients.ts). Pure data.
 *
 * Foods: USDA ARS, USDA National Nutrient Database for Standard Reference, Legacy Release 28
 * (SR28, public domain), nutrients 255, 208, 268, 203, 204, 606, 205, 291, 269, 307 and 210/211/212,
 * as listed in docs/nutrition-check-values.md, and 601 (cholesterol). A value SR28 does not give
 * stays null (unknown), never zero. The cholesterol figures (0 mg for every food here: fruits,
 * sugars, honey, pectin) are from memory of SR28, not read off its tables here. Additives and water
 * are not in SR28: their composition follows from what they are, and their energy from the
 * Regulation (EU) 1169/2011 Annex XIV factor for organic acids.
 */
import type { NutrientValues } from '@/lib/label/types';
import { emptyLabelFields, type AdditiveClass, type IngredientLabelFields } from './label-data';

const SR28 = 'USDA National Nutrient Database for Standard Reference, Legacy Release 28';

/** One SR28 food: NDB number, description, and its values in NUTRIENT order below (null = not given). */
interface Sr28Food {
  ndb: string;
  description: string;
  // water, kcal, kJ, protein, fat, saturates, carbohydrate (by difference), fibre, sugars, sodium mg, cholesterol mg
  values: [number, number, number, number, number, number | null, number, number | null, number | null, number, number];
  /** Sucrose, glucose, fructose where SR28 lists them. */
  sugars?: [number, number, number];
}

/** The SR28 foods the starter library uses, keyed by their name in the reference notes. */
export const SR28_FOODS = {
  strawberry: { ndb: '09316', description: 'Strawberries, raw', values: [90.95, 32, 136, 0.67, 0.30, 0.015, 7.68, 2.0, 4.89, 1, 0], sugars: [0.47, 1.99, 2.44] },
  raspberry: { ndb: '09302', description: 'Raspberries, raw', values: [85.75, 52, 220, 1.20, 0.65, 0.019, 11.94, 6.5, 4.42, 1, 0], sugars: [0.20, 1.86, 2.35] },
  apricot: { ndb: '09021', description: 'Apricots, raw', values: [86.35, 48, 201, 1.40, 0.39, 0.027, 11.12, 2.0, 9.24, 1, 0], sugars: [5.87, 2.37, 0.94] },
  blackcurrant: { ndb: '09083', description: 'Currants, european black, raw', values: [81.96, 63, 264, 1.40, 0.41, 0.034, 15.38, null, null, 2, 0] },
  redcurrant: { ndb: '09084', description: 'Currants, red and white, raw', values: [83.95, 56, 234, 1.40, 0.20, 0.017, 13.80, 4.3, 7.37, 1, 0], sugars: [0.61, 3.22, 3.53] },
  apple: { ndb: '09003', description: 'Apples, raw, with skin', values: [85.56, 52, 218, 0.26, 0.17, 0.028, 13.81, 2.4, 10.39, 1, 0], sugars: [2.07, 2.43, 5.90] },
  quince: { ndb: '09296', description: 'Quinces, raw', values: [83.80, 57, 238, 0.40, 0.10, 0.010, 15.30, 1.9, null, 4, 0] },
  plum: { ndb: '09279', description: 'Plums, raw', values: [87.23, 46, 192, 0.70, 0.28, 0.017, 11.42, 1.4, 9.92, 0, 0], sugars: [1.57, 5.07, 3.07] },
  blackberry: { ndb: '09042', description: 'Blackberries, raw', values: [88.15, 43, 181, 1.39, 0.49, 0.014, 9.61, 5.3, 4.88, 1, 0], sugars: [0.07, 2.31, 2.40] },
  orange: { ndb: '09200', description: 'Oranges, raw, all commercial varieties', values: [86.75, 47, 197, 0.94, 0.12, 0.015, 11.75, 2.4, 9.35, 0, 0] },
  lemon_juice: { ndb: '09152', description: 'Lemon juice, raw', values: [92.31, 22, 91, 0.35, 0.24, 0.040, 6.90, 0.3, 2.52, 1, 0], sugars: [0.43, 0.99, 1.10] },
  sugar_granulated: { ndb: '19335', description: 'Sugars, granulated', values: [0.02, 387, 1618, 0.00, 0.00, 0.000, 99.98, 0.0, 99.80, 1, 0], sugars: [99.80, 0.00, 0.00] },
  corn_syrup_light: { ndb: '19350', description: 'Syrups, corn, light', values: [22.81, 283, 1182, 0.00, 0.20, 0.000, 76.79, 0.0, 76.77, 62, 0] },
  honey: { ndb: '19296', description: 'Honey', values: [17.10, 304, 1272, 0.30, 0.00, 0.000, 82.40, 0.2, 82.12, 4, 0], sugars: [0.89, 35.75, 40.94] },
  pectin_dry: { ndb: '19310', description: 'Pectin, unsweetened, dry mix', values: [8.70, 325, 1360, 0.30, 0.30, 0.050, 90.40, 8.6, null, 200, 0] },
} satisfies Record<string, Sr28Food>;
export type Sr28Key = keyof typeof SR28_FOODS;

function sr28Nutrients(food: Sr28Food): NutrientValues {
  const [waterG, energyKcal, energyKj, proteinG, fatG, saturatesG, carbohydrateG, fibreG, sugarsG, sodiumMg, cholesterolMg] = food.values;
  const [sucroseG, glucoseG, fructoseG] = food.sugars ?? [null, null, null];
  // SR28 has no polyol or organic-acid figure for these foods: both stay unknown.
  return { waterG, energyKcal, energyKj, proteinG, fatG, saturatesG, carbohydrateG, sugarsG, sucroseG, glucoseG, fructoseG, fibreG, polyolsG: null, organicAcidsG: null, sodiumMg, cholesterolMg };
}

function fromSr28(key: Sr28Key, labelName: string, note?: string): IngredientLabelFields {
  const food: Sr28Food = SR28_FOODS[key];
  return {
    ...noAllergens,
    labelName,
    nutrients: sr28Nutrients(food),
    additive: null,
    isAddedWater: false,
    source: `${SR28}, NDB ${food.ndb} (${food.description})${note ? `. ${note}` : ''}`,
  };
}

const noAllergens = { euAllergens: [], usAllergens: [], sulphiteMgPerKg: null } as const satisfies Partial<IngredientLabelFields>;

/** A pure substance with no protein, fat, carbohydrate, fibre, polyols, sodium or cholesterol. Energy from organic acid at 13 kJ / 3 kcal per g (1169/2011 Annex XIV). */
function pureSubstance(labelName: string, organicAcidsG: number, sourceDetail: string, additive: { eNumber: string; functionalClass: AdditiveClass } | null): IngredientLabelFields {
  return {
    ...noAllergens,
    sulphiteMgPerKg: 0,
    labelName,
    nutrients: {
      waterG: 0, energyKj: round1(organicAcidsG * 13), energyKcal: round1(organicAcidsG * 3), proteinG: 0, fatG: 0, saturatesG: 0,
      carbohydrateG: 0, sugarsG: 0, sucroseG: 0, glucoseG: 0, fructoseG: 0, fibreG: 0, polyolsG: 0, organicAcidsG, sodiumMg: 0, cholesterolMg: 0,
    },
    additive,
    isAddedWater: false,
    source: `Pure substance: composition by definition. ${sourceDetail}`,
  };
}

function round1(x: number): number {
  return Math.round(x * 10) / 10;
}

const ORGANIC_ACID_ENERGY = 'Energy from the organic-acid factor of Regulation (EU) 1169/2011 Annex XIV.';

/** Label data per starter key. Every key of TYPICAL_INGREDIENTS has an entry (tests/unit/ingredients checks it). */
export const STARTER_LABEL_DATA: Readonly<Record<string, IngredientLabelFields>> = {
  strawberry: fromSr28('strawberry', 'strawberries'),
  raspberry: fromSr28('raspberry', 'raspberries'),
  apricot: fromSr28('apricot', 'apricots'),
  blackcurrant: fromSr28('blackcurrant', 'blackcurrants', 'SR28 gives no fibre or sugars for it: enter your own.'),
  redcurrant: fromSr28('redcurrant', 'redcurrants'),
  apple_tart: fromSr28('apple', 'apples', 'SR28 has no separate entry for tart apples.'),
  quince: fromSr28('quince', 'quinces', 'SR28 gives no sugars for it: enter your own.'),
  plum: fromSr28('plum', 'plums'),
  blackberry: fromSr28('blackberry', 'blackberries'),
  // SR28 has no bitter orange; the sweet-orange entry stands in and says so.
  bitter_orange: fromSr28('orange', 'bitter oranges', 'SR28 has no bitter orange: sweet-orange values stand in until you enter your own.'),
  lemon_juice: fromSr28('lemon_juice', 'lemon juice'),
  sucrose: fromSr28('sugar_granulated', 'sugar'),
  // No glucose-syrup entry in SR28; light corn syrup is a glucose syrup of unstated DE.
  glucose_syrup_de42: fromSr28('corn_syrup_light', 'glucose syrup', 'SR28 has no glucose syrup: light corn syrup stands in; its DE and water vary by grade.'),
  invert_syrup: {
    ...noAllergens,
    labelName: 'invert sugar syrup',
    nutrients: emptyLabelFields().nutrients,
    additive: null,
    isAddedWater: false,
    source: 'Not in the USDA SR28 tables: enter the values from your supplier’s specification.',
  },
  honey: fromSr28('honey', 'honey'),
  pectin_hm_rapid_150: { ...fromSr28('pectin_dry', 'pectin', 'SR28 gives no sugars for it.'), additive: { eNumber: 'E440', functionalClass: 'gelling_agent' } },
  pectin_lm_amidated: {
    ...fromSr28('pectin_dry', 'amidated pectin', 'The one SR28 pectin entry, for any pectin powder; SR28 gives no sugars for it.'),
    additive: { eNumber: 'E440', functionalClass: 'gelling_agent' },
  },
  citric_acid_anhydrous: pureSubstance('citric acid', 100, `Anhydrous citric acid is wholly organic acid. ${ORGANIC_ACID_ENERGY}`, { eNumber: 'E330', functionalClass: 'acid' }),
  // Ca3(C6H5O7)2, 498.43 g/mol, holds the citrate of two citric acids (2 × 192.12 g/mol): 77.09 g per 100 g as citric acid.
  calcium_citrate: pureSubstance('calcium citrate', 77.09, `Anhydrous tricalcium citrate; its citrate is counted as citric acid (77.09 g per 100 g). ${ORGANIC_ACID_ENERGY}`, { eNumber: 'E333', functionalClass: 'firming_agent' }),
  // C6H7KO2, 150.22 g/mol, as sorbic acid C6H8O2, 112.13 g/mol: 74.64 g per 100 g.
  potassium_sorbate: pureSubstance('potassium sorbate', 74.64, `Its sorbate is counted as sorbic acid (74.64 g per 100 g), an organic acid. ${ORGANIC_ACID_ENERGY}`, { eNumber: 'E202', functionalClass: 'preservative' }),
  water: {
    ...noAllergens,
    sulphiteMgPerKg: 0,
    labelName: 'water',
    nutrients: {
      waterG: 100, energyKcal: 0, energyKj: 0, proteinG: 0, fatG: 0, saturatesG: 0, carbohydrateG: 0, sugarsG: 0,
      sucroseG: 0, glucoseG: 0, fructoseG: 0, fibreG: 0, polyolsG: 0, organicAcidsG: 0, sodiumMg: 0, cholesterolMg: 0,
    },
    additive: null,
    isAddedWater: true,
    source: 'Pure substance: composition by definition. Your water supply’s sodium is not counted.',
  },
};
