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
 * each point is judged against its own. A point on target breaks a run: "on target" means the
 * reading cannot be told from the target at the resolution it is read to (within half a step; pH
 * to 0.01, so 3.10 is on the target of a 2.9–3.3 window, which is 3.0999999999999996 in floating
 * point). Applying the handbook's centre line at the reading's resolution is our reading of it.
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

export interface RunRuleOptions {
  /** The step the readings are read to, e.g. 0.01 for pH, 0.1 for °Brix. */
  resolution: number;
  runLength?: number;
}

/** The side of target in steps of the resolution; the margin keeps a reading half a step away (65.2 against 65.25) off target despite floating point. */
function sideOfTarget(p: RunRulePoint, resolution: number): -1 | 0 | 1 {
  const steps = (p.value - (p.min + p.max) / 2) / resolution;
  return Math.abs(steps) < 0.5 - 1e-6 ? 0 : steps > 0 ? 1 : -1;
}

/** Signals in point order; a point can carry both rules. */
export function runRuleSignals(points: readonly RunRulePoint[], { resolution, runLength = RUN_LENGTH }: RunRuleOptions): RunRuleSignal[] {
  if (!(resolution > 0) || !Number.isFinite(resolution)) throw new RangeError('The resolution of the readings must be a positive number.');
  const signals: RunRuleSignal[] = [];
  let runSide: -1 | 0 | 1 = 0;
  let runStart = 0;
  points.forEach((p, i) => {
    if (p.value > p.max || p.value < p.min) {
      signals.push({ index: i, rule: 'beyond_limits', message: p.value > p.max ? 'Above the upper limit.' : 'Below the lower limit.' });
    }
    const side = sideOfTarget(p, resolution);
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
