import { describe, expect, it } from 'vitest';
import { codePoint, fitResponseSurface, insideConvexHull, leverageAt, linearConstraint, optimise, predictResponse, stationaryPoint, windowConstraint } from '@/lib/models';
import { yieldCcd } from './published';

const coding = [
  { name: 'time', low: 80, high: 90 },
  { name: 'temperature', low: 170, high: 180 },
];
const runs = yieldCcd.coded.map(([x1, x2], i) => ({ point: { time: 85 + 5 * x1, temperature: 175 + 5 * x2 }, response: yieldCcd.response[i] }));
const yieldSurface = fitResponseSurface({ factors: ['time', 'temperature'], kind: 'full_quadratic', runs, coding });
const wide = [
  { name: 'time', low: 0, high: 200 },
  { name: 'temperature', low: 0, high: 300 },
];

describe('optimiser', () => {
  it('finds the Montgomery yield maximum (the stationary point) when yield is maximised', () => {
    const result = optimise({ factors: wide, goals: [{ name: 'yield', surface: yieldSurface, goal: { kind: 'maximise', low: 75, high: 81 } }] });
    const best = result.proposals[0];
    const peak = stationaryPoint(yieldSurface)!;
    expect(best.point.time).toBeCloseTo(peak.natural!.time, 2);
    expect(best.point.temperature).toBeCloseTo(peak.natural!.temperature, 2);
    // Source: Montgomery, ch. 11: maximum predicted yield 80.21 → d = (80.21 − 75)/(81 − 75).
    expect(best.responses[0].estimate).toBeCloseTo(80.21, 2);
    expect(best.desirability).toBeCloseTo((peak.estimate! - 75) / 6, 6);
    expect(best.responses[0].prediction!.low).toBeLessThan(best.responses[0].estimate);
    // The search never left the data: the box is the data's.
    expect(result.searchBox).toEqual([{ name: 'time', low: 85 - 7.07, high: 85 + 7.07 }, { name: 'temperature', low: 175 - 7.07, high: 175 + 7.07 }].map((r) => ({ ...r, low: expect.closeTo(r.low, 10), high: expect.closeTo(r.high, 10) })));
  });

  it('respects a linear constraint: with time ≤ 85 the best is on that edge at the conditional maximum', () => {
    const result = optimise({
      factors: wide,
      goals: [{ name: 'yield', surface: yieldSurface, goal: { kind: 'maximise', low: 75, high: 81 } }],
      constraints: [linearConstraint('time limit', { time: 1 }, '<=', 85)],
    });
    const best = result.proposals[0];
    expect(best.point.time).toBeLessThanOrEqual(85 + 1e-9);
    expect(best.point.time).toBeCloseTo(85, 3);
    // By hand: at x1 = 0, ŷ = b0 + b2·x2 + b22·x2², maximal at x2 = −b2/(2·b22).
    const b2 = yieldSurface.fit.terms[2].estimate!;
    const b22 = yieldSurface.fit.terms[5].estimate!;
    expect(best.point.temperature).toBeCloseTo(175 + 5 * (-b2 / (2 * b22)), 2);
  });

  it('never proposes outside the data, even when the goal pulls beyond it', () => {
    // A planar response rising with both factors pulls to the far corner (92.07, 182.07), which no
    // run reached: beyond the leverage rule, so the proposal stops on the circle of the axial runs.
    const planar = fitResponseSurface({ factors: ['time', 'temperature'], kind: 'main_effects', runs: runs.map((r) => ({ ...r, response: r.point.time + r.point.temperature })) });
    expect(predictResponse(planar, { time: 92.07, temperature: 182.07 }).inRegion).toBe(false);
    const result = optimise({ factors: wide, goals: [{ name: 'sum', surface: planar, goal: { kind: 'maximise', low: 200, high: 300 } }] });
    expect(result.proposals.length).toBeGreaterThan(0);
    for (const proposal of result.proposals) {
      expect(predictResponse(planar, proposal.point).inRegion).toBe(true);
      expect(leverageAt(planar, proposal.point)).toBeLessThanOrEqual(planar.fit.basis.maxLeverage * (1 + 1e-9));
    }
    // By hand (coded, orthogonal design): h = 1/13 + (x1² + x2²)/8, and h_max (the axial and corner
    // runs) = 1/13 + 2/8, so the allowed region is x1² + x2² ≤ 2; the optimum of x1 + x2 is (1, 1).
    expect(result.proposals[0].point.time).toBeCloseTo(90, 1);
    expect(result.proposals[0].point.temperature).toBeCloseTo(180, 1);
    // With the convex-hull rule too, every proposal lies in the hull of the runs.
    const strict = optimise({ factors: wide, goals: [{ name: 'sum', surface: planar, goal: { kind: 'maximise', low: 200, high: 300 } }], region: { hull: true } });
    expect(strict.proposals.length).toBeGreaterThan(0);
    for (const proposal of strict.proposals) {
      expect(insideConvexHull(planar.codedRuns, codePoint(planar.coding, proposal.point))).toBe(true);
    }
  });

  it('combines two responses with a window constraint and returns distinct proposals with intervals', () => {
    // A second, exactly quadratic response (a made-up "colour" index) to trade off against yield.
    const colour = fitResponseSurface({
      factors: ['time', 'temperature'],
      kind: 'full_quadratic',
      runs: runs.map((r, i) => ({ ...r, response: 40 + 0.8 * (r.point.time - 85) - 0.3 * (r.point.temperature - 175) + (i % 3) * 0.05 })),
    });
    const result = optimise({
      factors: wide,
      goals: [
        { name: 'yield', surface: yieldSurface, goal: { kind: 'maximise', low: 76, high: 80.5 }, importance: 2 },
        { name: 'colour', surface: colour, goal: { kind: 'target', low: 36, target: 40, high: 44 } },
      ],
      constraints: [windowConstraint('time window', (p) => p.time, { low: 82, high: 88 })],
    });
    expect(result.message).toBeNull();
    const best = result.proposals[0];
    expect(best.point.time).toBeGreaterThanOrEqual(82 - 1e-9);
    expect(best.point.time).toBeLessThanOrEqual(88 + 1e-9);
    expect(best.responses.map((r) => r.name)).toEqual(['yield', 'colour']);
    expect(best.responses.every((r) => r.prediction !== null && r.confidence !== null)).toBe(true);
    // D is recomputed from the reported d's: (d₁² · d₂)^(1/3).
    expect(best.desirability).toBeCloseTo((best.responses[0].desirability ** 2 * best.responses[1].desirability) ** (1 / 3), 10);
    // Best first.
    result.proposals.slice(1).forEach((p) => expect(p.desirability).toBeLessThanOrEqual(best.desirability + 1e-12));
  });

  it('says why when nothing qualifies', () => {
    const impossible = optimise({
      factors: wide,
      goals: [{ name: 'yield', surface: yieldSurface, goal: { kind: 'maximise', low: 75, high: 81 } }],
      constraints: [linearConstraint('too early', { time: 1 }, '<=', 60)],
    });
    expect(impossible.proposals).toEqual([]);
    expect(impossible.message).toBe('No setting inside the data meets every constraint. Not met at any setting tried: too early.');
    // Only the constraint no setting met is named; one that some settings met is not what to relax.
    const oneOfTwo = optimise({
      factors: wide,
      goals: [{ name: 'yield', surface: yieldSurface, goal: { kind: 'maximise', low: 75, high: 81 } }],
      constraints: [linearConstraint('not too short', { time: 1 }, '>=', wide[0].low), linearConstraint('too early', { time: 1 }, '<=', 60)],
    });
    expect(oneOfTwo.message).toBe('No setting inside the data meets every constraint. Not met at any setting tried: too early.');
    const unreachable = optimise({ factors: wide, goals: [{ name: 'yield', surface: yieldSurface, goal: { kind: 'maximise', low: 90, high: 95 } }] });
    expect(unreachable.proposals).toEqual([]);
    expect(unreachable.message).toMatch(/always outside its acceptable limits/);
    const noOverlap = optimise({ factors: [{ name: 'time', low: 100, high: 120 }, wide[1]], goals: [{ name: 'yield', surface: yieldSurface, goal: { kind: 'maximise', low: 75, high: 81 } }] });
    expect(noOverlap.message).toMatch(/time lies outside the data/);
    // A search over many factors would explode the grid: refused before any work.
    const many = Array.from({ length: 9 }, (_, i) => ({ name: `f${i}`, low: 0, high: 1 }));
    expect(() => optimise({ factors: many, goals: [{ name: 'yield', surface: yieldSurface, goal: { kind: 'maximise', low: 75, high: 81 } }] })).toThrow(/at most 8 factors/);
  });
});
