/**
 * Run rules for a trend of batch readings: which points call for a look at the process.
 *
 * We use two of the Western Electric rules (Western Electric Co., Statistical Quality Control
 * Handbook, 1956; restated in Montgomery, Introduction to Statistical Quality Control, the section on
 * sensitizing rules for control charts):
 *   - rule 1: one point beyond the limits;
 *   - rule 4: eight points in a row on one side of the centre line.
 * The handbook's limits are 3-sigma control limits around the process mean. A kitchen's trend has
 * too few batches to estimate sigma, so the spec window stands in for the limits and its middle
 * (the target) for the centre line. The limits may step between points when a new version comes in;
 * each point is judged against its own. A point exactly on target breaks a run.
 */

export type RunRule = 'beyond_limits' | 'run_one_side';

export const RUN_RULE_SET = 'Western Electric rules 1 and 4 (Statistical Quality Control Handbook, 1956)';
/** Rule 4's run length. */
export const RUN_LENGTH = 8;

export const RUN_RULE_LABELS: Record<RunRule, string> = {
  beyond_limits: 'Beyond the limits',
  run_one_side: `${RUN_LENGTH} or more in a row on one side of target`,
};

export interface RunRulePoint {
  value: number;
  min: number;
  max: number;
}

export interface RunRuleSignal {
  /** Index of the flagged point. */
  index: number;
  rule: RunRule;
  /** Plain words for the screen. */
  message: string;
}

function sideOfTarget(p: RunRulePoint): -1 | 0 | 1 {
  const target = (p.min + p.max) / 2;
  return p.value > target ? 1 : p.value < target ? -1 : 0;
}

/** Signals in point order; a point can carry both rules. */
export function runRuleSignals(points: readonly RunRulePoint[], runLength = RUN_LENGTH): RunRuleSignal[] {
  const signals: RunRuleSignal[] = [];
  let runSide: -1 | 0 | 1 = 0;
  let runStart = 0;
  points.forEach((p, i) => {
    if (p.value > p.max || p.value < p.min) {
      signals.push({ index: i, rule: 'beyond_limits', message: p.value > p.max ? 'Above the upper limit.' : 'Below the lower limit.' });
    }
    const side = sideOfTarget(p);
    if (side === 0 || side !== runSide) {
      runSide = side;
      runStart = i;
    }
    const length = i - runStart + 1;
    if (runSide !== 0 && length >= runLength) {
      signals.push({
        index: i, rule: 'run_one_side',
        message: `${length} in a row ${runSide > 0 ? 'above' : 'below'} target: the process has shifted.`,
      });
    }
  });
  return signals;
}
