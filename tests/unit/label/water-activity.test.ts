import { describe, expect, it } from 'vitest';
import { computeBatch, computeMassBalance, estimateBatchWaterActivity } from '@/lib/chemistry';
import { fullSugarProfile } from '@/lib/label/water-activity';
import { LABEL, STRAWBERRY, SUCROSE, labelSettings } from './text-fixtures';

// Source: USDA SR28 NDB 09316 strawberries (sucrose 0.47, glucose 1.99, fructose 2.44 g/100 g) and 19335 granulated
// sugar (sucrose 99.80), per docs/nutrition-check-values.md "Individual sugars". The library keeps an
// ingredient's sugars on its composition (lib/ingredients/queries.ts, fullSugarProfile), where computeBatch reads them.
const strawberry = { ...STRAWBERRY, sugars: { sucroseG: 0.47, glucoseG: 1.99, fructoseG: 2.44 } };
const sugar = { ...SUCROSE, sugars: { sucroseG: 99.8, glucoseG: 0, fructoseG: 0 } };

describe('water activity from the ingredients\' sugars', () => {
  const lines = (fruit: typeof STRAWBERRY, sweetener: typeof SUCROSE) => [
    { ingredient: fruit, quantity: 1000, unit: 'g' as const },
    { ingredient: sweetener, quantity: 1000, unit: 'g' as const },
  ];

  it('reads each line\'s sugars and applies the stated inversion', () => {
    // Source: Norrish/Ross as in lib/chemistry/water-activity.ts; 68 °Brix, a quarter of the sucrose inverted → 0.831 (tests/unit/chemistry/water-activity-sugars.test.ts)
    const estimate = computeBatch(lines(strawberry, sugar), labelSettings({ targetSolidsPct: 68, sucroseInversionPct: 25 })).waterActivity;
    expect(estimate.aw).toBeCloseTo(0.831, 3);
    expect(estimate.model).toMatch(/sugars from the ingredients' profiles; 25 % of the sucrose taken as inverted$/);
  });

  it('falls back to the kind-based model where a sugar is unknown', () => {
    // Source: issue 15 (a value the table lacks stays unknown, never zero)
    expect(fullSugarProfile(LABEL.strawberry.nutrients)).toBeNull();
    const settings = labelSettings({ targetSolidsPct: 68 });
    const estimate = computeBatch(lines(STRAWBERRY, SUCROSE), settings).waterActivity;
    const mb = computeMassBalance(lines(STRAWBERRY, SUCROSE), settings);
    expect(estimate.aw).toBeCloseTo(estimateBatchWaterActivity(mb.lines, mb.finishedMassG).aw, 12);
    expect(estimate.model).toMatch(/sugars modelled from the ingredient kinds \(no sugar profiles\)$/);
  });
});
