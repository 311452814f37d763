import { describe, it, expect } from 'vitest';
import { planRuns, applyFactorLevels, measureFactor, PlanError, type MassLine } from '@/lib/trials/plan';

const fruit = { kind: 'fruit', name: 'Apricot', solidsPct: 11.7 } as const;
const sugar = { kind: 'sweetener', name: 'Sucrose', solidsPct: 100, sweetenerType: 'sucrose' } as const;
const glucose = { kind: 'sweetener', name: 'Glucose syrup', solidsPct: 80, sweetenerType: 'glucose_syrup' } as const;
const pectin = { kind: 'pectin', name: 'HM pectin', solidsPct: 100, pectinType: 'hm_rapid_set' } as const;
const acid = { kind: 'acid', name: 'Citric acid', solidsPct: 100, acidType: 'citric' } as const;

const base: MassLine[] = [
  { ingredient: fruit, massG: 1000 },
  { ingredient: sugar, massG: 600 },
  { ingredient: glucose, massG: 200 },
  { ingredient: pectin, massG: 6 },
  { ingredient: acid, massG: 4 },
];

const specs = {
  sugar: { factor: 'sugar_ratio' as const, low: 0.6, high: 1.0 },
  acid: { factor: 'acid_dose' as const, low: 2, high: 6 },
  pectin: { factor: 'pectin_dose' as const, low: 4, high: 8 },
};

describe('full factorial designs', () => {
  // Source: Montgomery, Design and Analysis of Experiments, ch. 6: the 2^k design in standard
  // (Yates) order, first factor alternating fastest: (1), a, b, ab, c, ac, bc, abc.
  it('2^2 gives the four corners in standard order', () => {
    const runs = planRuns('full_factorial', [specs.sugar, specs.acid]);
    expect(runs.map((r) => r.levels.map((l) => l.coded))).toEqual([[-1, -1], [1, -1], [-1, 1], [1, 1]]);
    expect(runs[1].levels.map((l) => l.value)).toEqual([1.0, 2]);
  });

  it('2^3 gives all eight combinations, each once, balanced in every column', () => {
    const runs = planRuns('full_factorial', [specs.sugar, specs.acid, specs.pectin]);
    const coded = runs.map((r) => r.levels.map((l) => l.coded));
    expect(coded).toEqual([
      [-1, -1, -1], [1, -1, -1], [-1, 1, -1], [1, 1, -1],
      [-1, -1, 1], [1, -1, 1], [-1, 1, 1], [1, 1, 1],
    ]);
    expect(new Set(coded.map((c) => c.join())).size).toBe(8);
    for (let j = 0; j < 3; j++) expect(coded.reduce((s, c) => s + c[j], 0)).toBe(0);
    // Orthogonal columns: the dot product of any two is zero.
    expect(coded.reduce((s, c) => s + c[0] * c[1], 0)).toBe(0);
    expect(coded.reduce((s, c) => s + c[1] * c[2], 0)).toBe(0);
  });

  it('adds a centre point at the mid levels when asked', () => {
    const runs = planRuns('full_factorial', [specs.sugar, specs.acid], { centrePoint: true });
    expect(runs).toHaveLength(5);
    expect(runs[4].levels).toEqual([
      { factor: 'sugar_ratio', coded: 0, value: 0.8 },
      { factor: 'acid_dose', coded: 0, value: 4 },
    ]);
    expect(runs[4].description).toBe('centre point');
  });
});

describe('one factor at a time', () => {
  it('moves each factor to its low and high level with the others at the base', () => {
    const baseLevels = { sugar_ratio: measureFactor(base, 'sugar_ratio'), acid_dose: measureFactor(base, 'acid_dose') };
    const runs = planRuns('one_factor_at_a_time', [specs.sugar, specs.acid], { baseLevels });
    expect(runs).toHaveLength(4);
    expect(runs[0].levels).toEqual([
      { factor: 'sugar_ratio', coded: -1, value: 0.6 },
      { factor: 'acid_dose', coded: 0, value: 4 },
    ]);
    expect(runs[3].description).toBe('acid dose high');
  });
});

describe('applying levels to the base formula', () => {
  it('measures the base: 800 g sweetener per 1000 g fruit, 4 g acid and 6 g pectin per kg fruit', () => {
    expect(measureFactor(base, 'sugar_ratio')).toBeCloseTo(0.8, 12);
    expect(measureFactor(base, 'acid_dose')).toBeCloseTo(4, 12);
    expect(measureFactor(base, 'pectin_dose')).toBeCloseTo(6, 12);
  });

  it('scales every sweetener line together and leaves the rest', () => {
    const out = applyFactorLevels(base, [{ factor: 'sugar_ratio', coded: 1, value: 1.0 }, { factor: 'pectin_dose', coded: -1, value: 4 }]);
    expect(out[0].massG).toBe(1000);
    expect(out[1].massG).toBeCloseTo(750, 9);
    expect(out[2].massG).toBeCloseTo(250, 9);
    expect(out[3].massG).toBeCloseTo(4, 9);
    expect(out[4].massG).toBe(4);
    expect(measureFactor(out, 'sugar_ratio')).toBeCloseTo(1.0, 12);
  });

  it('refuses what cannot be applied, with a clear message', () => {
    expect(() => applyFactorLevels([{ ingredient: fruit, massG: 1000 }, { ingredient: sugar, massG: 900 }], [{ factor: 'pectin_dose', coded: 1, value: 5 }])).toThrow(/no pectin line/);
    expect(() => applyFactorLevels([{ ingredient: sugar, massG: 900 }], [{ factor: 'sugar_ratio', coded: 1, value: 1 }])).toThrow(PlanError);
    expect(() => planRuns('full_factorial', [{ ...specs.sugar, low: 1, high: 1 }])).toThrow(/above the low/);
    expect(() => planRuns('full_factorial', [specs.sugar, specs.sugar])).toThrow(/once/);
    expect(() => planRuns('full_factorial', [])).toThrow(/at least one/);
  });
});
