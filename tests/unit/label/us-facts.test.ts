import { describe, it, expect } from 'vitest';
import { ChemistryInputError } from '@/lib/chemistry';
import { finishedNutrients } from '@/lib/label/nutrition';
import { euDeclaration } from '@/lib/label/eu-declaration';
import {
  US_DAILY_VALUES, US_SERVING_LABEL, addedSugarsPer100g, usCalories, usCholesterolAmount, usDailyValuePct,
  usFatAmount, usGramAmount, usNutritionFacts, usServingsPerContainer, usSodiumAmount, type UsNutritionFacts,
} from '@/lib/label/us-facts';
import type { LabelInput } from '@/lib/label/types';
import { SR28, apricotJam, labelData, labelInput, line, strawberryJam } from './fixtures';

// REF = docs/nutrition-check-values.md; CFR = 21 CFR 101.9 as amended by the 2016 Nutrition
// Facts final rule (81 FR 33742), rounding per paragraph (c) as tabulated in FDA's Food Labeling
// Guide, Appendix H "Rounding the values according to FDA rounding rules".

const facts = (input: LabelInput) => usNutritionFacts(finishedNutrients(input), input);
const rowOf = (f: UsNutritionFacts, nutrient: string) => {
  const found = f.rows.find((r) => r.nutrient === nutrient);
  if (!found) throw new Error(`no ${nutrient} row`);
  return found;
};

describe('US Nutrition Facts: example (a) strawberry jam 1:1 in a 340 g jar', () => {
  const f = facts(strawberryJam());

  it('serves 1 tbsp (20 g) and counts 17 servings in the jar', () => {
    // Source: 21 CFR 101.12(b) Table 2 (jams and jellies: 1 tbsp); 20 g per tbsp is the figure (memory: SR28 19297 household weight).
    expect(f.servingSizeLabel).toBe(US_SERVING_LABEL);
    expect(f.servingSizeG).toBe(20);
    // Source: 21 CFR 101.9(b)(8)(i): 340 g ÷ 20 g = 17 exactly, so no "about".
    expect(f.servingsPerContainer).toBe(17);
    expect(f.servingsPerContainerLabel).toBe('17 servings per container');
  });

  it('computes calories with the general factors 4/4/9 on total carbohydrate', () => {
    // Source: CFR (c)(1)(i)(B); REF example (a) per 100 g × 0.2: protein 0.084125, carbohydrate 13.5705, fat 0.037875 g.
    expect(f.calories.value).toBeCloseTo(4 * 0.084125 + 4 * 13.5705 + 9 * 0.037875, 9);
    expect(f.calories.value).toBeCloseTo(54.959375, 9);
    // Source: CFR (c)(1): above 50 kcal to the nearest 10.
    expect(f.calories.label).toBe('50');
    expect(f.caloriesMethod).toMatch(/4 kcal\/g total carbohydrate \(fibre included\)/);
  });

  it('declares total carbohydrate by difference, fibre included', () => {
    // Source: CFR (c)(6) (total carbohydrate by difference); REF example (a) 67.8525 g/100 g × 0.2 = 13.5705 g → 14 g.
    const carbohydrate = rowOf(f, 'totalCarbohydrate');
    expect(carbohydrate.amount?.value).toBeCloseTo(13.5705, 9);
    expect(carbohydrate.label).toBe('14 g');
    // Source: CFR (c)(9) DRV 275 g: 14 ÷ 275 = 5.09 % → 5 %.
    expect(carbohydrate.dailyValuePct).toBe(5);
  });

  it('counts the sugar line as added sugars and the strawberries\' own sugars as not added', () => {
    // Source: CFR (c)(6)(iii) (sugars added in processing are added; the fruit component of jams is not);
    // REF example (a): sugar line 998.0 g sugars ÷ 16 = 62.375 g/100 g → 12.475 g per serving.
    const added = rowOf(f, 'addedSugars');
    expect(added.amount?.value).toBeCloseTo(12.475, 9);
    expect(added.label).toBe('12 g');
    // Source: CFR (c)(9) DRV for added sugars 50 g: 12 ÷ 50 = 24 %.
    expect(added.dailyValuePct).toBe(24);
    // Total sugars: REF 65.43125 g/100 g × 0.2 = 13.08625 g → 13 g; no % DV (CFR (c)(6)(ii)).
    expect(rowOf(f, 'totalSugars').label).toBe('13 g');
    expect(rowOf(f, 'totalSugars').dailyValuePct).toBeNull();
    expect(f.notSignificantStatements).not.toContain('Not a significant source of added sugars');
  });

  it('rounds the small amounts to zero and says what is not known', () => {
    // Source: REF example (a) per serving: fat 0.0379 g, saturates 0.0019 g, sodium 0.5 mg, fibre 0.26 g, protein 0.084 g; CFR (c)(2), (4), (6)(i), (7).
    expect(f.rows.map((r) => [r.name, r.label, r.dailyValuePct])).toEqual([
      ['Total Fat', '0 g', 0],
      ['Saturated Fat', '0 g', 0],
      // CFR (c)(3): under 2 mg a serving it may be stated as zero; strawberries, sugar and pectin carry 0 mg (SR28 601, from memory).
      ['Cholesterol', '0 mg', 0],
      ['Sodium', '0 mg', 0],
      ['Total Carbohydrate', '14 g', 5],
      ['Dietary Fiber', '0 g', 0],
      ['Total Sugars', '13 g', null],
      ['Includes Added Sugars', '12 g', 24],
      ['Protein', '0 g', null],
    ]);
    // Source: CFR (c)(2)(ii): under 0.5 g total fat a serving (here 0.0379 g) and no fat claim, trans fat
    // need not be declared, and the panel says "Not a significant source of trans fat".
    expect(f.rows.some((r) => r.nutrient === 'transFat')).toBe(false);
    expect(f.notSignificantStatements).toEqual(['Not a significant source of trans fat']);
    // Sugars are incomplete (pectin has no figure in SR28), as in the EU table.
    expect(rowOf(f, 'totalSugars').note).toBe('Incomplete: no figure for pectin');
    expect(f.complete).toBe(false);
  });
});

describe('US Nutrition Facts: example (b) apricot jam', () => {
  it('gives the per-serving figures from the worked per-100 g values', () => {
    // Source: REF example (b) per 100 g × 0.2; CFR (c) rounding.
    const f = facts(apricotJam());
    expect(f.calories.value).toBeCloseTo(0.2 * (4 * 0.857143 + 4 * 68.020408 + 9 * 0.238776), 4);
    expect(f.calories.label).toBe('60'); // 55.5 kcal → nearest 10
    expect(rowOf(f, 'totalCarbohydrate').label).toBe('14 g'); // 13.60 g
    expect(rowOf(f, 'totalSugars').label).toBe('13 g'); // 13.35 g
    expect(rowOf(f, 'addedSugars').amount?.value).toBeCloseTo((1497 / 24.5) * 0.2, 9); // sugar line only
    expect(rowOf(f, 'protein').label).toBe('0 g'); // 0.857 × 0.2 = 0.171 g, under 0.5 g
  });
});

describe('which carbohydrate feeds energy: US against EU', () => {
  it('keeps fibre in US calories (total carbohydrate × 4) but takes it out of EU energy', () => {
    // Source: 21 CFR 101.9(c)(1)(i)(B) general factors on total carbohydrate; Regulation (EU) 1169/2011 Annex I point 7 and Annex XIV.
    const base = strawberryJam();
    const n = finishedNutrients(base);
    const moreFibre = { ...n, fibreG: n.fibreG! + 5 };
    const us = (x: typeof n) => usNutritionFacts(x, base).calories.value!;
    expect(us(moreFibre)).toBeCloseTo(us(n), 12);
    const eu = (x: typeof n) => euDeclaration(x).energyKcal!;
    // 5 g moved from available carbohydrate (4 kcal/g) to fibre (2 kcal/g): 10 kcal less per 100 g.
    expect(eu(n) - eu(moreFibre)).toBeCloseTo(10, 9);
  });
});

describe('US added sugars: what counts as added in a jam', () => {
  it('counts honey as added and leaves fruit sugars out', () => {
    // Source: CFR (c)(6)(iii): "sugars from syrups and honey" are added sugars; FDA added-sugars Q&A (honey's sugars are added).
    const input = labelInput([
      line(1000, labelData('strawberries', 'fruit', SR28.strawberry)),
      line(500, labelData('honey', 'sweetener', SR28.honey)),
    ], { finishedMassG: 1000 });
    const added = addedSugarsPer100g(input);
    expect(added.value).toBeCloseTo((500 * 0.8212 / 1000) * 100, 9);
    expect(added.unknownFrom).toEqual([]);
    const total = finishedNutrients(input).sugarsG!;
    expect(total - added.value).toBeCloseTo((1000 * 0.0489 / 1000) * 100, 9);
  });

  it('is zero for an all-fruit spread and lists a sweetener without a sugars figure', () => {
    // Source: CFR (c)(6)(iii): the fruit component of jams, jellies, preserves and fruit spreads is not added sugars.
    const fruitOnly = labelInput([line(1000, labelData('apricots', 'fruit', SR28.apricot))], { targetSolidsPct: 30 });
    expect(addedSugarsPer100g(fruitOnly).value).toBe(0);
    const f = facts(fruitOnly);
    expect(rowOf(f, 'addedSugars').label).toBe('0 g');
    // Source: CFR (c)(6)(iii): under 1 g per serving, "Not a significant source of added sugars" may replace the row.
    expect(f.notSignificantStatements).toContain('Not a significant source of added sugars');
    const unknownSyrup = labelInput([line(1000, labelData('apricots', 'fruit', SR28.apricot)), line(500, labelData('syrup', 'sweetener', { ...SR28.sugar, sugarsG: null }))]);
    expect(addedSugarsPer100g(unknownSyrup).unknownFrom).toEqual(['syrup']);
  });
});

describe('US trans fat: declared unless the fat is known to be under 0.5 g a serving', () => {
  // Source: 21 CFR 101.9(c)(2)(ii): not required under 0.5 g total fat per serving without a fat,
  // fatty acid or cholesterol claim. 1000 g apricots (SR28 09021: 0.39 g fat/100 g) and 1000 g sugar
  // carrying F g fat/100 g, finished at 1600 g: (3.9 + 10 F) g fat in 1600 g, so (3.9 + 10 F) / 80 g a
  // 20 g serving; 0.5 g is reached at F = 3.61.
  const withFat = (fatG: number | null) => facts(labelInput([
    line(1000, labelData('apricots', 'fruit', SR28.apricot)),
    line(1000, labelData('sugar', 'sweetener', { ...SR28.sugar, fatG })),
  ], { finishedMassG: 1600 }));

  it('keeps the row, marked unknown, at 0.5 g a serving and above', () => {
    const f = withFat(4);
    expect(rowOf(f, 'totalFat').amount?.value).toBeCloseTo(43.9 / 80, 9);
    expect(rowOf(f, 'transFat').note).toBe('Not known: the ingredient data holds no trans fat figures');
    expect(f.notSignificantStatements).not.toContain('Not a significant source of trans fat');
  });

  it('keeps the row while the fat of any ingredient is not known', () => {
    const f = withFat(null);
    expect(rowOf(f, 'transFat').label).toBe('not known');
    expect(f.notSignificantStatements).not.toContain('Not a significant source of trans fat');
  });

  it('leaves it off, with the statement, just under 0.5 g a serving', () => {
    const f = withFat(3.5);
    expect(rowOf(f, 'totalFat').amount?.value).toBeCloseTo(38.9 / 80, 9);
    expect(f.rows.some((r) => r.nutrient === 'transFat')).toBe(false);
    expect(f.notSignificantStatements).toContain('Not a significant source of trans fat');
  });
});

describe('US cholesterol: from the ingredients, and named where a figure is missing', () => {
  // 1000 g apricots and 1000 g sugar (0 mg, SR28 09021 and 19335, from memory) with B g of butter
  // skimmed in against foam; butter carries 215 mg/100 g (SR28 01001 Butter, salted: from memory).
  // Finished at 1600 g, a 20 g serving holds 2.15 B / 80 mg. The butter borrows sugar's other figures:
  // only its cholesterol is under test.
  const withButter = (butterG: number, cholesterolMg: number | null = 215) => facts(labelInput([
    line(1000, labelData('apricots', 'fruit', SR28.apricot)),
    line(1000, labelData('sugar', 'sweetener', SR28.sugar)),
    line(butterG, labelData('butter', 'other', { ...SR28.sugar, cholesterolMg })),
  ], { finishedMassG: 1600 }));

  it('states zero under 2 mg a serving', () => {
    // Source: CFR (c)(3): under 2 mg → "0 mg". 20 g butter: 43 / 80 = 0.5375 mg.
    const row = rowOf(withButter(20), 'cholesterol');
    expect(row.amount?.value).toBeCloseTo(0.5375, 9);
    expect([row.label, row.dailyValuePct, row.incomplete]).toEqual(['0 mg', 0, false]);
  });

  it('says "less than 5 mg" from 2 to 5 mg, and the nearest 5 mg above', () => {
    // Source: CFR (c)(3). 100 g butter: 215 / 80 = 2.6875 mg; 200 g: 430 / 80 = 5.375 mg → 5 mg.
    expect(rowOf(withButter(100), 'cholesterol').label).toBe('less than 5 mg');
    const more = rowOf(withButter(200), 'cholesterol');
    expect(more.amount?.value).toBeCloseTo(5.375, 9);
    expect(more.label).toBe('5 mg');
    // Source: CFR (c)(9) DRV 300 mg: 5 ÷ 300 = 1.7 % → 2 %.
    expect(more.dailyValuePct).toBe(2);
  });

  it('names the ingredient whose figure is missing, and the panel is then incomplete', () => {
    const f = withButter(20, null);
    const row = rowOf(f, 'cholesterol');
    expect(row.unknownFrom).toEqual(['butter']);
    expect(row.note).toBe('Incomplete: no figure for butter');
    expect(f.complete).toBe(false);
  });
});

describe('US rounding: both sides of every threshold', () => {
  it('calories', () => {
    // Source: CFR (c)(1): < 5 → 0; ≤ 50 → nearest 5; > 50 → nearest 10.
    expect([4.99, 5, 7.49, 7.5, 50, 50.1, 54.99, 55].map(usCalories)).toEqual([0, 5, 5, 10, 50, 50, 50, 60]);
  });

  it('total, saturated and trans fat', () => {
    // Source: CFR (c)(2): < 0.5 g → 0; < 5 g → nearest 0.5 g; ≥ 5 g → nearest 1 g.
    expect([0.49, 0.5, 0.74, 0.75, 4.74, 4.75, 5, 5.49, 5.5].map((v) => usFatAmount(v).label))
      .toEqual(['0 g', '0.5 g', '0.5 g', '1 g', '4.5 g', '5 g', '5 g', '5 g', '6 g']);
  });

  it('cholesterol', () => {
    // Source: CFR (c)(3): < 2 mg → 0; 2–5 mg → "less than 5 mg"; > 5 mg → nearest 5 mg.
    expect([1.99, 2, 5, 5.1, 7.5].map((v) => usCholesterolAmount(v).label)).toEqual(['0 mg', 'less than 5 mg', 'less than 5 mg', '5 mg', '10 mg']);
  });

  it('sodium', () => {
    // Source: CFR (c)(4): < 5 mg → 0; 5–140 mg → nearest 5 mg; > 140 mg → nearest 10 mg.
    expect([4.99, 5, 137.4, 137.5, 140, 144.9, 145].map((v) => usSodiumAmount(v).label))
      .toEqual(['0 mg', '5 mg', '135 mg', '140 mg', '140 mg', '140 mg', '150 mg']);
  });

  it('carbohydrate, fibre, sugars, added sugars and protein', () => {
    // Source: CFR (c)(6), (6)(i)–(iii), (7): < 0.5 g → 0; < 1 g → "less than 1 g"; ≥ 1 g → nearest 1 g.
    expect([0.49, 0.5, 0.99, 1, 1.49, 1.5].map((v) => usGramAmount(v).label)).toEqual(['0 g', 'less than 1 g', 'less than 1 g', '1 g', '1 g', '2 g']);
  });

  it('% Daily Value with the 2016 reference values', () => {
    // Source: CFR (c)(9) DRVs for adults and children ≥ 4: fat 78 g, saturated fat 20 g, cholesterol 300 mg, sodium 2300 mg, carbohydrate 275 g, fibre 28 g, added sugars 50 g, protein 50 g.
    expect(US_DAILY_VALUES).toEqual({ totalFat: 78, saturatedFat: 20, cholesterol: 300, sodium: 2300, totalCarbohydrate: 275, dietaryFiber: 28, addedSugars: 50, protein: 50 });
    // Source: CFR (c)(8)(iii)/(c)(9): nearest 1 %.
    expect(usDailyValuePct(575, US_DAILY_VALUES.sodium)).toBe(25);
    expect(usDailyValuePct(13.6, 275)).toBe(5);
    expect(usDailyValuePct(13.8, 275)).toBe(5);
    expect(usDailyValuePct(15.1, 275)).toBe(5);
    expect(usDailyValuePct(15.2, 275)).toBe(6);
  });

  it('servings per container', () => {
    // Source: 21 CFR 101.9(b)(8)(i): nearest whole number, but between 2 and 5 to the nearest 0.5, "about" when rounded;
    // 101.9(b)(6): under 200 % of the reference amount the package is one serving.
    expect(usServingsPerContainer(340).label).toBe('17 servings per container');
    expect(usServingsPerContainer(250).label).toBe('about 13 servings per container');
    expect(usServingsPerContainer(110).label).toBe('about 6 servings per container');
    expect(usServingsPerContainer(100).label).toBe('5 servings per container');
    expect(usServingsPerContainer(94).label).toBe('about 4.5 servings per container');
    expect(usServingsPerContainer(45).label).toBe('about 2.5 servings per container');
    expect(usServingsPerContainer(40).label).toBe('2 servings per container');
    expect(usServingsPerContainer(39)).toEqual({ servings: 1, servingG: 39, label: '1 serving per container', exact: true });
  });
});

describe('US Nutrition Facts: bad input', () => {
  it('refuses a jar fill that is not a positive finite number', () => {
    // Source: BRIEF.md "Bad input gets a 4xx": NaN, infinities, zero and negative sizes; lib/chemistry/errors.ts.
    const input = strawberryJam();
    const n = finishedNutrients(input);
    for (const jarNetFillG of [0, -340, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => usNutritionFacts(n, { ...input, settings: { ...input.settings, jarNetFillG } })).toThrow(ChemistryInputError);
    }
    expect(() => usNutritionFacts(n, { ...input, lines: [] })).toThrow(ChemistryInputError);
  });
});
