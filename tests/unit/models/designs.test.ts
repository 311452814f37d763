import { describe, expect, it } from 'vitest';
import { boxBehnken, buildTerms, centralComposite, designRow, fitRegression } from '@/lib/models';

const three = [
  { name: 'X1', low: -1, high: 1 },
  { name: 'X2', low: -1, high: 1 },
  { name: 'X3', low: -1, high: 1 },
];
const key = (coded: number[]) => coded.map((v) => v.toFixed(3)).join(',');
const counted = (runs: { coded: number[] }[]) => {
  const counts = new Map<string, number>();
  runs.forEach((r) => counts.set(key(r.coded), (counts.get(key(r.coded)) ?? 0) + 1));
  return counts;
};

// Source: NIST/SEMATECH e-Handbook of Statistical Methods, §5.3.3.6.3, Table 3.24 (structural
// comparison of CCC, CCF and Box–Behnken designs for three factors): 20, 20 and 15 runs.
const corners = [[-1, -1, -1], [1, -1, -1], [-1, 1, -1], [1, 1, -1], [-1, -1, 1], [1, -1, 1], [-1, 1, 1], [1, 1, 1]];
const axial = (a: number) => [[-a, 0, 0], [a, 0, 0], [0, -a, 0], [0, a, 0], [0, 0, -a], [0, 0, a]];

describe('response-surface designs', () => {
  it('rotatable central composite, 3 factors: 8 corners, 6 axial at ±1.682, 6 centre runs = 20 (NIST Table 3.24)', () => {
    const design = centralComposite(three, { alpha: 'rotatable', centrePoints: 6 });
    expect(design.runs).toHaveLength(20);
    expect(design.alpha).toBeCloseTo(1.682, 3);
    const expected = counted([...corners, ...axial(1.682), ...Array(6).fill([0, 0, 0])].map((coded) => ({ coded })));
    expect(counted(design.runs)).toEqual(expected);
    // Standard order: the first factor alternates fastest.
    expect(design.runs.slice(0, 8).map((r) => r.coded)).toEqual(corners);
  });

  it('face-centred central composite, 3 factors: axial runs on the faces (α = 1), 20 runs (NIST Table 3.24)', () => {
    const design = centralComposite(three, { alpha: 'face_centred', centrePoints: 6 });
    expect(design.runs).toHaveLength(20);
    expect(counted(design.runs)).toEqual(counted([...corners, ...axial(1), ...Array(6).fill([0, 0, 0])].map((coded) => ({ coded }))));
    expect(design.warnings).toEqual([]);
  });

  it('Box–Behnken, 3 factors: 12 edge midpoints and 3 centre runs = 15 (NIST Table 3.24)', () => {
    const design = boxBehnken(three, { centrePoints: 3 });
    expect(design.runs).toHaveLength(15);
    const edges = [
      [-1, -1, 0], [1, -1, 0], [-1, 1, 0], [1, 1, 0],
      [-1, 0, -1], [1, 0, -1], [-1, 0, 1], [1, 0, 1],
      [0, -1, -1], [0, 1, -1], [0, -1, 1], [0, 1, 1],
    ];
    expect(counted(design.runs)).toEqual(counted([...edges, [0, 0, 0], [0, 0, 0], [0, 0, 0]].map((coded) => ({ coded }))));
  });

  it('rotatable α = (2^k)^¼: 1.414 for 2 factors, 2.000 for 4 (NIST §5.3.3.6.1, Table 3.23 — memory)', () => {
    const two = centralComposite(three.slice(0, 2), { alpha: 'rotatable', centrePoints: 5 });
    expect(two.alpha).toBeCloseTo(1.414, 3);
    expect(two.runs).toHaveLength(13);
    const four = centralComposite([...three, { name: 'X4', low: -1, high: 1 }], { alpha: 'rotatable', centrePoints: 6 });
    expect(four.alpha).toBeCloseTo(2, 12);
    expect(four.runs).toHaveLength(30);
  });

  it('Box–Behnken, 4 factors: every pair at ±1 (24 runs) plus 3 centre runs = 27 (Box & Behnken 1960 — memory)', () => {
    const design = boxBehnken([...three, { name: 'X4', low: -1, high: 1 }], { centrePoints: 3 });
    expect(design.runs).toHaveLength(27);
    const edges = design.runs.filter((r) => r.kind === 'edge');
    expect(edges.every((r) => r.coded.filter((v) => v !== 0).length === 2)).toBe(true);
    expect(new Set(edges.map((r) => key(r.coded))).size).toBe(24);
  });

  it('natural units: centre and half-range of each factor; rotatable axial levels beyond the range are flagged', () => {
    const factors = [
      { name: 'sugarRatio', low: 0.8, high: 1.2 },
      { name: 'pectinPercent', low: 0.05, high: 0.45 },
      { name: 'targetSolids', low: 55, high: 65 },
    ];
    const design = centralComposite(factors, { alpha: 'rotatable', centrePoints: 4 });
    // By hand: α = 8^¼ = 1.68179; pectin 0.25 ± 1.68179 · 0.2 → 0.58636 and −0.08636 (below zero).
    const pectin = design.runs.filter((r) => r.kind === 'axial').map((r) => r.natural.pectinPercent);
    expect(Math.max(...pectin)).toBeCloseTo(0.25 + 8 ** 0.25 * 0.2, 12);
    expect(design.warnings.some((w) => /pectinPercent would go below zero/.test(w))).toBe(true);
    expect(design.runs.find((r) => r.kind === 'centre')!.natural).toEqual({ sugarRatio: 1, pectinPercent: 0.25, targetSolids: 60 });
  });

  it('a full quadratic is estimable from each design, with residual df to spare', () => {
    for (const design of [centralComposite(three, { alpha: 'face_centred', centrePoints: 3 }), boxBehnken(three, { centrePoints: 3 })]) {
      const terms = buildTerms(['X1', 'X2', 'X3'], 'full_quadratic');
      const fit = fitRegression({ termNames: terms.map((t) => t.name), rows: design.runs.map((r) => designRow(terms, r.coded)), response: design.runs.map((_, i) => i % 5) });
      expect(fit.parameterCount).toBe(10);
      expect(fit.warnings.filter((w) => w.kind === 'aliased')).toEqual([]);
    }
  });

  it('refuses impossible requests', () => {
    expect(() => boxBehnken(three.slice(0, 2), { centrePoints: 3 })).toThrow(/3 or 4 factors/);
    expect(() => centralComposite(three, { alpha: 'rotatable', centrePoints: 0 })).toThrow(/centre runs/);
    expect(() => centralComposite(three, { alpha: 'rotatable', centrePoints: 1e9 })).toThrow(/centre runs/);
    expect(() => centralComposite([{ name: 'a', low: 2, high: 1 }, three[1]], { alpha: 'face_centred', centrePoints: 2 })).toThrow(/high level/);
  });
});
