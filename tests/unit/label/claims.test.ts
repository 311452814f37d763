import { describe, expect, it } from 'vitest';
import {
  TYPICAL_JAM_REFERENCE, checkLowSugars, checkNoAddedSugars, checkReducedSugars, checkSugarsFree, referenceFromNutrients, sugarClaimChecks,
} from '@/lib/label/claims';
import type { FinishedNutrients, NutrientKey } from '@/lib/label/types';
import { LABEL, STRAWBERRY, SUCROSE, labelData, labelInputFrom, labelSettings, nutrients } from './text-fixtures';

function finished(sugarsG: number | null, unknownFrom: Partial<Record<NutrientKey, string[]>> = {}): FinishedNutrients {
  return { ...nutrients({ sugarsG }), unknownFrom };
}

describe('low sugars', () => {
  it('is met at 5 g per 100 g and not met just above', () => {
    // Source: Regulation (EC) No 1924/2006 Annex, LOW SUGARS: "no more than 5 g of sugars per 100 g for solids"
    expect(checkLowSugars(finished(5)).status).toBe('met');
    expect(checkLowSugars(finished(5.01)).status).toBe('not_met');
    expect(checkLowSugars(finished(5)).figures).toEqual([
      { label: 'Sugars', value: 5, unit: 'g per 100 g' }, { label: 'Limit', value: 5, unit: 'g per 100 g' },
    ]);
  });

  it('cannot tell when a missing sugar value could push the figure over', () => {
    // Source: issue 15 ("a value the table lacks stays empty and is shown as unknown, never as zero"); the limit as above
    expect(checkLowSugars(finished(4.9, { sugarsG: ['pectin'] })).status).toBe('cannot_tell');
    expect(checkLowSugars(finished(5.2, { sugarsG: ['pectin'] })).status).toBe('not_met');
    expect(checkLowSugars(finished(null)).status).toBe('cannot_tell');
  });
});

describe('sugars-free', () => {
  it('is met at 0.5 g per 100 g and not met just above', () => {
    // Source: Regulation (EC) No 1924/2006 Annex, SUGARS-FREE: "no more than 0,5 g of sugars per 100 g"
    expect(checkSugarsFree(finished(0.5)).status).toBe('met');
    expect(checkSugarsFree(finished(0.51)).status).toBe('not_met');
  });
});

describe('with no added sugars', () => {
  it('is not met when sugar is weighed in', () => {
    // Source: Regulation (EC) No 1924/2006 Annex, WITH NO ADDED SUGARS: no added mono- or disaccharides or other food used for its sweetening properties
    const input = labelInputFrom([
      { composition: STRAWBERRY, label: LABEL.strawberry, grams: 1000 },
      { composition: SUCROSE, label: LABEL.sugar, grams: 600 },
    ]);
    const check = checkNoAddedSugars(input, finished(40));
    expect(check.status).toBe('not_met');
    expect(check.figures[0]).toEqual({ label: 'Sugars and sweetening foods added', value: 600, unit: 'g in the batch' });
  });

  it('is met with fruit and a sweetening additive, and then needs "contains naturally occurring sugars"', () => {
    // Source: Regulation (EC) No 1924/2006 Annex, WITH NO ADDED SUGARS: "If sugars are naturally present ... 'CONTAINS NATURALLY OCCURRING SUGARS'"
    const steviol = labelData('sweetener', { kind: 'sweetener', additive: { eNumber: 'E960', className: 'sweetener' } });
    const input = labelInputFrom([
      { composition: STRAWBERRY, label: LABEL.strawberry, grams: 1000 },
      { composition: { kind: 'sweetener', name: 'Steviol glycosides', solidsPct: 100, sweetenerType: 'other' }, label: steviol, grams: 1 },
    ], labelSettings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 12 }));
    const check = checkNoAddedSugars(input, finished(7.2));
    expect(check.status).toBe('met');
    expect(check.accompanyingStatement).toBe('Contains naturally occurring sugars');
  });
});

describe('reduced sugars', () => {
  const subject = (sugarsG: number, energyKj: number | null, unknown: string[] = []) => ({
    nutrients: finished(sugarsG, unknown.length ? { sugarsG: unknown } : {}),
    energyKj,
  });

  it('is met at exactly 30 % less than the typical jam, with energy no higher', () => {
    // Source: Regulation (EC) No 1924/2006 Annex, REDUCED [NUTRIENT] (at least 30 %); Regulation (EU) No 1047/2012 (energy ≤ the similar product's);
    // reference: USDA SR28 NDB 19297 sugars 48.50 g, EU energy 1169.60 kJ (docs/nutrition-check-values.md (c)). 48.5 × 0.7 = 33.95.
    const check = checkReducedSugars(subject(33.95, 900), TYPICAL_JAM_REFERENCE);
    expect(check.status).toBe('met');
    expect(check.figures.find((f) => f.label === 'Reduction')?.value).toBeCloseTo(30, 9);
  });

  it('is not met at 29.9 % less', () => {
    // Source: as above; 34.0 g is (48.5 − 34) / 48.5 = 29.9 % less
    const check = checkReducedSugars(subject(34, 900), TYPICAL_JAM_REFERENCE);
    expect(check.status).toBe('not_met');
    expect(check.note).toMatch(/29\.9 % lower/);
  });

  it('says “higher”, and that the claim does not apply, when the sugar is above the reference’s', () => {
    // Source: Regulation (EC) No 1924/2006 Annex, REDUCED [NUTRIENT]; (62.225 − 48.5) / 48.5 = 28.3 % more sugar than the reference.
    const check = checkReducedSugars(subject(62.225, 900), TYPICAL_JAM_REFERENCE);
    expect(check.status).toBe('not_met');
    expect(check.note).toMatch(/^Sugar is 28\.3 % higher than in .+, not lower: the claim does not apply\.$/);
    expect(check.note).not.toMatch(/-|−/);
    expect(check.figures.find((f) => f.label === 'Increase')?.value).toBeCloseTo(28.299, 3);
    expect(check.figures.find((f) => f.label === 'Reduction')).toBeUndefined();
  });

  it('is not met when the energy is higher than the reference, however low the sugar', () => {
    // Source: Regulation (EU) No 1047/2012, amending the Annex of 1924/2006: "reduced sugars" only if energy ≤ the similar product's
    expect(checkReducedSugars(subject(20, 1169.6), TYPICAL_JAM_REFERENCE).status).toBe('met');
    expect(checkReducedSugars(subject(20, 1170), TYPICAL_JAM_REFERENCE).status).toBe('not_met');
    expect(checkReducedSugars(subject(20, null), TYPICAL_JAM_REFERENCE).status).toBe('cannot_tell');
  });

  it('cannot tell when our sugar figure is incomplete and seems low enough', () => {
    // Source: issue 15 (unknown is never zero); the thresholds as above
    expect(checkReducedSugars(subject(30, 900, ['pectin']), TYPICAL_JAM_REFERENCE).status).toBe('cannot_tell');
    expect(checkReducedSugars(subject(40, 900, ['pectin']), TYPICAL_JAM_REFERENCE).status).toBe('not_met');
  });

  it('compares with another formula chosen by the user', () => {
    // Source: Regulation (EC) No 1924/2006 Art. 9 (comparison with a similar product, named by the user); thresholds as above
    const other = referenceFromNutrients('Strawberry jam, house recipe', finished(60, { sugarsG: ['glaze'] }), 1150, 'Formula in this workspace');
    expect(other.sugarsIncomplete).toBe(true);
    expect(checkReducedSugars(subject(40, 900), other).status).toBe('met');
    // 25 % less than a lower bound: the true reduction could reach 30 %.
    expect(checkReducedSugars(subject(45, 900), other).status).toBe('cannot_tell');
    expect(checkReducedSugars(subject(45, 900), null).status).toBe('cannot_tell');
  });

  it('returns all four checks in one call', () => {
    const input = labelInputFrom([
      { composition: STRAWBERRY, label: LABEL.strawberry, grams: 1000 },
      { composition: SUCROSE, label: LABEL.sugar, grams: 300 },
    ], labelSettings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 35 }));
    const checks = sugarClaimChecks(input, subject(33, 600), TYPICAL_JAM_REFERENCE);
    expect(checks.map((c) => [c.claim, c.status])).toEqual([
      ['low_sugars', 'not_met'], ['sugars_free', 'not_met'], ['no_added_sugars', 'not_met'], ['reduced_sugars', 'met'],
    ]);
  });
});
