import { describe, it, expect } from 'vitest';
import { ChemistryInputError, computeMassBalance, resolveLines } from '@/lib/chemistry';
import { PRACTICAL_ACTION_LINES, SUGAR, fruit, settings } from './fixtures';

describe('mass balance: Practical Action worked batch', () => {
  const mb = computeMassBalance(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 68 }));

  it('sums the soluble solids in to 11.115 kg', () => {
    // Source: Practical Action technical brief "Jams, jellies and marmalade" (10 kg fruit at 10 % + 10 kg sugar + 0.06 kg pectin + 0.055 kg citric acid = 11.115 kg solids)
    expect(mb.solubleSolidsInG).toBeCloseTo(11115, 6);
  });

  it('gives 16.35 kg of jam at 68 % solids', () => {
    // Source: Practical Action technical brief "Jams, jellies and marmalade" (at 68 % → 16.35 kg of jam)
    expect(mb.finishedMassG / 1000).toBeCloseTo(16.35, 2);
  });

  it('evaporates total charge minus finished mass', () => {
    // Source: Practical Action technical brief "Jams, jellies and marmalade" (charge 20.115 kg − 16.35 kg jam)
    expect(mb.totalChargeG).toBeCloseTo(20115, 6);
    expect(mb.waterToEvaporateG).toBeCloseTo(20115 - 11115 / 0.68, 6);
    expect(mb.waterToEvaporateG / 1000).toBeCloseTo(3.77, 2);
  });

  it('puts the pectin at about 0.37 % of the jam', () => {
    // Source: Practical Action technical brief "Jams, jellies and marmalade" (60 g grade-200 pectin, about 0.37 %)
    expect(mb.pectinPctOfFinished).toBeCloseTo(0.37, 2);
  });

  it('reports fruit per 1000 g, jars and the 55-part ratio from the same batch', () => {
    // Derived from the Practical Action technical brief "Jams, jellies and marmalade" batch: 10 kg fruit in 16.346 kg jam.
    expect(mb.fruitPer1000gFinishedG).toBeCloseTo((10000 / (11115 / 0.68)) * 1000, 6);
    // 16.346 kg ÷ 340 g jars = 48.07 → 48 whole jars.
    expect(mb.jarsFilled).toBe(48);
    // Equal weights of fruit and sucrose are 55 parts fruit per 55 parts sweetener.
    expect(mb.fruitPartsPer55SweetenerParts).toBeCloseTo(55, 9);
    expect(mb.fruitToSweetenerRatio).toBeCloseTo(1, 9);
  });
});

describe('mass balance: lines and sweetener solids', () => {
  it('resolves pct_fruit lines against the total fruit mass', () => {
    const lines = resolveLines([
      { ingredient: fruit(9), quantity: 600, unit: 'g' },
      { ingredient: fruit(12), quantity: 400, unit: 'g' },
      { ingredient: SUGAR, quantity: 80, unit: 'pct_fruit' },
    ]);
    expect(lines[2].massG).toBeCloseTo(800, 9);
  });

  it('counts a syrup as its solids on the sweetener side of the 55-part ratio', () => {
    // 21 CFR 150.160 ratio phrasing; 450 g fruit to 550 g of a 50 % syrup is 45 parts fruit to 27.5 parts of sweetener solids.
    const mb = computeMassBalance([
      { ingredient: fruit(10), quantity: 450, unit: 'g' },
      { ingredient: { kind: 'sweetener', name: 'Syrup 50 %', solidsPct: 50, sweetenerType: 'other' }, quantity: 550, unit: 'g' },
    ], settings({ targetSolidsPct: 65 }));
    expect(mb.sweetenerSolidsG).toBeCloseTo(275, 9);
    expect(mb.fruitPartsPer55SweetenerParts).toBeCloseTo((450 / 275) * 55, 9);
  });
});

describe('mass balance: bad input', () => {
  function fieldOf(run: () => unknown): string | undefined {
    try {
      run();
    } catch (error) {
      if (error instanceof ChemistryInputError) return error.field;
      throw error;
    }
    return undefined;
  }

  it('rejects a negative mass with the line path', () => {
    expect(() => computeMassBalance([{ ingredient: SUGAR, quantity: -1, unit: 'g' }], settings())).toThrow(ChemistryInputError);
    expect(fieldOf(() => computeMassBalance([{ ingredient: SUGAR, quantity: -1, unit: 'g' }], settings()))).toBe('lines[0].quantity');
  });

  it('rejects zero, negative and ≥ 100 % target solids', () => {
    for (const target of [0, -5, 100, 120]) {
      expect(fieldOf(() => computeMassBalance([{ ingredient: SUGAR, quantity: 1, unit: 'kg' }], settings({ targetSolidsPct: target })))).toBe('settings.targetSolidsPct');
    }
  });

  it('rejects an empty formula', () => {
    expect(fieldOf(() => computeMassBalance([], settings()))).toBe('lines');
  });

  it('rejects solids above 100 %, a bad unit and pct_fruit without fruit', () => {
    expect(fieldOf(() => computeMassBalance([{ ingredient: fruit(120), quantity: 1, unit: 'kg' }], settings()))).toBe('lines[0].ingredient.solidsPct');
    expect(fieldOf(() => computeMassBalance([{ ingredient: SUGAR, quantity: 1, unit: 'stone' as never }], settings()))).toBe('lines[0].unit');
    expect(fieldOf(() => computeMassBalance([{ ingredient: SUGAR, quantity: 50, unit: 'pct_fruit' }], settings()))).toBe('lines[0].unit');
  });

  it('rejects a bad rule date and a zero jar fill', () => {
    expect(fieldOf(() => computeMassBalance([{ ingredient: SUGAR, quantity: 1, unit: 'kg' }], settings({ ruleDate: 'soon' })))).toBe('settings.ruleDate');
    expect(fieldOf(() => computeMassBalance([{ ingredient: SUGAR, quantity: 1, unit: 'kg' }], settings({ jarNetFillG: 0 })))).toBe('settings.jarNetFillG');
  });

  it('gives a clear message', () => {
    expect(() => computeMassBalance([{ ingredient: SUGAR, quantity: -1, unit: 'g' }], settings())).toThrow(/cannot be negative/);
  });
});
