import { describe, it, expect } from 'vitest';
import { checkCompliance, computeMassBalance } from '@/lib/chemistry';
import type { ComplianceBatchInput, EuFruitGroup, FormulaSettings, IngredientComposition, ProductClass } from '@/lib/chemistry';
import { SUGAR, fruit, settings } from './fixtures';

/** A batch of exactly 1000 g finished product holding `fruitG` of one fruit. */
function batchWithFruit(fruitG: number, group: EuFruitGroup, extra: Partial<IngredientComposition> = {}, solidsPct = 65): ComplianceBatchInput {
  const f = fruit(10, { euFruitGroup: group, ...extra });
  return {
    lines: [
      { index: 0, ingredient: f, massG: fruitG, solidsG: fruitG * 0.1 },
      { index: 1, ingredient: SUGAR, massG: 600, solidsG: 600 },
    ],
    finishedMassG: 1000,
    targetSolidsPct: solidsPct,
    sweetenerSolidsG: 600,
  };
}

function fruitRule(productClass: ProductClass, ruleDate: string, fruitG: number, group: EuFruitGroup) {
  const s: FormulaSettings = settings({ productClass, ruleDate, ruleSet: 'eu' });
  const report = checkCompliance(batchWithFruit(fruitG, group), s);
  const rule = report.results.find((r) => r.status !== 'not_applicable' && /fruit/i.test(r.title));
  if (!rule) throw new Error('no fruit rule applied');
  return rule;
}

const BEFORE = '2026-06-13';
const FROM = '2026-06-14';

describe('EU fruit minimums before 14 June 2026', () => {
  // Source: EU Directive 2001/113/EC, Annex I — jam: 350 g general; 250 g redcurrants, rowanberries, sea-buckthorn, blackcurrants, rosehips, quinces; 150 g ginger; 160 g cashew apple; 60 g passion fruit
  const jamCases: [EuFruitGroup, number][] = [
    ['general', 350], ['reduced_minimum_fruits', 250], ['ginger', 150], ['cashew_apple', 160], ['passion_fruit', 60],
  ];
  it.each(jamCases)('jam, %s: passes at %i g and fails 1 g below', (group, minimum) => {
    const atMinimum = fruitRule('jam', BEFORE, minimum, group);
    expect(atMinimum.requiredValue).toBeCloseTo(minimum, 9);
    expect(atMinimum.passed).toBe(true);
    expect(fruitRule('jam', BEFORE, minimum - 1, group).passed).toBe(false);
    expect(atMinimum.source).toContain('2001/113/EC, Annex I');
  });

  // Source: EU Directive 2001/113/EC, Annex I — extra jam: 450 / 350 / 250 / 230 / 80 g
  const extraCases: [EuFruitGroup, number][] = [
    ['general', 450], ['reduced_minimum_fruits', 350], ['ginger', 250], ['cashew_apple', 230], ['passion_fruit', 80],
  ];
  it.each(extraCases)('extra jam, %s: requires %i g', (group, minimum) => {
    expect(fruitRule('extra_jam', BEFORE, minimum, group).passed).toBe(true);
    expect(fruitRule('extra_jam', BEFORE, minimum - 1, group).passed).toBe(false);
  });

  it('jelly follows the jam minimums', () => {
    // Source: EU Directive 2001/113/EC, Annex I — jelly: as jam, in juice or extract
    expect(fruitRule('jelly', BEFORE, 350, 'general').passed).toBe(true);
    expect(fruitRule('jelly', BEFORE, 349, 'general').passed).toBe(false);
  });
});

describe('EU fruit minimums from 14 June 2026', () => {
  it('raises the general jam minimum to 450 g', () => {
    // Source: Directive (EU) 2024/1438 amending 2001/113/EC — jam general minimum 450 g from 14 June 2026
    expect(fruitRule('jam', FROM, 449, 'general').passed).toBe(false);
    expect(fruitRule('jam', FROM, 450, 'general').passed).toBe(true);
    expect(fruitRule('jam', FROM, 450, 'general').source).toContain('2024/1438');
    // The same 400 g jam passed the day before.
    expect(fruitRule('jam', BEFORE, 400, 'general').passed).toBe(true);
    expect(fruitRule('jam', FROM, 400, 'general').passed).toBe(false);
  });

  it('raises the jelly minimum with jam to 450 g', () => {
    // Source: EU Directive 2001/113/EC, Annex I ('Jelly': juice not less than that laid down for jam) with the jam minimum raised to 450 g
    // by Directive (EU) 2024/1438 (FSAI summary of the amendment)
    expect(fruitRule('jelly', FROM, 449, 'general').passed).toBe(false);
    expect(fruitRule('jelly', FROM, 450, 'general').passed).toBe(true);
    expect(fruitRule('jelly', BEFORE, 350, 'general').passed).toBe(true);
  });

  it('raises the general extra-jam minimum to 500 g', () => {
    // Source: Directive (EU) 2024/1438 amending 2001/113/EC — extra jam general minimum 500 g from 14 June 2026
    expect(fruitRule('extra_jam', FROM, 499, 'general').passed).toBe(false);
    expect(fruitRule('extra_jam', FROM, 500, 'general').passed).toBe(true);
  });

  it('keeps the exception fruits at their 2001 minimums', () => {
    // Source: EU Directive 2001/113/EC, Annex I exception minimums. (memory) Kept unchanged after Directive (EU) 2024/1438: the FSAI and
    // Eurofins summaries name only the general minimums and a Polish press summary says the lower thresholds stay; the amending text was not read.
    expect(fruitRule('jam', FROM, 250, 'reduced_minimum_fruits').passed).toBe(true);
    expect(fruitRule('jam', FROM, 249, 'reduced_minimum_fruits').passed).toBe(false);
    expect(fruitRule('extra_jam', FROM, 80, 'passion_fruit').passed).toBe(true);
  });
});

describe('EU rule edition by date', () => {
  it('switches edition on 14 June 2026', () => {
    // Source: Directive (EU) 2024/1438 amending 2001/113/EC — raised minimums from 14 June 2026
    expect(checkCompliance(batchWithFruit(500, 'general'), settings({ ruleDate: BEFORE })).edition).not.toContain('2024/1438');
    expect(checkCompliance(batchWithFruit(500, 'general'), settings({ ruleDate: FROM })).edition).toContain('2024/1438');
    const ids = checkCompliance(batchWithFruit(500, 'general'), settings({ ruleDate: FROM })).results.map((r) => r.ruleId);
    expect(ids).toContain('eu.2024.jam.fruit');
    expect(ids).not.toContain('eu.2001.jam.fruit');
  });
});

describe('EU soluble dry matter and mixtures', () => {
  it('requires 60 % soluble dry matter', () => {
    // Source: EU Directive 2001/113/EC, Annex I — soluble dry matter (refractometer) ≥ 60 %
    const pass = checkCompliance(batchWithFruit(500, 'general', {}, 60), settings());
    const fail = checkCompliance(batchWithFruit(500, 'general', {}, 59.9), settings());
    expect(pass.results.find((r) => r.ruleId === 'eu.soluble_dry_matter')?.passed).toBe(true);
    expect(fail.results.find((r) => r.ruleId === 'eu.soluble_dry_matter')?.passed).toBe(false);
    expect(fail.overall).toBe('non_compliant');
  });

  it('weights the minimum of a fruit mix by each fruit share', () => {
    // Source: EU Directive 2001/113/EC, Annex I, Part III: "Where fruits are mixed together, the minimum contents ... must be reduced in proportion to the percentages used"
    // 150 g general fruit (350 g) + 150 g redcurrant (250 g): half of each → 300 g.
    const batch: ComplianceBatchInput = {
      lines: [
        { index: 0, ingredient: fruit(10, { euFruitGroup: 'general' }), massG: 150, solidsG: 15 },
        { index: 1, ingredient: fruit(10, { euFruitGroup: 'reduced_minimum_fruits' }), massG: 150, solidsG: 15 },
      ],
      finishedMassG: 1000,
      targetSolidsPct: 65,
      sweetenerSolidsG: 600,
    };
    const rule = checkCompliance(batch, settings({ ruleDate: BEFORE })).results.find((r) => r.ruleId === 'eu.2001.jam.fruit');
    expect(rule?.requiredValue).toBeCloseTo(300, 9);
    expect(rule?.passed).toBe(true);
  });

  it('reports rules for other classes as not applicable rather than dropping them', () => {
    const report = checkCompliance(batchWithFruit(500, 'general'), settings({ productClass: 'jam' }));
    const extra = report.results.find((r) => r.ruleId === 'eu.2001.extra_jam.fruit');
    expect(extra?.status).toBe('not_applicable');
    expect(extra?.passed).toBeNull();
  });
});

describe('US standards of identity', () => {
  function usReport(solidsPct: number, productClass: ProductClass = 'jam') {
    const lines = [
      { ingredient: fruit(10, { usFruitGroup: '1' as const }), quantity: 470, unit: 'g' as const },
      { ingredient: SUGAR, quantity: 550, unit: 'g' as const },
    ];
    const s = settings({ ruleSet: 'us', productClass, targetSolidsPct: solidsPct });
    return checkCompliance(computeMassBalance(lines, s), s);
  }

  it('requires 65 % soluble solids for jams', () => {
    // Source: 21 CFR 150.160 — finished soluble solids not less than 65 %
    expect(usReport(65).results.find((r) => r.ruleId === 'us.150_160.soluble_solids')?.passed).toBe(true);
    expect(usReport(64.5).results.find((r) => r.ruleId === 'us.150_160.soluble_solids')?.passed).toBe(false);
  });

  it('requires 65 % soluble solids for jelly', () => {
    // Source: 21 CFR 150.140 — finished soluble solids not less than 65 %
    expect(usReport(64, 'jelly').results.find((r) => r.ruleId === 'us.150_140.soluble_solids')?.passed).toBe(false);
  });

  it('checks the parts of fruit per 55 parts of sweetener', () => {
    // Source: 21 CFR 150.160(d)(1)(i): Group I fruit, 47 parts by weight of fruit to each 55 parts of saccharine ingredient (text quoted in IFSQN forum, 2025)
    const ratio = usReport(65).results.find((r) => r.ruleId === 'us.150_160.fruit_ratio');
    expect(ratio?.actualValue).toBeCloseTo(47, 9);
    expect(ratio?.requiredValue).toBe(47);
    expect(ratio?.passed).toBe(true);
  });

  /** Ratio rule for one fruit line of `fruitG` against 550 g sugar, i.e. fruitG / 10 parts per 55. */
  function ratioRule(fruitG: number, usFruitGroup: '1' | '2', productClass: ProductClass = 'jam') {
    const lines = [
      { ingredient: fruit(10, { usFruitGroup }), quantity: fruitG, unit: 'g' as const },
      { ingredient: SUGAR, quantity: 550, unit: 'g' as const },
    ];
    const s = settings({ ruleSet: 'us', productClass, targetSolidsPct: 65 });
    const id = productClass === 'jelly' ? 'us.150_140.juice_ratio' : 'us.150_160.fruit_ratio';
    const rule = checkCompliance(computeMassBalance(lines, s), s).results.find((r) => r.ruleId === id);
    if (!rule) throw new Error(`no rule ${id}`);
    return rule;
  }

  it('requires 47 parts for Group I and 45 parts for Group II fruit', () => {
    // Source: 21 CFR 150.160(d)(1)(i) (Group I, 47 parts); Colorado State University, Colorado Farm to Market, "Jams and Jellies"
    // (berry group 47:55, pome group 45:55)
    expect(ratioRule(460, '1').passed).toBe(false);
    expect(ratioRule(470, '1').passed).toBe(true);
    expect(ratioRule(450, '2').requiredValue).toBe(45);
    expect(ratioRule(450, '2').passed).toBe(true);
    expect(ratioRule(449, '2').passed).toBe(false);
  });

  it('weights a Group I and Group II mix by fruit mass and says the rule is unverified', () => {
    // (memory) Mixed-group weighting: the mixed-group clause of 21 CFR 150.160(d)(1) was not read.
    const lines = [
      { ingredient: fruit(10, { usFruitGroup: '1' }), quantity: 230, unit: 'g' as const },
      { ingredient: fruit(10, { usFruitGroup: '2' }), quantity: 230, unit: 'g' as const },
      { ingredient: SUGAR, quantity: 550, unit: 'g' as const },
    ];
    const s = settings({ ruleSet: 'us', targetSolidsPct: 65 });
    const rule = checkCompliance(computeMassBalance(lines, s), s).results.find((r) => r.ruleId === 'us.150_160.fruit_ratio');
    expect(rule?.requiredValue).toBeCloseTo(46, 9);
    expect(rule?.passed).toBe(true);
    // The note says what is done, in words; that the mixed-group clause was not read stays in the code.
    expect(rule?.note).toMatch(/weighted by fruit mass/);
    expect(rule?.note).not.toMatch(/memory/);
  });

  it('requires 45 parts of juice for jelly whatever the fruit group', () => {
    // Source: FDA Compliance Policy Guide Sec. 550.475 (Jellies, Nonstandardized), Finding 1: fruit juice not less than 45 parts by weight,
    // saccharine ingredients no more than 55 parts; Colorado State University, Colorado Farm to Market, "Jams and Jellies" (jellies 45:55)
    expect(ratioRule(450, '1', 'jelly').requiredValue).toBe(45);
    expect(ratioRule(450, '1', 'jelly').passed).toBe(true);
    expect(ratioRule(449, '2', 'jelly').passed).toBe(false);
  });

  it('cannot evaluate the ratio when a fruit has no US group', () => {
    const lines = [
      { ingredient: fruit(10), quantity: 500, unit: 'g' as const },
      { ingredient: SUGAR, quantity: 550, unit: 'g' as const },
    ];
    const s = settings({ ruleSet: 'us', targetSolidsPct: 65 });
    const report = checkCompliance(computeMassBalance(lines, s), s);
    expect(report.results.find((r) => r.ruleId === 'us.150_160.fruit_ratio')?.status).toBe('not_evaluable');
    expect(report.overall).toBe('incomplete');
  });
});

describe('EU marmalade', () => {
  it('requires 200 g of citrus fruit per 1000 g', () => {
    // Source: EU Directive 2001/113/EC, Annex I ('Marmalade'): not less than 200 g citrus fruit per 1 000 g, at least 75 g from the endocarp
    // (text as reproduced in EFSA FoodEx2 term A01NJ)
    const check = (citrusG: number) => checkCompliance(batchWithFruit(citrusG, 'citrus'), settings({ productClass: 'marmalade' }))
      .results.find((r) => r.ruleId === 'eu.marmalade.citrus');
    expect(check(200)?.passed).toBe(true);
    expect(check(199)?.passed).toBe(false);
    expect(check(200)?.requiredValue).toBe(200);
  });
});

describe('US marmalade', () => {
  it('is reported as outside the standards of identity', () => {
    // Source: FDA/CFSAN Q&A on fruit jams, jellies, fruit butters and marmalades: "There is no formal standard of identity for marmalades"
    const report = checkCompliance(batchWithFruit(300, 'citrus', {}, 65), settings({ ruleSet: 'us', productClass: 'marmalade' }));
    expect(report.overall).toBe('not_applicable');
    expect(report.results.find((r) => r.ruleId === 'us.scope.marmalade')?.note).toMatch(/30 lb fruit/);
  });
});

describe('Codex', () => {
  it('puts reduced-sugar products outside the scope', () => {
    // Source: Codex Standard for Jams, Jellies and Marmalades (CXS 296-2009), section 1.1(c): does not apply to reduced sugar products
    const report = checkCompliance(batchWithFruit(500, 'general', {}, 40), settings({ ruleSet: 'codex', productClass: 'reduced_sugar_spread' }));
    expect(report.overall).toBe('not_applicable');
    expect(report.results.some((r) => r.source.includes('1.1(c)'))).toBe(true);
  });

  it('requires at least 60 % soluble solids', () => {
    // Source: Codex CXS 296-2009 — soluble solids "60–65 % or greater" (memory)
    const report = checkCompliance(batchWithFruit(500, 'general', {}, 59), settings({ ruleSet: 'codex' }));
    expect(report.results.find((r) => r.ruleId === 'codex.296.soluble_solids')?.passed).toBe(false);
  });
});
