import { describe, it, expect } from 'vitest';
import { ChemistryInputError, GRAMS_PER_POUND, scaleFormula } from '@/lib/chemistry';
import { PRACTICAL_ACTION_LINES, settings } from './fixtures';

describe('scaling a formula', () => {
  it('scales the Practical Action batch to a 5 kg finished batch', () => {
    // Source: Practical Action technical brief "Jams, jellies and marmalade" (20.115 kg charge → 16.35 kg jam at 68 %)
    const scaled = scaleFormula(PRACTICAL_ACTION_LINES, settings(), { kind: 'finished_mass', mass: 5, unit: 'kg' }, { step: 1, unit: 'g' });
    expect(scaled.scaleFactor).toBeCloseTo(5000 / (11115 / 0.68), 9);
    expect(scaled.exact.finishedMassG).toBeCloseTo(5000, 6);
    // 10 kg of fruit × 0.30589 = 3058.9 g → 3059 g on a 1 g scale.
    expect(scaled.lines[0].roundedG).toBe(3059);
  });

  it('rounds to the scale resolution and reports the error per line', () => {
    const scaled = scaleFormula(PRACTICAL_ACTION_LINES, settings(), { kind: 'total_charge', mass: 10, unit: 'kg' }, { step: 5, unit: 'g' });
    for (const line of scaled.lines) {
      const steps = line.roundedG / line.stepG;
      expect(Math.abs(steps - Math.round(steps))).toBeLessThan(1e-6);
      expect(Math.abs(line.roundingErrorG)).toBeLessThanOrEqual(line.stepG / 2 + 1e-9);
      expect(line.roundingErrorG).toBeCloseTo(line.roundedG - line.exactG, 9);
    }
    // Fruit and sugar: 4971.4 g each on the 5 g step.
    expect(scaled.lines[0].stepG).toBe(5);
    // Citric acid: 55 g × 10/20.115 = 27.34 g; half of 5 g is 9 % of it, half of 1 g 1.8 % → 27 g on a 1 g step.
    expect(scaled.lines[3].stepG).toBe(1);
    expect(scaled.lines[3].roundedG).toBe(27);
  });

  it('rounds in pounds when the scale reads 0.01 lb', () => {
    const scaled = scaleFormula(PRACTICAL_ACTION_LINES, settings(), { kind: 'total_charge', mass: 20, unit: 'lb' }, { step: 0.01, unit: 'lb' });
    expect(scaled.exact.totalChargeG).toBeCloseTo(20 * GRAMS_PER_POUND, 6);
    for (const line of scaled.lines) {
      // On the 0.01 lb step, or a finer power of ten of a pound for the pectin and acid.
      const steps = line.roundedInResolutionUnit / line.stepInResolutionUnit;
      expect(Math.abs(steps - Math.round(steps))).toBeLessThan(1e-6);
      expect([0.01, 0.001, 0.0001].some((s) => Math.abs(line.stepInResolutionUnit - s) < 1e-12)).toBe(true);
    }
    expect(scaled.lines[0].stepInResolutionUnit).toBeCloseTo(0.01, 12);
  });

  it('shows the effect of rounding on finished mass and solids', () => {
    const scaled = scaleFormula(PRACTICAL_ACTION_LINES, settings(), { kind: 'total_charge', mass: 10, unit: 'kg' }, { step: 5, unit: 'g' });
    const solidsDeltaG = scaled.rounded.solubleSolidsInG - scaled.exact.solubleSolidsInG;
    expect(scaled.effectOfRounding.solubleSolidsDeltaG).toBeCloseTo(solidsDeltaG, 9);
    expect(scaled.effectOfRounding.finishedMassDeltaG).toBeCloseTo(solidsDeltaG / 0.68, 9);
    expect(Math.abs(scaled.effectOfRounding.solidsPctDeltaIfPlannedEvaporation)).toBeLessThan(0.2);
  });

  it('scales to a jar count', () => {
    const scaled = scaleFormula(PRACTICAL_ACTION_LINES, settings({ jarNetFillG: 340 }), { kind: 'jar_count', jars: 24 }, { step: 1, unit: 'g' });
    expect(scaled.exact.finishedMassG).toBeCloseTo(24 * 340, 6);
    expect(scaled.exact.jarsFilled).toBe(24);
  });

  it('rejects a zero resolution and a fractional jar count', () => {
    expect(() => scaleFormula(PRACTICAL_ACTION_LINES, settings(), { kind: 'jar_count', jars: 2.5 }, { step: 1, unit: 'g' })).toThrow(ChemistryInputError);
    expect(() => scaleFormula(PRACTICAL_ACTION_LINES, settings(), { kind: 'jar_count', jars: 3 }, { step: 0, unit: 'g' })).toThrow(/resolution/);
  });
});
