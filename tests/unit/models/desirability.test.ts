import { describe, expect, it } from 'vitest';
import { desirability, overallDesirability, type Goal } from '@/lib/models';

// Source: Derringer & Suich (1980), J. Quality Technology 12(4): the tyre tread compound example's
// goals (memory): PICO abrasion index maximised from 120 (unacceptable below) to 170; 200 % modulus
// maximised from 1000 to 1300; elongation at break on target 500 within 400–600; hardness on target
// 67.5 within 60–75. The values below are worked by hand from the paper's formulas.
const pico: Goal = { kind: 'maximise', low: 120, high: 170 };
const modulus: Goal = { kind: 'maximise', low: 1000, high: 1300 };
const elongation: Goal = { kind: 'target', low: 400, target: 500, high: 600 };
const hardness: Goal = { kind: 'target', low: 60, target: 67.5, high: 75 };

describe('Derringer–Suich desirability', () => {
  it('one-sided, maximise: 0 below the lower limit, 1 above the upper, ((ŷ − L)/(U − L))^r between', () => {
    expect(desirability(pico, 110)).toBe(0);
    expect(desirability(pico, 120)).toBe(0);
    expect(desirability(pico, 145)).toBeCloseTo(0.5, 14);
    expect(desirability(pico, 180)).toBe(1);
    // r = 2: (25/50)² = 0.25; r = 0.5: √0.5.
    expect(desirability({ ...pico, shape: 2 }, 145)).toBeCloseTo(0.25, 14);
    expect(desirability({ ...pico, shape: 0.5 }, 145)).toBeCloseTo(Math.SQRT1_2, 14);
  });

  it('one-sided, minimise: mirror image', () => {
    const syneresis: Goal = { kind: 'minimise', low: 0.5, high: 3, shape: 1 };
    expect(desirability(syneresis, 0.2)).toBe(1);
    expect(desirability(syneresis, 3.5)).toBe(0);
    // (3 − 1.25)/(3 − 0.5) = 0.7
    expect(desirability(syneresis, 1.25)).toBeCloseTo(0.7, 14);
  });

  it('two-sided with exponents s and t', () => {
    expect(desirability(elongation, 500)).toBe(1);
    expect(desirability(elongation, 465.7)).toBeCloseTo(0.657, 12);
    expect(desirability(elongation, 550)).toBeCloseTo(0.5, 14);
    expect(desirability(elongation, 399)).toBe(0);
    expect(desirability(elongation, 601)).toBe(0);
    // s = 2 below, t = 0.5 above: (50/100)² = 0.25, (50/100)^0.5 = 0.7071…
    const skewed: Goal = { ...elongation, lowerShape: 2, upperShape: 0.5 } as Goal;
    expect(desirability(skewed, 450)).toBeCloseTo(0.25, 14);
    expect(desirability(skewed, 550)).toBeCloseTo(Math.SQRT1_2, 14);
  });

  it('a band: 1 throughout the band, ramps to 0 at the limits', () => {
    const firmness: Goal = { kind: 'band', low: 2, bandLow: 3, bandHigh: 4, high: 6 };
    expect(desirability(firmness, 3.5)).toBe(1);
    expect(desirability(firmness, 2.5)).toBeCloseTo(0.5, 14);
    expect(desirability(firmness, 5)).toBeCloseTo(0.5, 14);
    expect(desirability(firmness, 6)).toBe(0);
  });

  it("overall D: the geometric mean, 0 when any response is unacceptable; importances weight it", () => {
    // The paper's reported optimum predictions (memory): ŷ = 129.5, 1300, 465.7, 68.0 →
    // d = 0.19, 1, 0.657, 0.9333; D = (0.19 · 1 · 0.657 · 0.9333)^(1/4) ≈ 0.584.
    const ds = [desirability(pico, 129.5), desirability(modulus, 1300), desirability(elongation, 465.7), desirability(hardness, 68)];
    expect(ds[0]).toBeCloseTo(0.19, 12);
    expect(ds[3]).toBeCloseTo(7 / 7.5, 12);
    const D = overallDesirability(ds.map((d) => ({ desirability: d })));
    expect(D).toBeCloseTo((0.19 * 1 * 0.657 * (7 / 7.5)) ** 0.25, 12);
    expect(D).toBeCloseTo(0.584, 3);
    expect(overallDesirability([{ desirability: 0.9 }, { desirability: 0 }])).toBe(0);
    // Importance 3 on the first: (0.25³ · 1)^(1/4).
    expect(overallDesirability([{ desirability: 0.25, importance: 3 }, { desirability: 1 }])).toBeCloseTo(0.25 ** 0.75, 14);
  });

  it('refuses goals that make no sense', () => {
    expect(() => desirability({ kind: 'maximise', low: 5, high: 5 }, 5)).toThrow(/upper limit/);
    expect(() => desirability({ kind: 'target', low: 1, target: 3, high: 2 }, 2)).toThrow(/strictly between/);
    expect(() => desirability({ kind: 'maximise', low: 1, high: 2, shape: -1 }, 1.5)).toThrow(/shape/);
    expect(() => overallDesirability([{ desirability: 0.5, importance: 0 }])).toThrow(/importance/);
  });
});
