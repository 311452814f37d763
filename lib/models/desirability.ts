/**
 * Desirability functions (Derringer & Suich, "Simultaneous optimization of several response
 * variables", Journal of Quality Technology 12(4), 1980, 214–219). Each response's prediction ŷ is
 * mapped to d ∈ [0, 1]; d = 0 means unacceptable, d = 1 fully satisfactory.
 * - maximise: d = 0 for ŷ ≤ low; ((ŷ − low)/(high − low))^shape between; 1 for ŷ ≥ high.
 * - minimise: d = 1 for ŷ ≤ low; ((high − ŷ)/(high − low))^shape between; 0 for ŷ ≥ high.
 * - target (two-sided): ((ŷ − low)/(target − low))^lowerShape up to the target,
 *   ((high − ŷ)/(high − target))^upperShape above it, 0 outside [low, high].
 * - band: the two-sided function with its target widened to [bandLow, bandHigh] where d = 1
 *   (our extension, for "firmness within a band"; with bandLow = bandHigh it is the target form).
 * Shape 1 is linear; above 1 the response must come close to the goal before d rises; below 1 less so.
 * Overall: D = (Π dᵢ^wᵢ)^(1/Σwᵢ), the geometric mean weighted by importance wᵢ (Derringer, "A
 * balancing act: optimizing a product's properties", Quality Progress 27(6), 1994 — memory); with
 * equal importances it is the 1980 paper's unweighted geometric mean. Any dᵢ = 0 gives D = 0.
 */
import { ModelSpecError } from './terms';

export type Goal =
  | { kind: 'maximise'; low: number; high: number; shape?: number }
  | { kind: 'minimise'; low: number; high: number; shape?: number }
  | { kind: 'target'; low: number; target: number; high: number; lowerShape?: number; upperShape?: number }
  | { kind: 'band'; low: number; bandLow: number; bandHigh: number; high: number; lowerShape?: number; upperShape?: number };

function checkShape(shape: number | undefined): number {
  const value = shape ?? 1;
  if (!Number.isFinite(value) || value <= 0) throw new ModelSpecError('A shape exponent must be a positive number.');
  return value;
}

export function validateGoal(goal: Goal): void {
  const numbers = Object.values(goal).filter((v) => typeof v === 'number') as number[];
  if (numbers.some((v) => !Number.isFinite(v))) throw new ModelSpecError('Goal limits must be numbers.');
  if (goal.kind === 'maximise' || goal.kind === 'minimise') {
    if (!(goal.high > goal.low)) throw new ModelSpecError('The upper limit of a goal must be above its lower limit.');
    checkShape(goal.shape);
  } else {
    const [middleLow, middleHigh] = goal.kind === 'target' ? [goal.target, goal.target] : [goal.bandLow, goal.bandHigh];
    if (!(goal.low < middleLow && middleLow <= middleHigh && middleHigh < goal.high)) {
      throw new ModelSpecError('A target must lie strictly between the lower and upper limits.');
    }
    checkShape(goal.lowerShape);
    checkShape(goal.upperShape);
  }
}

/** d for one predicted response. */
export function desirability(goal: Goal, value: number): number {
  validateGoal(goal);
  switch (goal.kind) {
    case 'maximise':
      if (value <= goal.low) return 0;
      if (value >= goal.high) return 1;
      return ((value - goal.low) / (goal.high - goal.low)) ** checkShape(goal.shape);
    case 'minimise':
      if (value >= goal.high) return 0;
      if (value <= goal.low) return 1;
      return ((goal.high - value) / (goal.high - goal.low)) ** checkShape(goal.shape);
    default: {
      const [middleLow, middleHigh] = goal.kind === 'target' ? [goal.target, goal.target] : [goal.bandLow, goal.bandHigh];
      if (value <= goal.low || value >= goal.high) return 0;
      if (value < middleLow) return ((value - goal.low) / (middleLow - goal.low)) ** checkShape(goal.lowerShape);
      if (value > middleHigh) return ((goal.high - value) / (goal.high - middleHigh)) ** checkShape(goal.upperShape);
      return 1;
    }
  }
}

/** D = (Π dᵢ^wᵢ)^(1/Σwᵢ); importances default to 1. */
export function overallDesirability(parts: ReadonlyArray<{ desirability: number; importance?: number }>): number {
  if (parts.length === 0) return 0;
  let logSum = 0;
  let weightSum = 0;
  for (const part of parts) {
    const weight = part.importance ?? 1;
    if (!Number.isFinite(weight) || weight <= 0) throw new ModelSpecError('An importance must be a positive number.');
    if (!(part.desirability > 0)) return 0;
    logSum += weight * Math.log(Math.min(1, part.desirability));
    weightSum += weight;
  }
  return Math.exp(logSum / weightSum);
}
