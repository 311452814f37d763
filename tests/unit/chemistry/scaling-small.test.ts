import { describe, expect, it } from 'vitest';
import { FINEST_STEP_G, ROUNDING_SHARE_LIMIT, lineStepG, scaleFormula, type FormulaLineInput } from '@/lib/chemistry';
import { CITRIC, HM_PECTIN_200, PRACTICAL_ACTION_LINES, SUGAR, fruit, settings } from './fixtures';

// The walk's small batch: a 1.86 kg strawberry jam with 0.8 g of citric acid and 8 g of pectin,
// put on a 5 g kitchen scale. Hand-worked against the rule in lib/chemistry/scaling.ts (the 2 %
// share and the 0.01 g finest step are common practice, no published source).
const SMALL_BATCH: FormulaLineInput[] = [
  { ingredient: fruit(10), quantity: 1000, unit: 'g' },
  { ingredient: SUGAR, quantity: 850, unit: 'g' },
  { ingredient: HM_PECTIN_200, quantity: 8, unit: 'g' },
  { ingredient: CITRIC, quantity: 0.8, unit: 'g' },
];

describe('small additions on the batch sheet', () => {
  const scaled = scaleFormula(SMALL_BATCH, settings(), { kind: 'total_charge', mass: 1858.8, unit: 'g' }, { step: 5, unit: 'g' });

  it('never rounds a line with any mass to 0 g', () => {
    for (const line of scaled.lines) expect(line.roundedG).toBeGreaterThan(0);
  });

  it('weighs the acid and the pectin on a finer step, and says so per line', () => {
    const [fruitLine, sugar, pectin, acid] = scaled.lines;
    // 0.8 g: half of 1 g is 62 %, half of 0.1 g 6.25 %, half of 0.01 g 0.6 % → 0.01 g.
    expect(acid.stepG).toBeCloseTo(0.01, 12);
    expect(acid.finerStep).toBe(true);
    expect(acid.roundedG).toBeCloseTo(0.8, 9);
    // 8 g: half of 1 g is 6.25 %, half of 0.1 g 0.6 % → 0.1 g; no more +25 %.
    expect(pectin.stepG).toBeCloseTo(0.1, 12);
    expect(pectin.roundedG).toBeCloseTo(8, 9);
    // 1000 g and 850 g: half of 5 g is 0.25 % and 0.29 % → the scale's own step.
    expect(fruitLine.stepG).toBe(5);
    expect(fruitLine.finerStep).toBe(false);
    expect(sugar.stepG).toBe(5);
    for (const line of scaled.lines) expect(Math.abs(line.roundingErrorG)).toBeLessThanOrEqual(ROUNDING_SHARE_LIMIT * line.exactG + 1e-9);
    expect(scaled.effectOfRounding.noticeableLines).toEqual([]);
  });

  it('keeps the step in the scale’s unit: 0.05 lb goes to 0.01 lb, then 0.001 lb', () => {
    expect(lineStepG(2000, 0.05 * 453.59237, 'lb')).toBeCloseTo(0.05 * 453.59237, 9);
    expect(lineStepG(500, 0.05 * 453.59237, 'lb')).toBeCloseTo(0.01 * 453.59237, 9);
    expect(lineStepG(100, 0.05 * 453.59237, 'lb')).toBeCloseTo(0.001 * 453.59237, 9);
  });

  it('goes no finer than 0.01 g, and names a line that rounding still moves noticeably', () => {
    const tiny: FormulaLineInput[] = [...SMALL_BATCH.slice(0, 3), { ingredient: CITRIC, quantity: 0.013, unit: 'g' }];
    const s = scaleFormula(tiny, settings(), { kind: 'total_charge', mass: 1858.013, unit: 'g' }, { step: 5, unit: 'g' });
    const acid = s.lines[3];
    expect(acid.stepG).toBeCloseTo(FINEST_STEP_G, 12);
    expect(acid.roundedG).toBeCloseTo(0.01, 12);
    // 0.01 g against 0.013 g exact: −23 %.
    expect(s.effectOfRounding.noticeableLines).toHaveLength(1);
    expect(s.effectOfRounding.noticeableLines[0].name).toBe('Citric acid');
    expect(s.effectOfRounding.noticeableLines[0].roundingErrorPct).toBeCloseTo(-23.08, 1);
  });

  it('a line below half the finest step takes one step instead of nothing', () => {
    const tiny: FormulaLineInput[] = [...SMALL_BATCH.slice(0, 3), { ingredient: CITRIC, quantity: 0.003, unit: 'g' }];
    const s = scaleFormula(tiny, settings(), { kind: 'total_charge', mass: 1858.003, unit: 'g' }, { step: 5, unit: 'g' });
    expect(s.lines[3].roundedG).toBeCloseTo(0.01, 12);
  });
});

describe('scaling to a number of jars', () => {
  it('the rounded batch fills every jar asked for', () => {
    // Without rounding up, 24 × 340 g on a 5 g scale finished at 8.157 kg: 23 jars.
    for (const jars of [1, 7, 24, 200, 241]) {
      for (const step of [1, 5, 10, 50]) {
        const s = scaleFormula(PRACTICAL_ACTION_LINES, settings({ jarNetFillG: 340 }), { kind: 'jar_count', jars }, { step, unit: 'g' });
        expect(s.rounded.jarsFilled, `${jars} jars on a ${step} g scale`).toBeGreaterThanOrEqual(jars);
        expect(s.rounded.finishedMassG).toBeGreaterThanOrEqual(jars * 340 - 1e-6);
        // Each line stays within one of its steps of the exact weight.
        for (const l of s.lines) expect(Math.abs(l.roundingErrorG)).toBeLessThanOrEqual(l.stepG + 1e-9);
      }
    }
  });

  it('rounds up the sugar before anything else when the batch falls short', () => {
    const s = scaleFormula(PRACTICAL_ACTION_LINES, settings({ jarNetFillG: 340 }), { kind: 'jar_count', jars: 24 }, { step: 5, unit: 'g' });
    // 24 × 340 g at 68 % → 5548.8 g of solids: sugar 4993.0 g exact → 4995 g.
    expect(s.lines[1].roundedG).toBeGreaterThanOrEqual(s.lines[1].exactG);
    expect(s.rounded.jarsFilled).toBe(24);
  });
});
