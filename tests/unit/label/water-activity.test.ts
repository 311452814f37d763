import { describe, expect, it } from 'vitest';
import { computeMassBalance, estimateBatchWaterActivity } from '@/lib/chemistry';
import { sugarProfileOf, waterActivityFromLabelLines } from '@/lib/label/water-activity';
import { LABEL, STRAWBERRY, SUCROSE, labelData, labelSettings, nutrients } from './text-fixtures';

// Source: USDA SR28 NDB 09316 strawberries (sucrose 0.47, glucose 1.99, fructose 2.44 g/100 g) and 19335 granulated
// sugar (sucrose 99.80), per docs/nutrition-check-values.md "Individual sugars".
const strawberry = labelData('strawberries', { kind: 'fruit', nutrients: nutrients({ sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 }) });
const sugar = labelData('sugar', { kind: 'sweetener', nutrients: nutrients({ sucroseG: 99.8, glucoseG: 0, fructoseG: 0 }) });

describe('water activity from the label data', () => {
  const mb = computeMassBalance([
    { ingredient: STRAWBERRY, quantity: 1000, unit: 'g' },
    { ingredient: SUCROSE, quantity: 1000, unit: 'g' },
  ], labelSettings({ targetSolidsPct: 68 }));

  it('reads each line\'s sugars and applies the stated inversion', () => {
    // Source: Norrish/Ross as in lib/chemistry/water-activity.ts; 68 °Brix, a quarter of the sucrose inverted → 0.831 (tests/unit/chemistry/water-activity-sugars.test.ts)
    const estimate = waterActivityFromLabelLines(mb.lines, [{ grams: 1000, ingredient: strawberry }, { grams: 1000, ingredient: sugar }], mb.finishedMassG, { sucroseInversionFraction: 0.25 });
    expect(estimate.aw).toBeCloseTo(0.831, 3);
    expect(estimate.linesFromProfile).toEqual([0, 1]);
  });

  it('falls back to the kind-based model where a sugar is unknown', () => {
    // Source: issue 15 (a value the table lacks stays unknown, never zero)
    expect(sugarProfileOf(LABEL.strawberry)).toBeNull();
    const estimate = waterActivityFromLabelLines(mb.lines, [{ grams: 1000, ingredient: LABEL.strawberry }, { grams: 1000, ingredient: LABEL.sugar }], mb.finishedMassG);
    expect(estimate.linesFromKind).toEqual([0, 1]);
    expect(estimate.aw).toBeCloseTo(estimateBatchWaterActivity(mb.lines, mb.finishedMassG).aw, 12);
  });

  it('refuses label lines that do not match the formula lines', () => {
    expect(() => waterActivityFromLabelLines(mb.lines, [{ grams: 1000, ingredient: strawberry }], mb.finishedMassG)).toThrow(/one for one/);
  });
});
