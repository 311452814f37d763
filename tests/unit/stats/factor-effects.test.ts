import { describe, expect, it } from 'vitest';
import { estimateFactorEffects, type FactorRun } from '@/lib/stats';
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

  it('constant or confounded factor: flagged, no NaN', () => {
    const result = estimateFactorEffects(['A', 'B'], [
      { levels: { A: -1, B: -1 }, responses: [5, 6] },
      { levels: { A: 1, B: 1 }, responses: [7, 8] },
    ]);
    expect(result.effects[1].coefficientPerUnit).toBeNull();
    expect(result.warnings.join(' ')).toMatch(/B: its levels are constant or confounded/);
    expect(collectNonFiniteNumbers(result)).toEqual([]);
  });
});
