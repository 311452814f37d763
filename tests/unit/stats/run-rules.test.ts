import { describe, expect, it } from 'vitest';
import { RUN_RULE_SET, runRuleSignals, type RunRulePoint } from '@/lib/stats';

// Source: Western Electric Co., Statistical Quality Control Handbook (1956), tests for unnatural
// patterns — rule 1 (a point beyond the limits) and rule 4 (eight successive points on one side of
// the centre line). The sequences below are hand-worked against those two rules.
const window = (value: number): RunRulePoint => ({ value, min: 65, max: 67 }); // target 66
const BRIX = { resolution: 0.1 };

describe('run rules on a batch trend', () => {
  it('names the rule set and its source', () => {
    expect(RUN_RULE_SET).toMatch(/Western Electric rules 1 and 4/);
    expect(RUN_RULE_SET).toMatch(/1956/);
  });

  it('flags a point beyond either limit, limits inclusive', () => {
    const signals = runRuleSignals([65, 67, 67.1, 64.9, 66].map(window), BRIX);
    expect(signals).toEqual([
      { index: 2, rule: 'beyond_limits', message: 'Above the upper limit.' },
      { index: 3, rule: 'beyond_limits', message: 'Below the lower limit.' },
    ]);
  });

  it('flags the eighth point in a row on one side of target, and each one after it', () => {
    // Seven above target, then the eighth and ninth: flagged at indexes 7 and 8.
    const values = [66.2, 66.4, 66.1, 66.3, 66.5, 66.2, 66.1, 66.3, 66.4, 65.8];
    const runs = runRuleSignals(values.map(window), BRIX).filter((s) => s.rule === 'run_one_side');
    expect(runs.map((s) => s.index)).toEqual([7, 8]);
    expect(runs[0].message).toBe('8 in a row above target: the process has shifted.');
  });

  it('does not flag seven in a row, and a point on target breaks the run', () => {
    expect(runRuleSignals([65.5, 65.6, 65.4, 65.9, 65.2, 65.7, 65.8].map(window), BRIX)).toEqual([]);
    expect(runRuleSignals([65.5, 65.6, 65.4, 65.9, 66, 65.2, 65.7, 65.8, 65.1].map(window), BRIX)).toEqual([]);
  });

  it('judges each point against its own limits when a new version changes them', () => {
    // Same readings, but the last four were made to a version with a 66–68 window (target 67):
    // the run above 66 stops at the change, and no point is beyond its own limits.
    const points = [66.5, 66.5, 66.5, 66.5, 66.5, 66.5, 66.5, 66.5].map((value, i) => (i < 4 ? window(value) : { value, min: 66, max: 68 }));
    expect(runRuleSignals(points, BRIX)).toEqual([]);
  });

  it('counts a reading on target at its resolution as on target, floating point or not', () => {
    // pH window 2.9–3.3: (2.9 + 3.3) / 2 is 3.0999999999999996 in floating point. Twelve batches
    // at 3.10 are on target, not "12 in a row above target".
    const ph = (value: number): RunRulePoint => ({ value, min: 2.9, max: 3.3 });
    expect((2.9 + 3.3) / 2).not.toBe(3.1);
    expect(runRuleSignals(Array.from({ length: 12 }, () => ph(3.1)), { resolution: 0.01 })).toEqual([]);
    // 3.11 is a step above: eight of them are a run.
    const above = runRuleSignals(Array.from({ length: 8 }, () => ph(3.11)), { resolution: 0.01 });
    expect(above.map((s) => s.message)).toEqual(['8 in a row above target: the process has shifted.']);
  });

  it('keeps a reading half a step from a target between two steps off target', () => {
    // Window 64–66.5 °Brix: target 65.25; at 0.1 °Brix, 65.2 is below and 65.3 above, never on it.
    const w = (value: number): RunRulePoint => ({ value, min: 64, max: 66.5 });
    expect(runRuleSignals(Array.from({ length: 8 }, () => w(65.2)), BRIX).map((s) => s.index)).toEqual([7]);
    expect(runRuleSignals(Array.from({ length: 8 }, () => w(65.3)), BRIX).map((s) => s.index)).toEqual([7]);
  });

  it('refuses a resolution that is not a positive number', () => {
    expect(() => runRuleSignals([window(66)], { resolution: 0 })).toThrow(/resolution/);
  });
});
