import { describe, expect, it } from 'vitest';
import { estimateFactorEffects, findAliasGroups, type FactorRun } from '@/lib/stats';
import { collectNonFiniteNumbers } from './fixtures';

// Source: Montgomery, Design and Analysis of Experiments, Example 6.1 (2² design, chemical yield):
// A = reactant concentration 15 / 25 %, B = catalyst 1 / 2 lb, three replicates per run (memory).
const yieldRuns: FactorRun[] = [
  { label: '(1)', levels: { A: -1, B: -1 }, responses: [28, 25, 27] },
  { label: 'a', levels: { A: 1, B: -1 }, responses: [36, 32, 32] },
  { label: 'b', levels: { A: -1, B: 1 }, responses: [18, 19, 23] },
  { label: 'ab', levels: { A: 1, B: 1 }, responses: [31, 30, 29] },
];

describe('factor main effects by least squares', () => {
  it('reproduces the effects of Montgomery Example 6.1 (coded −1/+1)', () => {
    const result = estimateFactorEffects(['A', 'B'], yieldRuns);
    // Source: Montgomery, Example 6.1: A = 8.33, B = −5.00; SS_A 208.33, SS_B 75.00, SS_T 323.00 (memory)
    const [a, b] = result.effects;
    expect(a.effectOverRange).toBeCloseTo(50 / 6, 10);
    expect(b.effectOverRange).toBeCloseTo(-5, 10);
    // Main-effects model: residual SS = SS_T − SS_A − SS_B = 323 − 208.33 − 75 = 39.67 on 12 − 3 = 9 df
    expect(result.residualDf).toBe(9);
    expect(result.residualMeanSquare).toBeCloseTo((323 - 625 / 3 - 75) / 9, 10);
    // SE of a coded coefficient in an orthogonal 2² with 12 runs: √(MS/12); effect SE is twice that.
    expect(a.standardErrorPerUnit).toBeCloseTo(Math.sqrt((result.residualMeanSquare ?? 0) / 12), 10);
    expect(a.standardErrorOverRange).toBeCloseTo(2 * Math.sqrt((result.residualMeanSquare ?? 0) / 12), 10);
    expect(result.saturated).toBe(false);
    expect(result.responseAtCentre).toBeCloseTo(27.5, 10);
  });

  it('accepts actual levels (percent and lb) and per-variant means', () => {
    const actual = yieldRuns.map((run) => ({
      label: run.label,
      levels: { concentrationPercent: run.levels.A === 1 ? 25 : 15, catalystLb: run.levels.B === 1 ? 2 : 1 },
      responses: [run.responses.reduce((s, v) => s + v, 0) / run.responses.length],
    }));
    const result = estimateFactorEffects(['concentrationPercent', 'catalystLb'], actual);
    // Source: Montgomery, Example 6.1 effects (8.33 over 10 %, −5.00 over 1 lb)
    expect(result.effects[0].coefficientPerUnit).toBeCloseTo(50 / 6 / 10, 10);
    expect(result.effects[1].coefficientPerUnit).toBeCloseTo(-5, 10);
    expect(result.effects[0].effectOverRange).toBeCloseTo(50 / 6, 10);
    expect(result.residualDf).toBe(1);
  });

  it('saturated design: effects without standard errors, and says so', () => {
    const result = estimateFactorEffects(['A', 'B'], [
      { levels: { A: -1, B: -1 }, responses: [5] },
      { levels: { A: 1, B: -1 }, responses: [7] },
      { levels: { A: -1, B: 1 }, responses: [6] },
    ]);
    expect(result.saturated).toBe(true);
    expect(result.message).toMatch(/saturated/);
    // By hand: with B at −1, A moves the response from 5 to 7, so the effect over the range −1…+1 is 2.
    expect(result.effects[0].effectOverRange).toBeCloseTo(2, 10);
    expect(result.effects[0].standardErrorPerUnit).toBeNull();
    expect(collectNonFiniteNumbers(result)).toEqual([]);
  });

  it('factors changed together: neither is credited, both are named as aliased, no NaN', () => {
    const result = estimateFactorEffects(['A', 'B'], [
      { levels: { A: -1, B: -1 }, responses: [5, 6] },
      { levels: { A: 1, B: 1 }, responses: [7, 8] },
    ]);
    expect(result.effects.map((e) => e.effectOverRange)).toEqual([null, null]);
    expect(result.effects.map((e) => e.aliasedWith)).toEqual([['B'], ['A']]);
    expect(result.aliasGroups).toEqual([['A', 'B']]);
    expect(result.message).toMatch(/cannot be separated/);
    expect(collectNonFiniteNumbers(result)).toEqual([]);
  });

  it('a constant factor is reported as not varied, not as aliased', () => {
    const result = estimateFactorEffects(['A', 'B'], [
      { levels: { A: -1, B: 0 }, responses: [5] },
      { levels: { A: 1, B: 0 }, responses: [7] },
      { levels: { A: 1, B: 0 }, responses: [8] },
    ]);
    expect(result.effects[1].constant).toBe(true);
    expect(result.effects[1].effectOverRange).toBeNull();
    expect(result.aliasGroups).toEqual([]);
    // By hand: mean at A = +1 is 7.5, at A = −1 is 5, so the effect over the range is 2.5.
    expect(result.effects[0].effectOverRange).toBeCloseTo(2.5, 10);
    expect(result.warnings.join(' ')).toMatch(/B: held one level/);
  });
});

describe('aliasing: effects that the runs cannot separate', () => {
  it('the issue\'s case: the base against one variant that changed sugar ratio and pectin dose together', () => {
    // Hand-worked: two runs (0.78, 6.0) and (0.65, 5.0); with an intercept the design has rank 2 but three
    // columns, and the two centred factor columns are proportional (−0.065, 0.065) and (−0.5, 0.5).
    const result = estimateFactorEffects(['sugar_ratio', 'pectin_dose'], [
      { label: 'Base', levels: { sugar_ratio: 0.78, pectin_dose: 6.0 }, responses: [6.5] },
      { label: 'B', levels: { sugar_ratio: 0.65, pectin_dose: 5.0 }, responses: [9.67] },
    ]);
    expect(result.aliasGroups).toEqual([['sugar_ratio', 'pectin_dose']]);
    expect(result.effects.every((e) => e.effectOverRange === null && e.standardErrorOverRange === null)).toBe(true);
    expect(result.effects[0].aliasedWith).toEqual(['pectin_dose']);
  });

  it('more factors than the runs can carry: all three are aliased, and a fourth orthogonal run set is not', () => {
    // Hand-worked: C = A + B in every run, so the centred columns are linearly dependent (rank 3 of 4 columns
    // with the intercept); no single factor's effect can be separated from the other two.
    const runs: FactorRun[] = [
      { levels: { A: 0, B: 0, C: 0 }, responses: [4] },
      { levels: { A: 1, B: 0, C: 1 }, responses: [6] },
      { levels: { A: 0, B: 1, C: 1 }, responses: [5] },
      { levels: { A: 1, B: 1, C: 2 }, responses: [8] },
    ];
    expect(estimateFactorEffects(['A', 'B', 'C'], runs).aliasGroups).toEqual([['A', 'B', 'C']]);
    // Drop C and the 2² design is orthogonal: nothing is aliased.
    expect(estimateFactorEffects(['A', 'B'], runs).aliasGroups).toEqual([]);
  });

  it('the 2^(3−1) half fraction with I = ABC aliases each main effect with a two-factor interaction', () => {
    // Source: Montgomery, Design and Analysis of Experiments, §8.2, the one-half fraction of the 2³ design
    // with defining relation I = ABC: runs a, b, c, abc, and the alias structure A = BC, B = AC, C = AB (memory).
    // Also NIST/SEMATECH e-Handbook of Statistical Methods, §5.3.3.4.1 (the 2^(3−1) design and its confounding).
    const runs = [
      { A: 1, B: -1, C: -1 }, // a
      { A: -1, B: 1, C: -1 }, // b
      { A: -1, B: -1, C: 1 }, // c
      { A: 1, B: 1, C: 1 }, // abc
    ];
    const column = (f: (r: (typeof runs)[number]) => number) => runs.map(f);
    const { groups, constant } = findAliasGroups({
      A: column((r) => r.A), B: column((r) => r.B), C: column((r) => r.C),
      AB: column((r) => r.A * r.B), AC: column((r) => r.A * r.C), BC: column((r) => r.B * r.C),
    });
    expect(constant).toEqual([]);
    const sorted = groups.map((g) => [...g].sort()).sort((x, y) => x[0].localeCompare(y[0]));
    expect(sorted).toEqual([['A', 'BC'], ['AB', 'C'], ['AC', 'B']]); // A = BC, C = AB, B = AC
    // The full 2³ factorial separates all six: nothing is aliased.
    const full = [-1, 1].flatMap((A) => [-1, 1].flatMap((B) => [-1, 1].map((C) => ({ A, B, C }))));
    const fullColumn = (f: (r: (typeof full)[number]) => number) => full.map(f);
    expect(findAliasGroups({
      A: fullColumn((r) => r.A), B: fullColumn((r) => r.B), C: fullColumn((r) => r.C),
      AB: fullColumn((r) => r.A * r.B), AC: fullColumn((r) => r.A * r.C), BC: fullColumn((r) => r.B * r.C),
    }).groups).toEqual([]);
  });
});
