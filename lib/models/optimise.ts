/**
 * Proposals: the factor settings with the highest overall desirability, never outside the data.
 *
 * Search: a coarse grid over the search box (at most GRID_BUDGET points), then Nelder–Mead
 * (Lagarias et al., SIAM J. Optim. 9(1), 1998: reflection 1, expansion 2, contraction ½, shrink ½)
 * from the best few grid points, in the box scaled to the unit cube and clamped to it. A point counts
 * only when every model's prediction is inside its data region (surface.ts: box and leverage rule)
 * and every constraint holds; elsewhere the search is scored below every allowed point, by how far
 * it is off, so it walks back in. Distinct optima are returned best first.
 */
import { ModelSpecError, type FactorRange } from './terms';
import { checkRegion, predictResponse, type RegionRules, type ResponseSurface } from './surface';
import { desirability, overallDesirability, validateGoal, type Goal } from './desirability';
import type { Interval } from './regression';

export interface ResponseGoal {
  /** The response's name, e.g. "overall liking". */
  name: string;
  surface: ResponseSurface;
  goal: Goal;
  /** Relative importance (default 1). */
  importance?: number;
}

export interface Constraint {
  name: string;
  /** 0 (or less) when the natural point satisfies it; otherwise how far it is broken. */
  violation(point: Readonly<Record<string, number>>): number;
}

/** Σ aᵢ·xᵢ ≤ bound (or ≥): e.g. a cost ceiling, or a fruit minimum from the factors. */
export function linearConstraint(
  name: string,
  coefficients: Readonly<Record<string, number>>,
  relation: '<=' | '>=',
  bound: number,
): Constraint {
  return {
    name,
    violation(point) {
      const value = Object.entries(coefficients).reduce((sum, [factor, a]) => sum + a * point[factor], 0);
      return relation === '<=' ? value - bound : bound - value;
    },
  };
}

/** low ≤ f(point) ≤ high for any computed quantity (the pH window, a sugar range, cost per jar). */
export function windowConstraint(
  name: string,
  compute: (point: Readonly<Record<string, number>>) => number,
  limits: { low?: number; high?: number },
): Constraint {
  return {
    name,
    violation(point) {
      const value = compute(point);
      if (!Number.isFinite(value)) return Number.POSITIVE_INFINITY;
      return Math.max(limits.low !== undefined ? limits.low - value : 0, limits.high !== undefined ? value - limits.high : 0);
    },
  };
}

/** Why no setting qualifies, naming the constraints no setting tried met (they are what to relax). */
function noSettingMeets(neverMet: readonly Constraint[]): string {
  const base = 'No setting inside the data meets every constraint.';
  return neverMet.length ? `${base} Not met at any setting tried: ${neverMet.map((c) => c.name).join('; ')}.` : base;
}

export interface PredictedResponse {
  name: string;
  estimate: number;
  confidence: Interval | null;
  prediction: Interval | null;
  desirability: number;
}

export interface Proposal {
  point: Record<string, number>;
  desirability: number;
  responses: PredictedResponse[];
}

export interface OptimiseInput {
  /** Factors to vary, with the bounds the user allows (natural units). */
  factors: readonly FactorRange[];
  goals: readonly ResponseGoal[];
  constraints?: readonly Constraint[];
  /** How many distinct proposals to return (default 3). */
  proposals?: number;
  /** Region rules beyond the box and leverage (surface.ts), e.g. the convex hull. */
  region?: RegionRules;
}

export interface OptimiseResult {
  proposals: Proposal[];
  /** The box searched: the allowed bounds within every model's data. */
  searchBox: FactorRange[];
  evaluations: number;
  /** Why there is no proposal, when there is none. */
  message: string | null;
}

const GRID_BUDGET = 1500;
/** With more factors even two grid levels each exceed the budget. */
const MAX_SEARCH_FACTORS = 8;
const STARTS = 4;
/** Proposals closer than this (unit-cube distance) are the same optimum. */
const DISTINCT = 0.05;

type Evaluation = { score: number; feasible: boolean; desirability: number };

function searchBoxOf(input: OptimiseInput): FactorRange[] {
  return input.factors.map((range) => {
    let low = range.low;
    let high = range.high;
    for (const { surface } of input.goals) {
      const box = surface.dataBox.find((r) => r.name === range.name);
      if (box) {
        low = Math.max(low, box.low);
        high = Math.min(high, box.high);
      }
    }
    return { name: range.name, low, high };
  });
}

function nelderMead(f: (x: number[]) => number, start: number[], step: number, maxEvaluations: number): { x: number[]; value: number; evaluations: number } {
  const n = start.length;
  const clamp = (x: number[]) => x.map((v) => Math.min(1, Math.max(0, v)));
  let evaluations = 0;
  const value = (x: number[]) => {
    evaluations++;
    return f(x);
  };
  let simplex = [clamp(start)];
  for (let i = 0; i < n; i++) {
    const vertex = [...start];
    vertex[i] += vertex[i] + step <= 1 ? step : -step;
    simplex.push(clamp(vertex));
  }
  let values = simplex.map(value);
  while (evaluations < maxEvaluations) {
    const order = values.map((_, i) => i).sort((a, b) => values[a] - values[b]);
    simplex = order.map((i) => simplex[i]);
    values = order.map((i) => values[i]);
    const spread = Math.max(...simplex.slice(1).map((v) => Math.max(...v.map((x, i) => Math.abs(x - simplex[0][i])))));
    if (spread < 1e-6 && Math.abs(values[n] - values[0]) < 1e-10) break;
    const centroid = Array.from({ length: n }, (_, i) => simplex.slice(0, n).reduce((s, v) => s + v[i], 0) / n);
    const along = (t: number) => clamp(centroid.map((c, i) => c + t * (simplex[n][i] - c)));
    const reflected = along(-1);
    const fr = value(reflected);
    if (fr < values[0]) {
      const expanded = along(-2);
      const fe = value(expanded);
      [simplex[n], values[n]] = fe < fr ? [expanded, fe] : [reflected, fr];
    } else if (fr < values[n - 1]) {
      [simplex[n], values[n]] = [reflected, fr];
    } else {
      const outside = fr < values[n];
      const contracted = along(outside ? -0.5 : 0.5);
      const fc = value(contracted);
      if (fc < (outside ? fr : values[n])) {
        [simplex[n], values[n]] = [contracted, fc];
      } else {
        for (let i = 1; i <= n; i++) {
          simplex[i] = clamp(simplex[i].map((x, k) => simplex[0][k] + 0.5 * (x - simplex[0][k])));
          values[i] = value(simplex[i]);
        }
      }
    }
  }
  const best = values.indexOf(Math.min(...values));
  return { x: simplex[best], value: values[best], evaluations };
}

export function optimise(input: OptimiseInput): OptimiseResult {
  if (input.goals.length === 0) throw new ModelSpecError('State at least one goal.');
  if (input.factors.length === 0) throw new ModelSpecError('Choose at least one factor to vary.');
  if (input.factors.length > MAX_SEARCH_FACTORS) throw new ModelSpecError(`The search varies at most ${MAX_SEARCH_FACTORS} factors at once.`);
  input.goals.forEach((g) => validateGoal(g.goal));
  for (const { surface, name } of input.goals) {
    for (const factor of surface.factors) {
      if (!input.factors.some((f) => f.name === factor)) throw new ModelSpecError(`The model of ${name} needs ${factor} among the factors.`);
    }
  }
  const wanted = input.proposals ?? 3;
  const constraints = input.constraints ?? [];
  const searchBox = searchBoxOf(input);
  const empty = searchBox.find((r) => !(r.high >= r.low));
  if (empty) return { proposals: [], searchBox, evaluations: 0, message: `The allowed range of ${empty.name} lies outside the data.` };

  const toNatural = (unit: readonly number[]): Record<string, number> => {
    const point: Record<string, number> = Object.create(null);
    searchBox.forEach((r, i) => {
      point[r.name] = r.low + unit[i] * (r.high - r.low);
    });
    return point;
  };
  let evaluations = 0;
  // The constraints some evaluated setting met: one no setting met is named when nothing qualifies.
  const everMet = new Set<Constraint>();
  const evaluate = (unit: readonly number[]): Evaluation => {
    evaluations++;
    const point = toNatural(unit);
    let offBy = 0;
    const parts: { desirability: number; importance?: number }[] = [];
    for (const g of input.goals) {
      const region = checkRegion(g.surface, point, input.region);
      if (!region.inRegion) {
        // Outside: score by how far past the largest leverage (or the box) the point is.
        offBy += region.leverage === null ? 1 : Math.max(1e-6, region.leverage - g.surface.fit.basis.maxLeverage);
        continue;
      }
      parts.push({ desirability: desirability(g.goal, region.estimate), importance: g.importance });
    }
    for (const c of constraints) {
      const violation = c.violation(point);
      if (violation <= 0) everMet.add(c);
      else offBy += violation;
    }
    if (offBy > 0) return { score: -1 - offBy, feasible: false, desirability: 0 };
    const d = overallDesirability(parts);
    return { score: d, feasible: true, desirability: d };
  };

  // Coarse grid: g levels per factor with g^k ≤ the budget.
  const k = searchBox.length;
  const levels = Math.max(2, Math.min(21, Math.floor(GRID_BUDGET ** (1 / k))));
  const grid: { unit: number[]; evaluation: Evaluation }[] = [];
  const total = levels ** k;
  for (let index = 0; index < total; index++) {
    let rest = index;
    const unit = Array.from({ length: k }, () => {
      const level = rest % levels;
      rest = Math.floor(rest / levels);
      return level / (levels - 1);
    });
    grid.push({ unit, evaluation: evaluate(unit) });
  }
  grid.sort((a, b) => b.evaluation.score - a.evaluation.score);
  const starts: number[][] = [];
  for (const candidate of grid) {
    if (starts.length >= STARTS) break;
    if (starts.every((s) => distance(s, candidate.unit) > 1.5 / (levels - 1))) starts.push(candidate.unit);
  }

  const found: { unit: number[]; evaluation: Evaluation }[] = [];
  for (const start of starts) {
    const result = nelderMead((x) => -evaluate(x).score, start, 0.5 / (levels - 1), 100 * k);
    found.push({ unit: result.x, evaluation: evaluate(result.x) });
  }
  // The grid's own best points stay candidates too (Nelder–Mead may stall on a flat D = 1 plateau).
  found.push(...grid.slice(0, STARTS));
  found.sort((a, b) => b.evaluation.score - a.evaluation.score);

  const distinct: typeof found = [];
  for (const candidate of found) {
    if (!candidate.evaluation.feasible || candidate.evaluation.desirability <= 0) continue;
    if (distinct.every((d) => distance(d.unit, candidate.unit) > DISTINCT)) distinct.push(candidate);
    if (distinct.length >= wanted) break;
  }
  const proposals = distinct.map(({ unit, evaluation }) => {
    const point = toNatural(unit);
    return {
      point,
      desirability: evaluation.desirability,
      responses: input.goals.map((g) => {
        const prediction = predictResponse(g.surface, point, input.region);
        if (!prediction.inRegion) throw new Error('A proposal left the data region.');
        return {
          name: g.name,
          estimate: prediction.estimate,
          confidence: prediction.confidence,
          prediction: prediction.prediction,
          desirability: desirability(g.goal, prediction.estimate),
        };
      }),
    };
  });
  const anyFeasible = grid.some((g) => g.evaluation.feasible) || found.some((f) => f.evaluation.feasible);
  const message = proposals.length > 0
    ? null
    : anyFeasible
      ? 'Inside the data and the constraints, some response is always outside its acceptable limits.'
      : noSettingMeets(constraints.filter((c) => !everMet.has(c)));
  return { proposals, searchBox, evaluations, message };
}

function distance(a: readonly number[], b: readonly number[]): number {
  return Math.sqrt(a.reduce((s, v, i) => s + (v - b[i]) ** 2, 0));
}
