import { describe, expect, it } from 'vitest';
import { compareStatedSugar, jamStatements, statedTotalSugar } from '@/lib/label/statements';
import { LABEL, STRAWBERRY, SUCROSE, labelData, labelInputFrom, labelSettings } from './text-fixtures';

const jam = (fruitG: number, sugarG: number, overrides = {}) => labelInputFrom([
  { composition: STRAWBERRY, label: LABEL.strawberry, grams: fruitG },
  { composition: SUCROSE, label: LABEL.sugar, grams: sugarG },
], labelSettings(overrides));

describe('"Prepared with X g of fruit per 100 g"', () => {
  it('is the fruit used per 100 g of finished product', () => {
    // Source: Council Directive 2001/113/EC Art. 2(3); 1000 g fruit (8 °Brix) + 1000 g sugar at 65 %: finished 1661.5 g → 60.18 g per 100 g
    const statements = jamStatements(jam(1000, 1000));
    expect(statements.fruit?.exactValue).toBeCloseTo(60.185, 3);
    expect(statements.fruit?.text).toBe('Prepared with 60 g of fruit per 100 g');
    expect(statements.fruit?.required).toBe(true);
  });

  it('rounds down at the whole-gram boundary, never stating more fruit than used', () => {
    // Source: Council Directive 2001/113/EC Art. 2(3) (the figure); rounding down: common practice, no published source
    // 450 g fruit (36 g solids) + 614 g sugar at 65 % → exactly 1000 g finished → 45.0; with 615 g sugar → 1001.5 g → 44.93.
    const on = jamStatements(jam(450, 614));
    expect(on.fruit?.exactValue).toBeCloseTo(45, 9);
    expect(on.fruit?.statedValue).toBe(45);
    const under = jamStatements(jam(450, 615));
    expect(under.fruit?.exactValue).toBeCloseTo(44.93, 2);
    expect(under.fruit?.statedValue).toBe(44);
  });

  it('deducts the water used to prepare aqueous extracts', () => {
    // Source: Council Directive 2001/113/EC Art. 2(3): "after deduction of the weight of water used in preparing the aqueous extracts"
    const input = labelInputFrom([
      { composition: { kind: 'fruit', name: 'Apple extract', solidsPct: 9 }, label: labelData('apple extract', { kind: 'fruit' }), grams: 1200 },
      { composition: SUCROSE, label: LABEL.sugar, grams: 1000 },
    ], labelSettings({ productClass: 'jelly' }));
    // finished = (108 + 1000) / 0.65 = 1704.6 g; (1200 − 300) / 1704.6 × 100 = 52.8
    const statements = jamStatements(input, { extractionWaterG: 300 });
    expect(statements.fruit?.exactValue).toBeCloseTo(52.80, 2);
    expect(statements.fruit?.statedValue).toBe(52);
    expect(() => jamStatements(input, { extractionWaterG: 1300 })).toThrow(/extraction water/);
    expect(() => jamStatements(input, { extractionWaterG: -1 })).toThrow(/extraction water/);
  });
});

describe('"Total sugar content X g per 100 g"', () => {
  it('states the target refractometer value, rounded half up to a whole number', () => {
    // Source: Council Directive 2001/113/EC Art. 2(4): the figure is the refractometer value at 20 °C of the finished product
    expect(statedTotalSugar(64.5)).toBe(65);
    expect(statedTotalSugar(64.49)).toBe(64);
    const statements = jamStatements(jam(1000, 1000, { targetSolidsPct: 64.5 }));
    expect(statements.totalSugar.text).toBe('Total sugar content 65 g per 100 g');
    expect(statements.totalSugar.required).toBe(true);
  });

  it('is not required while a nutrition claim for sugars is on the label', () => {
    // Source: Council Directive 2001/113/EC Art. 2(4), second subparagraph
    expect(jamStatements(jam(1000, 1000), { sugarsClaimMade: true }).totalSugar.required).toBe(false);
  });

  it('is optional on a reduced-sugar spread and outside the EU', () => {
    // Source: Council Directive 2001/113/EC Annex I (the reserved names the statements attach to)
    const spread = jamStatements(jam(1000, 300, { productClass: 'reduced_sugar_spread', targetSolidsPct: 35 }));
    expect(spread.totalSugar.required).toBe(false);
    expect(spread.fruit?.required).toBe(false);
    expect(spread.totalSugar.reason).toMatch(/reduced-sugar spread is not one of/);
    expect(jamStatements(jam(1000, 1000, { ruleSet: 'us' })).fruit?.required).toBe(false);
  });

  it('names the edition the rule date selects', () => {
    // Source: Directive (EU) 2024/1438 applies from 14 June 2026 (lib/chemistry/rule-sets.ts EU_2024_AMENDMENT_FROM)
    expect(jamStatements(jam(1000, 1000, { ruleDate: '2026-06-13' })).edition).toBe('Council Directive 2001/113/EC, Article 2');
    expect(jamStatements(jam(1000, 1000, { ruleDate: '2026-06-14' })).edition).toMatch(/as amended by Directive \(EU\) 2024\/1438/);
  });
});

describe('measured Brix against the stated sugar', () => {
  it('is within at exactly ± 3 degrees and outside just past them', () => {
    // Source: Council Directive 2001/113/EC Art. 2(4): "a tolerance of ± 3 refractometric degrees"
    expect(compareStatedSugar(65, 68)).toMatchObject({ difference: 3, withinTolerance: true });
    expect(compareStatedSugar(65, 68.1)).toMatchObject({ difference: 3.1, withinTolerance: false });
    expect(compareStatedSugar(65, 62)).toMatchObject({ difference: -3, withinTolerance: true });
    expect(compareStatedSugar(65, 61.9)).toMatchObject({ difference: -3.1, withinTolerance: false });
    expect(compareStatedSugar(65, 61.9).message).toBe('Measured 61.9 °Brix is 3.1 below the stated 65 g per 100 g: outside the ± 3 tolerance.');
  });

  it('refuses values that are not a Brix', () => {
    expect(() => compareStatedSugar(65, Number.NaN)).toThrow(/measuredBrix/);
    expect(() => compareStatedSugar(-1, 60)).toThrow(/stated/);
    expect(() => compareStatedSugar(65, 101)).toThrow(/measuredBrix/);
  });
});
