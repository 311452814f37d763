import { describe, expect, it } from 'vitest';
import { additiveLimitChecks } from '@/lib/label/additives';
import { checkNoAddedSugars } from '@/lib/label/claims';
import { additiveListName, fruitIndication, ingredientList } from '@/lib/label/ingredient-list';
import { jamStatements } from '@/lib/label/statements';
import {
  CITRIC, LABEL, PECTIN, RASPBERRY, REDCURRANT, STRAWBERRY, SUCROSE, WATER, labelData, labelInputFrom, labelSettings, nutrients,
} from './text-fixtures';
import type { TestLine } from './text-fixtures';

const strawberry = (grams: number): TestLine => ({ composition: STRAWBERRY, label: LABEL.strawberry, grams });
const sugar = (grams: number): TestLine => ({ composition: SUCROSE, label: LABEL.sugar, grams });
const water = (grams: number): TestLine => ({ composition: WATER, label: LABEL.water, grams });

describe('order of the list', () => {
  it('lists ingredients by descending weight at the time of use', () => {
    // Source: Regulation (EU) No 1169/2011 Art. 18(1) ("in descending order of weight, as recorded at the time of their use")
    const input = labelInputFrom([
      sugar(900),
      strawberry(1000),
      { composition: PECTIN, label: LABEL.pectin, grams: 8 },
      { composition: CITRIC, label: LABEL.citric, grams: 5 },
    ]);
    const list = ingredientList(input, 'eu');
    expect(list.entries.map((e) => e.name)).toEqual(['strawberries', 'sugar', 'gelling agent (pectin)', 'acid (citric acid)']);
    expect(list.text).toBe('Ingredients: strawberries, sugar, gelling agent (pectin), acid (citric acid).');
  });

  it('merges lines that print the same name', () => {
    // Source: Regulation (EU) No 1169/2011 Art. 18(1): one ingredient, one place in the list, by its total weight
    const input = labelInputFrom([strawberry(600), sugar(500), sugar(300)]);
    const list = ingredientList(input, 'eu');
    expect(list.entries.map((e) => [e.name, e.grams])).toEqual([['sugar', 800], ['strawberries', 600]]);
    expect(list.entries[0].lineIndexes).toEqual([1, 2]);
  });
});

describe('added water (EU)', () => {
  it('drops out when the boil takes off more water than was added', () => {
    // Source: Regulation (EU) No 1169/2011 Annex VII Part A(1): added water = finished product − other ingredients used; not listed at ≤ 5 %
    // 1000 g strawberries (8 °Brix) + 1000 g sugar + 200 g water at 65 %: finished 1080 / 0.65 = 1661.5 g < 2000 g of other ingredients.
    const input = labelInputFrom([strawberry(1000), sugar(1000), water(200)]);
    const list = ingredientList(input, 'eu');
    expect(input.massBalance.finishedMassG).toBeCloseTo(1661.54, 2);
    expect(list.addedWater?.remainingG).toBeCloseTo(1661.54 - 2000, 2);
    expect(list.addedWater?.declared).toBe(false);
    expect(list.entries.map((e) => e.name)).toEqual(['strawberries', 'sugar']);
  });

  it('stays, placed by the weight left in the product, when more than 5 % is left', () => {
    // Source: Regulation (EU) No 1169/2011 Annex VII Part A(1): "listed in order of their weight in the finished product"
    // 1000 g strawberries + 300 g sugar + 400 g water at 25 %: finished 380 / 0.25 = 1520 g; water left 1520 − 1300 = 220 g (14.5 %).
    const input = labelInputFrom([strawberry(1000), sugar(300), water(400)], labelSettings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 25 }));
    const list = ingredientList(input, 'eu');
    expect(list.addedWater?.remainingG).toBeCloseTo(220, 6);
    expect(list.addedWater?.pctOfFinished).toBeCloseTo(14.47, 2);
    expect(list.entries.map((e) => [e.name, Math.round(e.grams)])).toEqual([['strawberries', 1000], ['sugar', 300], ['water', 220]]);
  });

  it('turns at 5 % of the finished product, on both sides', () => {
    // Source: Regulation (EU) No 1169/2011 Annex VII Part A(1): "need not be taken into consideration if it does not exceed 5 %"
    // Other ingredients 1300 g, solids 380 g: water left = 1 − 1300·t/380 of the product; 5 % at t = 27.77 %.
    const at = (targetSolidsPct: number) => ingredientList(
      labelInputFrom([strawberry(1000), sugar(300), water(400)], labelSettings({ productClass: 'reduced_sugar_spread', targetSolidsPct })), 'eu');
    const above = at(27.7);
    expect(above.addedWater?.pctOfFinished).toBeCloseTo(5.24, 2);
    expect(above.entries.some((e) => e.name === 'water')).toBe(true);
    const below = at(27.8);
    expect(below.addedWater?.pctOfFinished).toBeCloseTo(4.89, 2);
    expect(below.entries.some((e) => e.name === 'water')).toBe(false);
  });
});

describe('added water (US)', () => {
  it('lists water by the weight added while some stays in the food', () => {
    // Source: 21 CFR 101.4(a)(1) (memory): water added in making a food is listed by its weight; not declared when all of it is removed
    const input = labelInputFrom([strawberry(1000), sugar(300), water(400)], labelSettings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 25, ruleSet: 'us' }));
    const list = ingredientList(input, 'us');
    expect(list.entries.map((e) => [e.name, e.grams])).toEqual([['strawberries', 1000], ['water', 400], ['sugar', 300]]);
  });

  it('leaves water out when the boil removes more than was added', () => {
    // Source: 21 CFR 101.4(a)(1) (memory), as above
    const list = ingredientList(labelInputFrom([strawberry(1000), sugar(1000), water(200)]), 'us');
    expect(list.entries.map((e) => e.name)).toEqual(['strawberries', 'sugar']);
  });
});

describe('fruit named as the jam rules allow', () => {
  it('names one or two fruits in descending order of raw-material weight', () => {
    // Source: Council Directive 2001/113/EC Art. 2(2): fruits "in descending order of the weight of the raw materials used"
    const input = labelInputFrom([
      { composition: STRAWBERRY, label: LABEL.strawberry, grams: 300, fruitName: 'strawberry' },
      { composition: RASPBERRY, label: LABEL.raspberry, grams: 700, fruitName: 'raspberry' },
      sugar(900),
    ]);
    expect(ingredientList(input, 'eu').fruitIndication).toEqual({ fruits: ['raspberry', 'strawberry'], text: 'raspberry and strawberry', alternatives: [] });
  });

  it('allows "mixed fruit" from three fruits', () => {
    // Source: Council Directive 2001/113/EC Art. 2(2): three or more fruits may be replaced by "mixed fruit", a similar indication or the number of fruits
    const indication = fruitIndication([
      { grams: 200, ingredient: LABEL.redcurrant, fruitName: 'redcurrant' },
      { grams: 500, ingredient: LABEL.strawberry, fruitName: 'strawberry' },
      { grams: 300, ingredient: LABEL.raspberry, fruitName: 'raspberry' },
    ]);
    expect(indication.fruits).toEqual(['strawberry', 'raspberry', 'redcurrant']);
    expect(indication.text).toBe('mixed fruit');
    expect(indication.alternatives).toEqual(['strawberry, raspberry and redcurrant', '3 fruits']);
  });

  it('lists each of the three fruits in the ingredient list itself', () => {
    // Source: Regulation (EU) No 1169/2011 Art. 18(1): every ingredient is listed; "mixed fruit" replaces only the name's fruit indication
    const input = labelInputFrom([
      { composition: STRAWBERRY, label: LABEL.strawberry, grams: 500 },
      { composition: RASPBERRY, label: LABEL.raspberry, grams: 300 },
      { composition: REDCURRANT, label: LABEL.redcurrant, grams: 200 },
      sugar(900),
    ]);
    expect(ingredientList(input, 'eu').text).toBe('Ingredients: sugar, strawberries, raspberries, redcurrants.');
  });
});

describe('allergens', () => {
  const hazelnut = labelData('hazelnut pieces', { euAllergens: ['nuts'], usAllergens: ['tree_nuts'] });
  const glaze = labelData('glaze', { euAllergens: ['eggs'], usAllergens: ['eggs'] });
  const input = () => labelInputFrom([
    strawberry(1000), sugar(800),
    { composition: { kind: 'other', name: 'Hazelnut', solidsPct: 0 }, label: hazelnut, grams: 50 },
    { composition: { kind: 'other', name: 'Glaze', solidsPct: 0 }, label: glaze, grams: 10 },
  ]);

  it('emphasises the allergen word in the EU list, and adds the allergen where the name lacks it', () => {
    // Source: Regulation (EU) No 1169/2011 Art. 21(1)(a) (name of the substance, with reference to Annex II) and (b) (emphasised by typeset)
    const list = ingredientList(input(), 'eu');
    const nut = list.entries.find((e) => e.name === 'hazelnut pieces');
    expect(nut?.segments).toEqual([{ text: 'hazelnut', emphasis: true }, { text: ' pieces', emphasis: false }]);
    const egg = list.entries.find((e) => e.name === 'glaze');
    expect(egg?.segments).toEqual([
      { text: 'glaze', emphasis: false }, { text: ' (', emphasis: false }, { text: 'egg', emphasis: true }, { text: ')', emphasis: false },
    ]);
    expect(list.text).toBe('Ingredients: strawberries, sugar, HAZELNUT pieces, glaze (EGG).');
    expect(list.containsStatement).toBeNull();
  });

  it('matches allergen words whole, not inside other words', () => {
    // Source: Regulation (EU) No 1169/2011 Art. 21(1)(b) (the allergen's name is what is emphasised)
    const coated = labelData('oat-coated nutmeg', { euAllergens: ['cereals_gluten', 'eggs'] });
    const list = ingredientList(labelInputFrom([
      strawberry(1000), sugar(800),
      { composition: { kind: 'other', name: 'Spice', solidsPct: 0 }, label: coated, grams: 5 },
    ]), 'eu');
    expect(list.entries.at(-1)?.segments).toEqual([
      { text: 'oat', emphasis: true }, { text: '-coated nutmeg', emphasis: false },
      { text: ' (', emphasis: false }, { text: 'egg', emphasis: true }, { text: ')', emphasis: false },
    ]);
  });

  it('gives the US list a "Contains:" statement instead of emphasis', () => {
    // Source: FALCPA (21 U.S.C. 343(w)(1)(A)): "Contains" followed by the food sources, beside the ingredient list
    const list = ingredientList(input(), 'us');
    expect(list.segments.every((s) => !s.emphasis)).toBe(true);
    expect(list.containsStatement).toBe('Contains: tree nuts, egg.');
  });

  it('declares sulphites only above 10 mg/kg SO2 in the finished product', () => {
    // Source: Regulation (EU) No 1169/2011 Annex II point 12 ("more than 10 mg/kg ... in terms of the total SO2"); Directive 2001/113/EC Art. 2(6)
    const sulphited = (grams: number) => labelInputFrom([
      strawberry(1000), sugar(1000),
      { composition: { kind: 'fruit', name: 'Sulphited pulp', solidsPct: 10 }, label: labelData('apricot pulp', { kind: 'fruit', sulphiteMgPerKg: 500 }), grams },
    ]);
    // 30 g × 500 mg/kg = 15 mg in (1083 g solids / 0.65) = 1666.2 g → 9.0 mg/kg; 40 g → 20 mg in 1667.7 g → 12.0 mg/kg.
    const under = ingredientList(sulphited(30), 'eu');
    expect(under.sulphiteMgPerKg).toBeCloseTo(9.0, 1);
    expect(under.entries.some((e) => e.name === 'sulphites')).toBe(false);
    const over = ingredientList(sulphited(40), 'eu');
    expect(over.sulphiteMgPerKg).toBeCloseTo(12.0, 1);
    expect(over.entries.at(-1)?.segments).toEqual([{ text: 'sulphites', emphasis: true }]);
  });
});

describe('additive names', () => {
  it('EU: class name followed by the specific name, or the E number when no name is known', () => {
    // Source: Regulation (EU) No 1169/2011 Annex VII Part C: "designated by the name of that category, followed by their specific name or, if appropriate, E number"
    expect(additiveListName({ grams: 1, ingredient: LABEL.pectin }, 'eu')).toBe('gelling agent (pectin)');
    expect(additiveListName({ grams: 1, ingredient: LABEL.sorbate }, 'eu')).toBe('preservative (potassium sorbate)');
    const colour = labelData('colour', { additive: { eNumber: 'E 163', className: 'colour' } });
    expect(additiveListName({ grams: 1, ingredient: colour }, 'eu')).toBe('colour (E163)');
  });

  it('US: the common name, a preservative with its function', () => {
    // Source: 21 CFR 101.4(a)(1) (common or usual name); 21 CFR 101.22(j) (preservative named with its function, memory)
    expect(additiveListName({ grams: 1, ingredient: LABEL.pectin }, 'us')).toBe('pectin');
    expect(additiveListName({ grams: 1, ingredient: LABEL.sorbate }, 'us')).toBe('potassium sorbate (preservative)');
  });
});

describe('bad input', () => {
  it('refuses negative grams and a missing finished mass', () => {
    const input = labelInputFrom([strawberry(1000), sugar(1000)]);
    expect(() => ingredientList({ ...input, lines: [{ ...input.lines[0], grams: -1 }] }, 'eu')).toThrow(/grams/);
    expect(() => ingredientList({ ...input, massBalance: { ...input.massBalance, finishedMassG: Number.NaN } }, 'eu')).toThrow(/finishedMassG/);
  });
});

describe('every label module refuses the same bad input', () => {
  it('names the field for negative or non-finite grams, an empty name and a missing finished mass', () => {
    // Source: DEVELOPERS.md (validation: bad input is refused and changes nothing); ChemistryInputError names the field for a 4xx
    const input = labelInputFrom([strawberry(1000), sugar(1000)]);
    const bad = [
      { ...input, lines: [{ ...input.lines[0], grams: Number.POSITIVE_INFINITY }] },
      { ...input, lines: [{ ...input.lines[0], ingredient: { ...input.lines[0].ingredient, labelName: '  ' } }] },
      { ...input, massBalance: { ...input.massBalance, finishedMassG: 0 } },
    ];
    const modules = [
      (i: typeof input) => ingredientList(i, 'us'),
      (i: typeof input) => jamStatements(i),
      (i: typeof input) => additiveLimitChecks(i),
      (i: typeof input) => checkNoAddedSugars(i, { ...nutrients({ sugarsG: 1 }), unknownFrom: {} }),
    ];
    for (const run of modules) {
      expect(() => run(bad[0])).toThrow(/lines\[0\]\.grams/);
      expect(() => run(bad[1])).toThrow(/labelName/);
      expect(() => run(bad[2])).toThrow(/finishedMassG/);
    }
  });
});
