import { describe, it, expect } from 'vitest';
import { planRuns, planDesign, applyFactorLevels, measureFactor, targetSolidsOf, variantLinesKey, PlanError, type MassLine } from '@/lib/trials/plan';

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

describe('response-surface designs as variants', () => {
  const solids = { factor: 'target_solids' as const, low: 55, high: 63 };
  const codedOf = (runs: ReturnType<typeof planRuns>) => runs.map((r) => r.levels.map((l) => Number(l.coded.toFixed(3))));

  // Source: Montgomery, Design and Analysis of Experiments, ch. 11, the central composite design
  // for k = 3 (2^3 corners, 2k axial runs, n_c centre runs; α = 1 face-centred, α = (2^k)^¼ = 1.682
  // rotatable) (memory); NIST/SEMATECH e-Handbook §5.3.3.6.3, Table 3.24 gives 20 runs with 6 centre runs.
  it('face-centred central composite, 3 factors, 3 centre runs: 8 corners + 6 face runs + 3 centre = 17 variants', () => {
    const runs = planRuns('central_composite_face_centred', [specs.sugar, specs.acid, specs.pectin], { centreRuns: 3 });
    expect(runs).toHaveLength(17);
    expect(codedOf(runs)).toEqual([
      [-1, -1, -1], [1, -1, -1], [-1, 1, -1], [1, 1, -1], [-1, -1, 1], [1, -1, 1], [-1, 1, 1], [1, 1, 1],
      [-1, 0, 0], [1, 0, 0], [0, -1, 0], [0, 1, 0], [0, 0, -1], [0, 0, 1],
      [0, 0, 0], [0, 0, 0], [0, 0, 0],
    ]);
    // Face runs stay within low…high: the sugar ratio takes only 0.6, 0.8 and 1.0.
    expect([...new Set(runs.map((r) => Number(r.levels[0].value.toFixed(6))))].sort()).toEqual([0.6, 0.8, 1]);
    expect(runs[0].description).toBe('sugar ratio low, acid dose low, pectin dose low');
    expect(runs[8].description).toBe('sugar ratio low, others centre');
    expect(runs.slice(14).map((r) => r.description)).toEqual(['centre point (1 of 3)', 'centre point (2 of 3)', 'centre point (3 of 3)']);
  });

  it('rotatable central composite, 2 factors: axial runs at ±1.414 half-ranges, described with their level', () => {
    // Source: Montgomery, ch. 11, the rotatable CCD for k = 2: α = √2 = 1.414 (memory).
    const design = planDesign('central_composite_rotatable', [specs.sugar, specs.acid], { centreRuns: 5 });
    expect(design.runs).toHaveLength(4 + 4 + 5);
    const axial = design.runs[4];
    expect(axial.levels[0].coded).toBeCloseTo(-Math.SQRT2, 12);
    expect(axial.levels[0].value).toBeCloseTo(0.8 - Math.SQRT2 * 0.2, 12);
    expect(axial.description).toBe('sugar ratio below low (0.517), others centre');
    expect(design.warnings[0]).toMatch(/beyond low and high \(1\.41 × half the range/);
  });

  it('Box–Behnken, 3 factors with target soluble solids: 12 edge runs + centre runs, no corners', () => {
    // Source: Montgomery, ch. 11, the Box–Behnken design for three factors: 12 runs at the middles of
    // the cube's edges plus centre runs (memory); NIST §5.3.3.6.3 Table 3.24: 15 runs with 3 centre runs.
    const runs = planRuns('box_behnken', [specs.sugar, specs.pectin, solids], { centreRuns: 3 });
    expect(runs).toHaveLength(15);
    const coded = codedOf(runs);
    expect(coded.every((c) => c.filter((v) => v === 0).length >= 1)).toBe(true);
    expect(coded.slice(0, 4)).toEqual([[-1, -1, 0], [1, -1, 0], [-1, 1, 0], [1, 1, 0]]);
    expect(runs[8].levels.find((l) => l.factor === 'target_solids')).toEqual({ factor: 'target_solids', coded: -1, value: 55 });
    expect(runs[8].description).toBe('pectin dose low, target soluble solids low, others centre');
  });

  it('target soluble solids is measured from the settings and set on the variant, never on the lines', () => {
    expect(measureFactor(base, 'target_solids', { targetSolidsPct: 60 })).toBe(60);
    expect(() => measureFactor(base, 'target_solids')).toThrow(PlanError);
    const level = { factor: 'target_solids' as const, coded: 1, value: 63 };
    expect(applyFactorLevels(base, [level]).map((l) => l.massG)).toEqual(base.map((l) => l.massG));
    expect(targetSolidsOf([level], 60)).toBe(63);
    expect(targetSolidsOf([], 60)).toBe(60);
    // Same lines, other target: not the same variant.
    const lines = [{ ingredientId: 'a', quantity: 1000, unit: 'g' }];
    expect(variantLinesKey(lines, 60)).not.toBe(variantLinesKey(lines, 63));
    expect(variantLinesKey(lines, 60)).toBe(variantLinesKey(lines, 60.001));
  });

  it('refuses designs that cannot be cooked or laid out, with a clear message', () => {
    // A rotatable design pushes a low of 0.1 on a ±0.9 half-range below zero.
    expect(() => planRuns('central_composite_rotatable', [{ ...specs.sugar, low: 0.1, high: 1.9 }, specs.acid])).toThrow(/below zero/);
    expect(() => planRuns('central_composite_rotatable', [{ ...solids, low: 50, high: 95 }, specs.acid])).toThrow(/0–100/);
    expect(() => planRuns('box_behnken', [specs.sugar, specs.acid])).toThrow(/3 or 4 factors/);
    expect(() => planRuns('central_composite_face_centred', [specs.sugar])).toThrow(/2 to 5 factors/);
    expect(() => planRuns('central_composite_face_centred', [specs.sugar, specs.acid], { centreRuns: 0 })).toThrow(/between 1 and 6/);
    expect(() => planRuns('central_composite_face_centred', [specs.sugar, specs.acid], { centreRuns: 2.5 })).toThrow(PlanError);
    expect(() => planRuns('full_factorial', [{ ...solids, low: 40, high: 100 }])).toThrow(/between 0 and 100/);
  });
});
