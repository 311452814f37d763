import { describe, it, expect } from 'vitest';
import { ChemistryInputError } from '@/lib/chemistry';
import { finishedNutrients } from '@/lib/label/nutrition';
import type { LabelInput } from '@/lib/label/types';
import { CITRIC_ACID_NOTHING, NO_FIGURES, SR28, apricotJam, labelData, labelInput, line, strawberryJam } from './fixtures';

// REF = docs/nutrition-check-values.md (USDA SR28 figures and worked examples).

describe('finished nutrients: example (a) strawberry jam 1:1', () => {
  const input = strawberryJam();
  const n = finishedNutrients(input);

  it('takes the finished mass from the chemistry mass balance', () => {
    // Source: REF example (a): input 2015 g, finished 1600 g, 415 g of water lost.
    expect(input.massBalance.totalChargeG).toBeCloseTo(2015, 9);
    expect(input.massBalance.finishedMassG).toBeCloseTo(1600, 9);
    expect(input.massBalance.waterToEvaporateG).toBeCloseTo(415, 9);
  });

  it('gives every per-100 g figure of the worked example', () => {
    // Source: REF example (a), per 100 g column.
    expect(n.waterG).toBeCloseTo(30.973125, 9);
    expect(n.proteinG).toBeCloseTo(0.420625, 9);
    expect(n.fatG).toBeCloseTo(0.189375, 9);
    expect(n.saturatesG).toBeCloseTo(0.0096875, 9);
    expect(n.carbohydrateG).toBeCloseTo(67.8525, 9);
    expect(n.fibreG).toBeCloseTo(1.30375, 9);
    expect(n.sugarsG).toBeCloseTo(65.43125, 9);
    expect(n.sodiumMg).toBeCloseTo(2.5, 9);
  });

  it('sums the source energy values as listed, for reference', () => {
    // Source: REF example (a), "Sum of the SR28 energy values": 263.90625 kcal and 1104.75 kJ per 100 g.
    expect(n.energyKcal).toBeCloseTo(263.90625, 9);
    expect(n.energyKj).toBeCloseTo(1104.75, 9);
  });

  it('names pectin as the ingredient without a sugars figure instead of counting it as zero', () => {
    // Source: REF table: SR28 19310 (pectin) gives no sugars ("—" means no value, not zero).
    expect(n.unknownFrom.sugarsG).toEqual(['pectin']);
    expect(n.unknownFrom.waterG).toBeUndefined();
    // Sucrose is listed for strawberry and sugar only in the reference's individual-sugars table.
    expect(n.unknownFrom.sucroseG).toEqual(['pectin']);
  });

  it('leaves a nutrient that no line knows as null', () => {
    // Source: lib/label/types.ts contract ("A nutrient no ingredient knows is null"); REF has no polyols column.
    const withoutCitric = labelInput([line(1000, labelData('strawberries', 'fruit', SR28.strawberry)), line(1000, labelData('sugar', 'sweetener', SR28.sugar))], { finishedMassG: 1600 });
    const m = finishedNutrients(withoutCitric);
    expect(m.polyolsG).toBeNull();
    expect(m.unknownFrom.polyolsG).toEqual(['strawberries', 'sugar']);
  });
});

describe('finished nutrients: example (b) apricot jam', () => {
  const n = finishedNutrients(apricotJam());

  it('gives every per-100 g figure of the worked example', () => {
    // Source: REF example (b), per 100 g column (printed to 6 decimals).
    expect(n.waterG).toBeCloseTo(30.430612, 5);
    expect(n.proteinG).toBeCloseTo(0.857143, 5);
    expect(n.fatG).toBeCloseTo(0.238776, 5);
    expect(n.saturatesG).toBeCloseTo(0.016531, 5);
    expect(n.carbohydrateG).toBeCloseTo(68.020408, 5);
    expect(n.fibreG).toBeCloseTo(1.224490, 5);
    expect(n.sugarsG).toBeCloseTo(66.759184, 5);
    expect(n.sodiumMg).toBeCloseTo(1.224490, 5);
    expect(n.unknownFrom).toEqual({ polyolsG: ['apricots', 'sugar'], organicAcidsG: ['apricots', 'sugar'] });
  });
});

describe('finished nutrients: lines weighing nothing', () => {
  it('ignores a 0 g line, so its missing figures do not make the label incomplete', () => {
    // Source: the summing rule of REF (grams × value/100): a 0 g line adds 0 whatever its value.
    const input = labelInput([line(1000, labelData('sugar', 'sweetener', SR28.sugar)), line(0, labelData('spice', 'other', NO_FIGURES))]);
    const n = finishedNutrients(input);
    expect(n.unknownFrom.sugarsG).toBeUndefined();
    expect(n.sugarsG).toBeCloseTo((998 / input.massBalance.finishedMassG) * 100, 9);
  });
});

describe('finished nutrients: water to add', () => {
  it('adds the water when the target solids are below the charge solids', () => {
    // Derived from the mass balance rule in REF ("final water = Σ water − (input mass − finished mass)"):
    // 1000 g sugar at 65 % solids gives 1538.46 g, so 538.46 g of water is added, not lost.
    const input = labelInput([line(1000, labelData('sugar', 'sweetener', SR28.sugar))], { targetSolidsPct: 65 });
    expect(input.massBalance.waterToEvaporateG).toBeLessThan(0);
    const n = finishedNutrients(input);
    const finished = 1000 / 0.65;
    expect(n.waterG).toBeCloseTo(((0.2 + (finished - 1000)) / finished) * 100, 9);
    expect(n.sugarsG).toBeCloseTo((998 / finished) * 100, 9);
    // Solids and water add up to the whole when every figure is known (water + carbohydrate here).
    expect(n.waterG! + n.carbohydrateG!).toBeCloseTo(100, 9);
  });
});

describe('finished nutrients: bad input is refused with the field named', () => {
  const good = strawberryJam();
  const withLine = (patch: Record<string, unknown>, nutrients?: Record<string, unknown>): LabelInput => ({
    ...good,
    lines: good.lines.map((l, i) => (i === 1 ? { ...l, ...patch, ingredient: { ...l.ingredient, nutrients: { ...l.ingredient.nutrients, ...nutrients } } } : l)) as LabelInput['lines'],
  });
  const refused = (input: unknown, field: string) => {
    let caught: unknown;
    try { finishedNutrients(input as LabelInput); } catch (err) { caught = err; }
    expect(caught).toBeInstanceOf(ChemistryInputError);
    expect((caught as ChemistryInputError).field).toBe(field);
  };

  it('refuses grams that are not finite, negative, or past any batch', () => {
    // Source: BRIEF.md "Bad input gets a 4xx" (numbers past 2^31 and 2^53, NaN); lib/chemistry/errors.ts error type.
    for (const grams of [Number.NaN, Number.POSITIVE_INFINITY, -1, 2 ** 53, 2 ** 31, '1000', null]) {
      refused(withLine({ grams }), 'lines[1].grams');
    }
  });

  it('refuses nutrient values that no food can hold', () => {
    // Source: mass conservation (no more than 100 g per 100 g); sodium chloride is 39.3 % sodium.
    refused(withLine({}, { sugarsG: 100.5 }), 'lines[1].ingredient.nutrients.sugarsG');
    refused(withLine({}, { sugarsG: -0.1 }), 'lines[1].ingredient.nutrients.sugarsG');
    refused(withLine({}, { sodiumMg: 40000 }), 'lines[1].ingredient.nutrients.sodiumMg');
    refused(withLine({}, { fatG: Number.NaN }), 'lines[1].ingredient.nutrients.fatG');
    refused(withLine({}, { fatG: '0.3' }), 'lines[1].ingredient.nutrients.fatG');
  });

  it('refuses empty formulas, a zero charge and a missing or zero finished mass', () => {
    // Source: BRIEF.md "Bad input" classes: empty collections and zero sizes.
    refused({ ...good, lines: [] }, 'lines');
    refused({ ...good, lines: good.lines.map((l) => ({ ...l, grams: 0 })) }, 'lines');
    refused({ ...good, massBalance: { ...good.massBalance, finishedMassG: 0 } }, 'massBalance.finishedMassG');
    refused({ ...good, massBalance: { ...good.massBalance, finishedMassG: Number.NaN } }, 'massBalance.finishedMassG');
    refused({ ...good, massBalance: null }, 'massBalance');
    refused(null, 'input');
    refused({ ...good, lines: [null] }, 'lines[0]');
    refused({ ...good, lines: [{ grams: 1, ingredient: { ...good.lines[0].ingredient, labelName: 5 } }] }, 'lines[0].ingredient.labelName');
  });

  it('refuses a finished mass below the dry matter when every water figure is known', () => {
    // Derived from mass conservation: 1000 g sugar holds 0.2 g water, so it cannot end as 900 g.
    const input = labelInput([line(1000, labelData('sugar', 'sweetener', SR28.sugar))]);
    refused({ ...input, massBalance: { ...input.massBalance, finishedMassG: 900 } }, 'massBalance.finishedMassG');
  });

  it('withholds the water figure when the shortfall may be an unknown water content', () => {
    // Source: lib/label/types.ts contract: an unknown is never shown as if it were zero.
    const input = labelInput([line(1000, labelData('sugar', 'sweetener', SR28.sugar)), line(100, labelData('spice', 'other', NO_FIGURES))]);
    const n = finishedNutrients({ ...input, massBalance: { ...input.massBalance, finishedMassG: 900 } });
    expect(n.waterG).toBeNull();
    expect(n.unknownFrom.waterG).toEqual(['spice']);
  });

  it('treats a prototype-named ingredient as a plain name', () => {
    // Source: BRIEF.md "Bad input" classes: prototype-named keys.
    const input = labelInput([line(1000, labelData('sugar', 'sweetener', SR28.sugar)), line(5, labelData('__proto__', 'acid', { ...CITRIC_ACID_NOTHING, sodiumMg: null }))]);
    const n = finishedNutrients(input);
    expect(n.unknownFrom.sodiumMg).toEqual(['__proto__']);
    expect(Object.getPrototypeOf(n.unknownFrom)).toBe(Object.prototype);
  });
});
