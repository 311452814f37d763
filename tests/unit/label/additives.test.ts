import { describe, expect, it } from 'vitest';
import { additiveLimitChecks, additiveReport, foodCategoryFor, formulaMass, freeAcidFactor } from '@/lib/label/additives';
import {
  BENZOATE, CITRIC, LABEL, PECTIN, SORBATE, STRAWBERRY, SUCROSE, labelData, labelInputFrom, labelSettings,
} from './text-fixtures';
import type { TestLine } from './text-fixtures';

const SPREAD = labelSettings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 40 });

/** 1000 g strawberries, 400 g sugar, 10 g pectin, then the preservatives: a reduced-sugar spread at 40 °Brix. */
function spread(extra: TestLine[], settings = SPREAD) {
  return labelInputFrom([
    { composition: STRAWBERRY, label: LABEL.strawberry, grams: 1000 },
    { composition: SUCROSE, label: LABEL.sugar, grams: 400 },
    { composition: PECTIN, label: LABEL.pectin, grams: 10 },
    ...extra,
  ], settings);
}
const sorbate = (grams: number): TestLine => ({ composition: SORBATE, label: LABEL.sorbate, grams });
const benzoate = (grams: number): TestLine => ({ composition: BENZOATE, label: LABEL.benzoate, grams });
const preservativeCheck = (input: ReturnType<typeof spread>) => additiveLimitChecks(input).find((c) => c.ruleId.endsWith('sorbates_benzoates'));

describe('salts counted as the free acid', () => {
  it('uses factors from the formula masses', () => {
    // Source: standard atomic weights (IUPAC, conventional values, memory): C 12.011, H 1.008, O 15.999, Na 22.990, K 39.098, Ca 40.078;
    // formulas per Regulation (EU) No 231/2012 (memory). Sorbic acid C6H8O2 = 112.128; potassium sorbate C6H7KO2 = 150.218.
    expect(formulaMass({ C: 6, H: 8, O: 2 })).toBeCloseTo(112.128, 3);
    expect(freeAcidFactor('E202')).toBeCloseTo(112.128 / 150.218, 6); // 0.7464
    expect(freeAcidFactor('E211')).toBeCloseTo(122.123 / 144.105, 6); // 0.8475, sodium benzoate C7H5NaO2
    expect(freeAcidFactor('E213')).toBeCloseTo((2 * 122.123) / 282.308, 6); // calcium benzoate Ca(C7H5O2)2
    expect(freeAcidFactor('E200')).toBe(1);
    expect(freeAcidFactor('E440')).toBeNull();
  });
});

describe('sorbates and benzoates in a reduced-sugar spread', () => {
  it('passes just under 1000 mg/kg as sorbic acid and fails just over', () => {
    // Source: Regulation (EC) No 1333/2008 Annex II, 04.2.5.3, E 200–213 at 1 000 mg/kg (memory), footnote (2) "expressed as the free acid"
    // x g potassium sorbate: x · 0.74643 · 10^6 / ((490 + x) / 0.40) = 1000 at x = 1.6466 g; 1.64 g → 995.98, 1.65 g → 1002.03.
    const under = preservativeCheck(spread([sorbate(1.64)]));
    expect(under?.actualValue).toBeCloseTo(995.98, 2);
    expect(under?.status).toBe('pass');
    const over = preservativeCheck(spread([sorbate(1.65)]));
    expect(over?.actualValue).toBeCloseTo(1002.03, 2);
    expect(over).toMatchObject({ status: 'fail', passed: false, requiredValue: 1000 });
  });

  it('sums sorbic and benzoic acid against the one limit', () => {
    // Source: Regulation (EC) No 1333/2008 Annex II footnote (2) "applicable to the sum"; group E 200–213 (SA + BA), Annex II Part C(5)(c)
    // 1.0 g potassium sorbate + 0.7 g sodium benzoate in 1229.25 g: 607.2 + 482.6 = 1089.8 mg/kg → over; each alone is under.
    const both = preservativeCheck(spread([sorbate(1.0), benzoate(0.7)]));
    expect(both?.actualValue).toBeCloseTo(1089.8, 1);
    expect(both?.status).toBe('fail');
    expect(both?.eNumbers).toEqual(['E202', 'E211']);
    expect(both?.requirement).toBe('≤ 1000 mg/kg as free acid, summed');
    expect(preservativeCheck(spread([sorbate(1.0)]))?.status).toBe('pass');
    expect(preservativeCheck(spread([benzoate(0.7)]))?.status).toBe('pass');
    expect(additiveReport(spread([sorbate(1.0), benzoate(0.7)])).overall).toBe('non_compliant');
  });

  it('is not permitted in a full-sugar jam or in extra jam', () => {
    // Source: Regulation (EC) No 1333/2008 Annex II, 04.2.5.2 "only low-sugar and similar low calorie or sugar-free products" and no such row in 04.2.5.1 (memory)
    const jam = preservativeCheck(spread([sorbate(0.5)], labelSettings({ productClass: 'jam', targetSolidsPct: 65 })));
    expect(jam?.status).toBe('fail');
    expect(jam?.requirement).toBe('Not permitted in 04.2.5.2 Jam, jellies and marmalades (only low-sugar and similar low-calorie or sugar-free products)');
    const extra = preservativeCheck(spread([sorbate(0.5)], labelSettings({ productClass: 'extra_jam', targetSolidsPct: 65 })));
    expect(extra?.status).toBe('fail');
    expect(extra?.requirement).toBe('Not permitted in 04.2.5.1 Extra jam and extra jelly');
  });

  it('fails calcium sorbate everywhere', () => {
    // Source: Regulation (EU) 2018/98 (calcium sorbate E 203 taken out of Annex II; struck out of group E 200–213 in the consolidated Annex II Part C(5))
    const calcium = labelData('calcium sorbate', { additive: { eNumber: 'E203', className: 'preservative' } });
    const checks = additiveLimitChecks(spread([{ composition: SORBATE, label: calcium, grams: 0.2 }]));
    expect(checks.find((c) => c.eNumbers.includes('E203'))?.status).toBe('fail');
  });
});

describe('quantum satis and unknown additives', () => {
  it('passes pectin and citric acid at quantum satis', () => {
    // Source: Regulation (EC) No 1333/2008 Annex II, 04.2.5 (E 440 and E 330 quantum satis, memory)
    const checks = additiveLimitChecks(spread([{ composition: CITRIC, label: LABEL.citric, grams: 4 }]));
    expect(checks.map((c) => [c.title, c.status, c.requiredValue])).toEqual([['Pectins', 'pass', null], ['Citric acid', 'pass', null]]);
  });

  it('cannot judge an additive it holds no limit for', () => {
    // Source: Regulation (EC) No 1333/2008 Art. 4(1): only additives on the Union list, under its conditions of use (no data held here → not evaluable)
    const colour = labelData('colour', { additive: { eNumber: 'E163', className: 'colour' } });
    const report = additiveReport(spread([{ composition: { kind: 'other', name: 'Anthocyanins', solidsPct: 100 }, label: colour, grams: 0.5 }]));
    expect(report.checks.find((c) => c.eNumbers.includes('E163'))?.status).toBe('not_evaluable');
    expect(report.overall).toBe('incomplete');
    // Named as the label names it ("colour"), starting with a capital like the rule rows.
    expect(report.checks.find((c) => c.eNumbers.includes('E163'))?.title).toBe('Colour');
  });

  it('leaves other markets to their own rules', () => {
    const checks = additiveLimitChecks(spread([sorbate(3)], labelSettings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 40, ruleSet: 'us' })));
    expect(checks.every((c) => c.status === 'not_applicable')).toBe(true);
  });

  it('maps product classes to the sub-categories', () => {
    // Source: Regulation (EC) No 1333/2008 Annex II Part D, food categories 04.2.5.1–04.2.5.3
    expect([foodCategoryFor('extra_jam'), foodCategoryFor('jam'), foodCategoryFor('marmalade'), foodCategoryFor('reduced_sugar_spread')])
      .toEqual(['04.2.5.1', '04.2.5.2', '04.2.5.2', '04.2.5.3']);
  });
});
