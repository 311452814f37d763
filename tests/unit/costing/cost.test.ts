import { describe, expect, it } from 'vitest';
import {
  batchActualCostPerJar,
  costFormula,
  costStoredFormula,
  fillMismatchText,
  historiesBy,
  roundMinor,
  type CostingInput,
  type IngredientPricePoint,
  type PackagingPricePoint,
  type PackFormatData,
} from '@/lib/costing';
import { CITRIC, HM_PECTIN_200, SUGAR, fruit } from '../chemistry/fixtures';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';

// Source: Practical Action technical brief "Jams, jellies and marmalade" (KnO 100247), "Batch
// preparation", recipe 1 (fruit:sugar 50:50): 10 kg fruit at 10 % TSS, 10 kg sugar, 60 g pectin
// (grade 200), 55 g citric acid → 1.000 + 10.000 + 0.060 + 0.055 = 11.115 kg soluble solids;
// yield = 11.115 × 100 / 68 = 16.35 kg (the brief prints it rounded to 16.4 kg).
// The prices and packaging below are invented for the test (illustrative, no source).
const FRUIT = 'f0000000-0000-4000-8000-000000000001';
const SUGAR_ID = 'f0000000-0000-4000-8000-000000000002';
const PECTIN = 'f0000000-0000-4000-8000-000000000003';
const ACID = 'f0000000-0000-4000-8000-000000000004';

const ingredientPoints: IngredientPricePoint[] = [
  // Fruit 180 p/kg (10 kg tray at 1,800 p); sugar 90 p/kg (25 kg sack at 2,250 p), after 100 p/kg earlier;
  // pectin 2,400 p/kg (1 kg tub); citric acid 200 p/kg (25 kg at 5,000 p).
  { ingredientId: FRUIT, validFrom: '2026-01-01', packPriceMinor: 1800, packSizeG: 10_000, supplier: 'Orchard co-op' },
  { ingredientId: SUGAR_ID, validFrom: '2025-06-01', packPriceMinor: 2500, packSizeG: 25_000, supplier: null },
  { ingredientId: SUGAR_ID, validFrom: '2026-01-01', packPriceMinor: 2250, packSizeG: 25_000, supplier: 'Mill' },
  { ingredientId: PECTIN, validFrom: '2026-01-01', packPriceMinor: 2400, packSizeG: 1000, supplier: null },
  { ingredientId: ACID, validFrom: '2026-01-01', packPriceMinor: 5000, packSizeG: 25_000, supplier: null },
];
const packagingPoints: PackagingPricePoint[] = [
  { packagingItemId: 'jar', validFrom: '2026-01-01', unitPriceMinor: 30, supplier: null },
  { packagingItemId: 'lid', validFrom: '2026-01-01', unitPriceMinor: 8, supplier: null },
  { packagingItemId: 'label', validFrom: '2026-01-01', unitPriceMinor: 3, supplier: null },
  { packagingItemId: 'case', validFrom: '2026-01-01', unitPriceMinor: 60, supplier: null },
];
const JAR_340: PackFormatData = {
  id: 'pf1',
  name: '340 g round jar',
  netFillG: 340,
  items: [
    { packagingItemId: 'jar', name: 'Jar 340 g', perJar: 1 },
    { packagingItemId: 'lid', name: 'Lid', perJar: 1 },
    { packagingItemId: 'label', name: 'Label', perJar: 1 },
    { packagingItemId: 'case', name: 'Case of 12', perJar: 1 / 12 },
  ],
};

function settings(targetSolidsPct: number, jarNetFillG = 340): FormulaSettingsInput {
  return { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-01-15', targetSolidsPct, jarNetFillG };
}

const LINES = [
  { ingredientId: FRUIT, ingredient: fruit(10), quantity: 10_000, unit: 'g' as const, refusePct: 0 },
  { ingredientId: SUGAR_ID, ingredient: SUGAR, quantity: 10_000, unit: 'g' as const, refusePct: 0 },
  { ingredientId: PECTIN, ingredient: HM_PECTIN_200, quantity: 60, unit: 'g' as const, refusePct: 0 },
  { ingredientId: ACID, ingredient: CITRIC, quantity: 55, unit: 'g' as const, refusePct: 0 },
];

const prices = {
  asOf: '2026-06-01',
  packFormat: JAR_340,
  overfillPct: 2,
  ingredientPrices: historiesBy(ingredientPoints, (p) => p.ingredientId),
  packagingPrices: historiesBy(packagingPoints, (p) => p.packagingItemId),
};

function cost(target: number, extra: Partial<typeof prices> = {}, lines = LINES) {
  const outcome = costStoredFormula(settings(target), lines, { ...prices, ...extra });
  if (!outcome.ok) throw new Error(outcome.message);
  return outcome.cost;
}

describe('cost of the Practical Action batch', () => {
  it('raw materials per batch', () => {
    // fruit 10 kg × 180 p = 1,800 p; sugar 10 kg × 90 p = 900 p; pectin 60 g × 2.4 p/g = 144 p;
    // citric acid 55 g × 0.2 p/g = 11 p → 1,800 + 900 + 144 + 11 = 2,855 p.
    const c = cost(68);
    expect(c.ingredients.map((l) => l.batchMinor)).toEqual([1800, 900, 144, 11].map((v) => expect.closeTo(v, 9)));
    expect(c.batch).toEqual({ minor: expect.closeTo(2855, 9), complete: true });
    expect(c.complete).toBe(true);
    expect(c.missing).toEqual([]);
  });

  it('per kg of finished product at 68 % and at 65 % soluble solids', () => {
    // 68 %: finished mass = 11,115 g ÷ 0.68 = 16,345.588 g (16.35 kg, as the brief);
    //        per kg = 2,855 p ÷ 16.345588 kg = 174.665 p → £1.75 (174.665 rounds to 175).
    const at68 = cost(68);
    expect(at68.finishedMassG).toBeCloseTo(16_345.588, 3);
    expect(at68.perKg.minor).toBeCloseTo(174.665, 3);
    expect(roundMinor(at68.perKg.minor)).toBe(175);
    // 65 %: finished mass = 11,115 g ÷ 0.65 = 17,100 g; per kg = 2,855 p ÷ 17.1 kg = 166.959 p → 167 p.
    // More water stays in, so the same raw materials make more jam and each kg costs less.
    const at65 = cost(65);
    expect(at65.finishedMassG).toBeCloseTo(17_100, 6);
    expect(at65.perKg.minor).toBeCloseTo(166.959, 3);
    expect(roundMinor(at65.perKg.minor)).toBe(167);
  });

  it('per 340 g jar with 2 % overfill and packaging, with the share of each line', () => {
    // Filled per jar = 340 g × 1.02 = 346.8 g.
    // Raw materials per jar (68 %) = 2,855 p × 346.8 g ÷ 16,345.588 g = 60.574 p.
    // Packaging = jar 30 + lid 8 + label 3 + case 60 ÷ 12 = 5 → 46 p.
    // Per jar = 60.574 + 46 = 106.574 p → £1.07.
    const c = cost(68);
    expect(c.filledPerJarG).toBeCloseTo(346.8, 9);
    expect(c.jarsPerBatch).toBeCloseTo(16_345.588 / 346.8, 3); // 47.13 jars
    expect(c.perJar?.minor).toBeCloseTo(106.574, 3);
    expect(roundMinor(c.perJar!.minor)).toBe(107);
    // Sugar's share: 900 p × 346.8 ÷ 16,345.588 = 19.095 p of 106.574 p = 17.92 %.
    const sugar = c.ingredients[1];
    expect(sugar.perJarMinor).toBeCloseTo(19.095, 3);
    expect(sugar.sharePct).toBeCloseTo(17.917, 2);
    // Jar: 30 ÷ 106.574 = 28.15 %. Shares add up to 100 %.
    expect(c.packaging[0].sharePct).toBeCloseTo(28.149, 2);
    const shares = [...c.ingredients, ...c.packaging].reduce((t, l) => t + (l.sharePct ?? 0), 0);
    expect(shares).toBeCloseTo(100, 9);
    // At 65 %: 2,855 × 346.8 ÷ 17,100 = 57.901 p + 46 p = 103.901 p → £1.04.
    expect(roundMinor(cost(65).perJar!.minor)).toBe(104);
  });

  it('sensitivity: sugar +10 % in price → +1.91 p per jar; the largest effects first', () => {
    // 10 % of sugar's 19.095 p per jar = 1.9095 p; fruit's 10 % = 1,800 × 346.8 ÷ 16,345.588 × 0.1
    // = 3.819 p; the jar's 10 % = 3 p.
    const c = cost(68);
    const sugar = c.sensitivity.find((r) => r.name === 'Sugar');
    expect(sugar?.deltaMinor).toBeCloseTo(1.9095, 4);
    expect(c.sensitivity[0].name).toBe('Test fruit');
    expect(c.sensitivity[0].deltaMinor).toBeCloseTo(3.819, 3);
    expect(c.sensitivity[1]).toEqual({ name: 'Jar 340 g', kind: 'packaging', deltaMinor: expect.closeTo(3, 9) });
    expect(c.sensitivity[2].name).toBe('Sugar');
    expect(c.sensitivity.map((r) => r.deltaMinor)).toEqual([...c.sensitivity.map((r) => r.deltaMinor)].sort((a, b) => b - a));
  });

  it('a dearer sugar moves the batch, per kg, per jar and the sensitivity alike', () => {
    const before = cost(68);
    const dearer = historiesBy(
      [...ingredientPoints, { ingredientId: SUGAR_ID, validFrom: '2026-05-01', packPriceMinor: 2475, packSizeG: 25_000, supplier: null }],
      (p) => p.ingredientId,
    );
    const after = cost(68, { ingredientPrices: dearer });
    // Sugar 90 → 99 p/kg: +10 kg × 9 p = +90 p per batch; per jar +90 × 346.8 ÷ 16,345.588 = +1.9095 p.
    expect(after.batch.minor - before.batch.minor).toBeCloseTo(90, 9);
    expect(after.perKg.minor - before.perKg.minor).toBeCloseTo(90 / 16.345588, 4);
    expect(after.perJar!.minor - before.perJar!.minor).toBeCloseTo(1.9095, 4);
    expect(after.sensitivity.find((r) => r.name === 'Sugar')!.deltaMinor).toBeCloseTo(2.1005, 4);
  });

  it('costs as of a date: the price in force on that day', () => {
    // On 2025-12-01 sugar was 100 p/kg (2,500 p per 25 kg) and fruit had no price yet.
    const c = cost(68, { asOf: '2025-12-01' });
    expect(c.ingredients[1].batchMinor).toBeCloseTo(1000, 9);
    expect(c.ingredients[1].price).toEqual({ validFrom: '2025-06-01', supplier: null, perKgMinor: 100 });
  });

  it('refuse: trimmed fruit is bought by the mass before trimming', () => {
    // 10 kg prepared fruit with 20 % stones and peel: bought = 10,000 ÷ (1 − 0.20) = 12,500 g → 12.5 kg × 180 p = 2,250 p.
    const c = cost(68, {}, [{ ...LINES[0], refusePct: 20 }, ...LINES.slice(1)]);
    expect(c.ingredients[0].boughtG).toBeCloseTo(12_500, 9);
    expect(c.ingredients[0].batchMinor).toBeCloseTo(2250, 9);
    expect(c.batch.minor).toBeCloseTo(3305, 9);
  });
});

describe('a pack format that fills another jar than the formula', () => {
  // The walk's case: a formula for 250 g jars costed with a 340 g pack format. The cost per jar is the
  // pack format's jar (what is filled); the formula's 250 g drives the label. Both are named.
  it('is costed for the pack format’s jar and says the formula’s jar fill differs, naming both', () => {
    const outcome = costStoredFormula(settings(68, 250), LINES, prices);
    if (!outcome.ok) throw new Error(outcome.message);
    expect(outcome.cost.filledPerJarG).toBeCloseTo(346.8, 9);
    expect(outcome.cost.fillMismatch).toEqual({ packFormatNetFillG: 340, formulaJarFillG: 250 });
    const text = fillMismatchText(outcome.cost.fillMismatch!);
    expect(text).toContain('fills 340 g jars');
    expect(text).toContain('jar net fill is 250 g');
  });

  it('says nothing when the pack format fills the formula’s own jar, or there is no pack format', () => {
    expect(cost(68).fillMismatch).toBeNull();
    const unpacked = costStoredFormula(settings(68, 250), LINES, { ...prices, packFormat: null });
    expect(unpacked.ok && unpacked.cost.fillMismatch).toBeNull();
  });
});

describe('unknown prices', () => {
  const base: CostingInput = {
    ...prices,
    lines: [
      { ingredientId: FRUIT, name: 'Test fruit', grams: 10_000, refusePct: 0 },
      { ingredientId: 'no-price', name: 'Vanilla', grams: 5, refusePct: 0 },
    ],
    chargeG: 10_005,
    finishedMassG: 5000,
    packFormat: { ...JAR_340, items: [...JAR_340.items, { packagingItemId: 'sleeve', name: 'Gift sleeve', perJar: 1 }] },
  };

  it('leave the line unknown, the total incomplete, and name what is missing — never a zero', () => {
    const c = costFormula(base);
    expect(c.complete).toBe(false);
    expect(c.missing).toEqual(['Vanilla', 'Gift sleeve']);
    const vanilla = c.ingredients[1];
    expect(vanilla.price).toBeNull();
    expect(vanilla.batchMinor).toBeNull();
    expect(vanilla.perJarMinor).toBeNull();
    expect(vanilla.sharePct).toBeNull();
    expect(c.batch.complete).toBe(false);
    expect(c.perKg.complete).toBe(false);
    expect(c.perJar?.complete).toBe(false);
    // The known part: fruit 1,800 p per batch.
    expect(c.batch.minor).toBeCloseTo(1800, 9);
    expect(c.sensitivity.some((r) => r.name === 'Vanilla' || r.name === 'Gift sleeve')).toBe(false);
  });

  it('a price dated after the costing day is not known on that day', () => {
    const c = costFormula({ ...base, asOf: '2025-12-31' });
    expect(c.missing).toContain('Test fruit');
    expect(c.missing).toContain('Jar 340 g');
  });

  it('without a pack format there is no cost per jar; shares are of the cost per kg', () => {
    const c = costFormula({ ...base, lines: [base.lines[0]], packFormat: null });
    expect(c.perJar).toBeNull();
    expect(c.filledPerJarG).toBeNull();
    expect(c.ingredients[0].sharePct).toBeCloseTo(100, 9);
    expect(c.complete).toBe(true);
  });

  it('refuses impossible inputs instead of costing them', () => {
    expect(() => costFormula({ ...base, finishedMassG: 0 })).toThrow(/finishedMassG/);
    expect(() => costFormula({ ...base, overfillPct: -1 })).toThrow(/overfillPct/);
    expect(() => costFormula({ ...base, lines: [{ ...base.lines[0], refusePct: 100 }] })).toThrow(/refusePct/);
    expect(() => costFormula({ ...base, lines: [{ ...base.lines[0], grams: Number.NaN }] })).toThrow(/grams/);
  });
});

describe('a batch record: actual cost per good jar', () => {
  it('scales raw materials to the kettle charge and spreads the filled jars’ packaging over the good ones', () => {
    const c = cost(68);
    // Charge of the formula = 20,115 g. A 40,230 g charge (2×) costs 2 × 2,855 = 5,710 p of raw materials.
    // 95 jars filled × 46 p = 4,370 p of packaging; 94 passed → (5,710 + 4,370) ÷ 94 = 107.234 p per jar.
    expect(c.chargeG).toBeCloseTo(20_115, 9);
    const actual = batchActualCostPerJar(c, { chargeG: 40_230, jarsFilled: 95, jarsRejected: 1 });
    expect(actual?.minor).toBeCloseTo(107.234, 3);
    expect(actual?.complete).toBe(true);
    expect(batchActualCostPerJar(c, { chargeG: 40_230, jarsFilled: 3, jarsRejected: 3 })).toBeNull();
  });
});
