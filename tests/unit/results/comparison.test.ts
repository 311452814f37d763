import { describe, it, expect } from 'vitest';
import { compareVariants, describeAliasing } from '@/lib/results/comparison';

const variants = [
  { label: 'A', factorLevels: { sugar_ratio: 0.8, acid_dose: 3 }, lab: { ph: 3.4, brix20: 64, yieldRatio: 1.0 } },
  { label: 'B', factorLevels: { sugar_ratio: 1.0, acid_dose: 3 }, lab: { ph: 3.3, brix20: 65, yieldRatio: 1.0 } },
  { label: 'C', factorLevels: { sugar_ratio: 0.8, acid_dose: 7 }, lab: { ph: 3.1, brix20: 66, yieldRatio: 1.0 } },
  { label: 'D', factorLevels: { sugar_ratio: 1.0, acid_dose: 7 }, lab: { ph: 3.0, brix20: 67, yieldRatio: 1.0 } },
];
const means = [5, 7, 6, 9].map((mean, i) => ({ attribute: 'Overall liking', label: 'ABCD'[i], mean }));

describe('comparing variants', () => {
  it('estimates main effects over the range from the variant means', () => {
    // Hand computation for a 2² design (Montgomery, ch. 6: effect = mean at high − mean at low):
    // sugar (7 + 9)/2 − (5 + 6)/2 = 2.5; acid (6 + 9)/2 − (5 + 7)/2 = 1.5.
    const { effects } = compareVariants(variants, means);
    const byFactor = Object.fromEntries(effects[0].result.effects.map((e) => [e.factor, e.effectOverRange]));
    expect(byFactor.sugar_ratio).toBeCloseTo(2.5, 10);
    expect(byFactor.acid_dose).toBeCloseTo(1.5, 10);
  });

  it('correlates lab values with the sensory means across variants', () => {
    // Brix 64…67 against liking 5, 7, 6, 9: r computed by hand = 0.8315 (Σxy deviations 5.5 over √(5 · 8.75)).
    const { correlations } = compareVariants(variants, means);
    const brix = correlations.find((c) => c.measure === 'brix20')!;
    expect(brix.result.r).toBeCloseTo(5.5 / Math.sqrt(5 * 8.75), 10);
    // A constant measure (yield) has no correlation to report, and nothing is NaN.
    expect(JSON.stringify(correlations)).not.toContain('NaN');
  });
});

describe('factors that changed together', () => {
  it('credits neither factor and says so in one sentence (the base against a variant that changed both)', () => {
    // Hand-worked: the base (sugar ratio 0.78, pectin 6.0 g/kg) and variant B (0.65, 5.0) differ in both
    // factors at once; two runs cannot split a difference of 3.17 between two factors.
    const twoRuns = [
      { label: 'Base', factorLevels: { sugar_ratio: 0.78, pectin_dose: 6.0 }, lab: { ph: null, brix20: null, yieldRatio: null } },
      { label: 'B', factorLevels: { sugar_ratio: 0.65, pectin_dose: 5.0 }, lab: { ph: null, brix20: null, yieldRatio: null } },
    ];
    const { effects } = compareVariants(twoRuns, [
      { attribute: 'Overall liking', label: 'Base', mean: 4.5 },
      { attribute: 'Overall liking', label: 'B', mean: 7.67 },
    ]);
    const result = effects[0].result;
    expect(result.effects.map((e) => e.effectOverRange)).toEqual([null, null]);
    expect(result.aliasGroups).toEqual([['sugar_ratio', 'pectin_dose']]);
    const names: Record<string, string> = { sugar_ratio: 'Sugar ratio', pectin_dose: 'Pectin dose' };
    expect(describeAliasing(result.aliasGroups, (f) => names[f])).toEqual([
      'Sugar ratio and pectin dose changed together in the variants tasted, so their effects cannot be separated: taste a variant that changes one of them alone to tell them apart.',
    ]);
  });
});
