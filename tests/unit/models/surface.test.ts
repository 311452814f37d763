import { describe, expect, it } from 'vitest';
import { fitResponseSurface, leverageAt, predictResponse, stationaryPoint, symmetricEigen } from '@/lib/models';
import { yieldCcd } from './published';
import { collectNonFiniteNumbers } from '../stats/fixtures';

// The Montgomery yield CCD in natural units: time 80–90 min and temperature 170–180 °F coded −1…+1.
const coding = [
  { name: 'time', low: 80, high: 90 },
  { name: 'temperature', low: 170, high: 180 },
];
const runs = yieldCcd.coded.map(([x1, x2], i) => ({ point: { time: 85 + 5 * x1, temperature: 175 + 5 * x2 }, response: yieldCcd.response[i] }));

describe('response surface over named factors', () => {
  it('Montgomery yield CCD: stationary point at about 87 min and 176.5 °F, a maximum of 80.21', () => {
    const surface = fitResponseSurface({ factors: ['time', 'temperature'], kind: 'full_quadratic', runs, coding });
    const point = stationaryPoint(surface)!;
    // Source: Montgomery, Design and Analysis of Experiments, ch. 11 (as printed): x_s = (0.389, 0.306),
    // i.e. time ≈ 87 min, temperature ≈ 176.5 °F, predicted yield 80.21 %; a maximum.
    expect(point.nature).toBe('maximum');
    expect(point.coded![0]).toBeCloseTo(0.389, 3);
    expect(point.coded![1]).toBeCloseTo(0.306, 3);
    expect(point.natural!.time).toBeCloseTo(86.95, 2);
    expect(point.natural!.temperature).toBeCloseTo(176.53, 2);
    expect(point.estimate).toBeCloseTo(80.21, 2);
    // Canonical form: λ = −0.9634 and −1.4141 (memory), and by hand from the printed coefficients,
    // B = [[−1.376, 0.125], [0.125, −1.001]]: λ = −1.1885 ± √(0.1875² + 0.125²) = −0.9632, −1.4138.
    expect(point.eigenvalues[0]).toBeCloseTo(-1.414, 2);
    expect(point.eigenvalues[1]).toBeCloseTo(-0.963, 2);
    expect(point.inRegion).toBe(true);
  });

  it('the same fit whether coded by hand or from natural units', () => {
    const surface = fitResponseSurface({ factors: ['time', 'temperature'], kind: 'full_quadratic', runs, coding });
    expect(surface.fit.terms.map((t) => Number(t.estimate!.toFixed(3)))).toEqual([79.94, 0.995, 0.515, 0.25, -1.376, -1.001]);
    expect(surface.terms.map((t) => t.name)).toEqual(['1', 'time', 'temperature', 'time×temperature', 'time²', 'temperature²']);
  });

  it('withdraws predictions outside the data, with the reason: the box and the leverage rule', () => {
    const surface = fitResponseSurface({ factors: ['time', 'temperature'], kind: 'full_quadratic', runs, coding });
    const inside = predictResponse(surface, { time: 86, temperature: 176 });
    expect(inside.inRegion).toBe(true);
    const beyondBox = predictResponse(surface, { time: 95, temperature: 175 });
    expect(beyondBox.inRegion).toBe(false);
    if (!beyondBox.inRegion) expect(beyondBox.reason).toMatch(/time 95 is outside the data \(77\.93 to 92\.07\)/);
    // Inside the box but in the corner no run reached (x1 = x2 = 1.4): leverage above every run's.
    const corner = predictResponse(surface, { time: 92, temperature: 182 });
    expect(corner.inRegion).toBe(false);
    if (!corner.inRegion) {
      expect(corner.reason).toMatch(/far from the runs/);
      expect(corner.leverage!).toBeGreaterThan(surface.fit.basis.maxLeverage);
    }
    // Between the corner (1, 1) and the axial run (1.414, 0) (coded 1.2, 0.6; see hull.test.ts): the
    // leverage rule keeps it, the convex-hull rule (on request) does not.
    const between = { time: 91, temperature: 178 };
    expect(predictResponse(surface, between).inRegion).toBe(true);
    const strict = predictResponse(surface, between, { hull: true });
    expect(strict.inRegion).toBe(false);
    if (!strict.inRegion) expect(strict.reason).toMatch(/convex hull/);
    expect(predictResponse(surface, { time: 86, temperature: 176 }, { hull: true }).inRegion).toBe(true);
    // At a run itself the leverage is that run's.
    expect(leverageAt(surface, { time: 80, temperature: 170 })).toBeCloseTo(surface.fit.leverages[0], 12);
  });

  it('a saddle and a minimum are named as such (built from exact surfaces)', () => {
    const grid = [-1, 0, 1].flatMap((a) => [-1, 0, 1].map((b) => ({ a, b })));
    const saddle = fitResponseSurface({ factors: ['a', 'b'], kind: 'full_quadratic', runs: grid.map((p) => ({ point: p, response: 5 + p.a * p.a - p.b * p.b + 0.5 * p.a })) });
    const s = stationaryPoint(saddle)!;
    expect(s.nature).toBe('saddle');
    // By hand: ∂/∂a = 2a + 0.5 = 0 → a = −0.25; b = 0.
    expect(s.coded![0]).toBeCloseTo(-0.25, 10);
    expect(s.coded![1]).toBeCloseTo(0, 10);
    const bowl = fitResponseSurface({ factors: ['a', 'b'], kind: 'full_quadratic', runs: grid.map((p) => ({ point: p, response: 2 + (p.a - 0.2) ** 2 + 2 * (p.b + 0.1) ** 2 })) });
    const m = stationaryPoint(bowl)!;
    expect(m.nature).toBe('minimum');
    expect(m.coded![0]).toBeCloseTo(0.2, 10);
    expect(m.coded![1]).toBeCloseTo(-0.1, 10);
    expect(m.estimate).toBeCloseTo(2, 10);
    const ridge = fitResponseSurface({ factors: ['a', 'b'], kind: 'full_quadratic', runs: grid.map((p) => ({ point: p, response: 1 - p.a * p.a + p.b })) });
    expect(stationaryPoint(ridge)!.nature).toBe('ridge');
    expect(collectNonFiniteNumbers(stationaryPoint(ridge))).toEqual([]);
  });

  it('a full quadratic on a two-level factorial: the squares are aliased with the intercept, named, and predictions withdrawn', () => {
    // By hand: at ±1 every x² is 1, the same column as the intercept.
    const corners = [[-1, -1], [1, -1], [-1, 1], [1, 1], [-1, -1], [1, 1]].map(([a, b], i) => ({ point: { a, b }, response: 3 + a - b + 0.1 * i }));
    const surface = fitResponseSurface({ factors: ['a', 'b'], kind: 'full_quadratic', runs: corners });
    const squares = surface.fit.terms.filter((t) => t.name.endsWith('²'));
    expect(squares.map((t) => t.estimate)).toEqual([null, null]);
    expect(squares[0].aliasedWith).toEqual(['1']);
    expect(surface.fit.warnings.find((w) => w.kind === 'aliased')!.message).toContain('a² (with 1)');
    const at = predictResponse(surface, { a: 0, b: 0 });
    expect(at.inRegion).toBe(false);
    if (!at.inRegion) expect(at.reason).toMatch(/cannot separate/);
    expect(stationaryPoint(surface)).toBeNull();
  });

  it('refuses a factor that never varies', () => {
    expect(() => fitResponseSurface({ factors: ['a', 'b'], kind: 'main_effects', runs: [{ point: { a: 1, b: 2 }, response: 1 }, { point: { a: 2, b: 2 }, response: 2 }] })).toThrow(/same value in every run/);
  });
});

describe('symmetric eigenvalues (Jacobi)', () => {
  it('reproduces A·v = λ·v on a 4×4 matrix and the known eigenvalues of a 3×3', () => {
    // By hand: [[2, −1, 0], [−1, 2, −1], [0, −1, 2]] has eigenvalues 2 − √2, 2, 2 + √2.
    const { values } = symmetricEigen([[2, -1, 0], [-1, 2, -1], [0, -1, 2]]);
    expect(values[0]).toBeCloseTo(2 - Math.SQRT2, 13);
    expect(values[1]).toBeCloseTo(2, 13);
    expect(values[2]).toBeCloseTo(2 + Math.SQRT2, 13);
    const a = [[4, 1, -2, 2], [1, 2, 0, 1], [-2, 0, 3, -2], [2, 1, -2, -1]];
    const eigen = symmetricEigen(a);
    eigen.values.forEach((lambda, k) => {
      const v = eigen.vectors[k];
      a.forEach((row, i) => expect(row.reduce((s, x, j) => s + x * v[j], 0)).toBeCloseTo(lambda * v[i], 12));
    });
    // Trace is the sum of the eigenvalues.
    expect(eigen.values.reduce((s, v) => s + v, 0)).toBeCloseTo(8, 12);
  });
});
