import { describe, expect, it } from 'vitest';
import { insideConvexHull } from '@/lib/models';
import { yieldCcd } from './published';

describe('convex hull membership (simplex phase I)', () => {
  it('a square: inside, on the edge, outside (by hand)', () => {
    const square = [[0, 0], [1, 0], [0, 1], [1, 1]];
    expect(insideConvexHull(square, [0.5, 0.5])).toBe(true);
    expect(insideConvexHull(square, [1, 0.3])).toBe(true);
    expect(insideConvexHull(square, [1, 1])).toBe(true);
    expect(insideConvexHull(square, [1.01, 0.5])).toBe(false);
    expect(insideConvexHull(square, [-0.2, -0.2])).toBe(false);
  });

  it('a triangle: the point (0.3, 0.3) is inside x + y ≤ 1, (0.6, 0.6) is not', () => {
    const triangle = [[0, 0], [1, 0], [0, 1]];
    expect(insideConvexHull(triangle, [0.3, 0.3])).toBe(true);
    expect(insideConvexHull(triangle, [0.6, 0.6])).toBe(false);
  });

  it('the CCD of Montgomery: between the corner (1, 1) and the axial run (1.414, 0) the hull edge runs below (1.2, 1.2)', () => {
    // By hand: the hull's edge from (1, 1) to (1.414, 0) has x1 + 0.414·x2 = 1.414; at (1.2, 0.6) 1.2 + 0.248 = 1.448 > 1.414.
    expect(insideConvexHull(yieldCcd.coded, [1.2, 0.6])).toBe(false);
    expect(insideConvexHull(yieldCcd.coded, [1.1, 0.6])).toBe(true);
    expect(insideConvexHull(yieldCcd.coded, [0, 0])).toBe(true);
  });

  it('four dimensions, with repeated points and a degenerate (flat) set', () => {
    const cube = Array.from({ length: 16 }, (_, i) => [0, 1, 2, 3].map((b) => ((i >> b) & 1 ? 1 : -1)));
    expect(insideConvexHull([...cube, ...cube], [0.9, -0.9, 0.5, 0])).toBe(true);
    expect(insideConvexHull(cube, [0.9, -0.9, 0.5, 1.05])).toBe(false);
    const flat = [[0, 0, 0], [1, 0, 0], [0, 1, 0]];
    expect(insideConvexHull(flat, [0.2, 0.2, 0])).toBe(true);
    expect(insideConvexHull(flat, [0.2, 0.2, 0.01])).toBe(false);
    expect(insideConvexHull([], [0])).toBe(false);
  });
});
