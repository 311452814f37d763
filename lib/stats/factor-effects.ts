/**
 * Main effects of formula factors (e.g. pectin dose, acid dose) on a response,
 * estimated by least squares: y = b0 + Σ bᵢ·xᵢ + ε, main effects only.
 *
 * Levels may be coded (−1/+1, optional centre 0) or actual numbers (e.g. pectinPercent).
 * Each factor's column is centred before fitting (conditioning; the slopes do not change).
 * Reported per factor:
 * - `coefficientPerUnit`: the slope bᵢ per unit of the level as given;
 * - `effectOverRange`: bᵢ × (highest − lowest level), which for −1/+1 coding is the
 *   classical effect "mean at high − mean at low" (Montgomery, ch. 6).
 * Standard errors need residual df > 0; a saturated design says so instead.
 *
 * Factors whose columns are linearly dependent (changed together, or more factors than the runs can
 * carry: the design matrix has lower rank than it has columns) are aliased: no slope is reported for
 * any of them, and `aliasGroups` names which ones cannot be told apart, instead of crediting the
 * whole difference to whichever came first.
 */
import { fitLeastSquares } from './least-squares';
import { stableMean, studentTTwoSided } from './numeric';

export interface FactorRun {
  /** Variant label. */
  label?: string;
  /** Level of each factor for this variant. */
  levels: Readonly<Record<string, number>>;
  /** One response (variant mean) or several observations for this variant. */
  responses: readonly number[];
}

export interface FactorEffect {
  factor: string;
  lowestLevel: number;
  highestLevel: number;
  coefficientPerUnit: number | null;
  standardErrorPerUnit: number | null;
  effectOverRange: number | null;
  standardErrorOverRange: number | null;
  t: number | null;
  /** Two-sided p from t with the residual df. */
  p: number | null;
  /** The other factors this one cannot be separated from (empty when it is estimable). */
  aliasedWith: string[];
  /** True when the factor held one level in every run analysed. */
  constant: boolean;
}

export interface FactorEffectsResult {
  effects: FactorEffect[];
  /** Fitted response at the mean level of every factor. */
  responseAtCentre: number | null;
  observationCount: number;
  residualDf: number;
  residualMeanSquare: number | null;
  saturated: boolean;
  /** Groups of factors whose effects cannot be separated with these runs (each group ≥ 2 factors). */
  aliasGroups: string[][];
  warnings: string[];
  message: string | null;
}

/** Relative size below which a regression weight counts as zero when tracing an alias. */
const ALIAS_TOLERANCE = 1e-8;

/**
 * Which named columns of a design cannot be estimated separately. Each column is centred (the model
 * has an intercept); a column that is a linear combination of others is linked to every column
 * with a non-zero weight in that combination, and linked columns form one group. Constant columns
 * are reported apart: they did not vary, so there is nothing to alias.
 */
export function findAliasGroups(columns: Readonly<Record<string, readonly number[]>>): { groups: string[][]; constant: string[] } {
  const names = Object.keys(columns);
  const n = names.length ? columns[names[0]].length : 0;
  const centred = names.map((name) => {
    const values = columns[name];
    const mean = stableMean([...values]);
    return values.map((v) => v - mean);
  });
  const norms = centred.map((c) => Math.sqrt(c.reduce((sum, v) => sum + v * v, 0)));
  const rows = Array.from({ length: n }, (_, i) => [1, ...centred.map((c) => c[i])]);
  const fit = fitLeastSquares(rows, new Array<number>(n).fill(0));
  const constant = names.filter((_, j) => norms[j] === 0 || norms[j] <= ALIAS_TOLERANCE * Math.max(...norms));
  const parent = names.map((_, j) => j);
  const root = (j: number): number => (parent[j] === j ? j : (parent[j] = root(parent[j])));
  const linked = new Set<number>();
  const accepted = names.map((_, j) => j).filter((j) => !fit.aliased[j + 1]);
  names.forEach((name, j) => {
    if (!fit.aliased[j + 1] || constant.includes(name)) return;
    // Express column j through the estimable columns: every one with a weight is aliased with it.
    const weights = fitLeastSquares(rows.map((r) => [r[0], ...accepted.map((k) => r[k + 1])]), centred[j]).coefficients;
    accepted.forEach((k, index) => {
      const w = weights[index + 1];
      if (w !== null && Math.abs(w) * norms[k] > ALIAS_TOLERANCE * norms[j]) {
        parent[root(k)] = root(j);
        linked.add(j).add(k);
      }
    });
  });
  const groups = new Map<number, string[]>();
  for (const j of [...linked].sort((a, b) => a - b)) {
    const key = root(j);
    groups.set(key, [...(groups.get(key) ?? []), names[j]]);
  }
  return { groups: [...groups.values()].filter((g) => g.length > 1), constant };
}

/** Estimate main effects of `factors` from the runs. */
export function estimateFactorEffects(factors: readonly string[], runs: readonly FactorRun[]): FactorEffectsResult {
  const warnings: string[] = [];
  const rows: { levels: number[]; y: number }[] = [];
  runs.forEach((run, index) => {
    const name = run.label ?? `run ${index + 1}`;
    const levels = factors.map((f) => run.levels[f]);
    if (levels.some((l) => typeof l !== 'number' || !Number.isFinite(l))) {
      warnings.push(`${name}: a factor level is missing, run left out.`);
      return;
    }
    for (const y of run.responses) {
      if (Number.isFinite(y)) rows.push({ levels, y });
    }
  });
  const n = rows.length;
  const emptyEffects = (): FactorEffect[] =>
    factors.map((factor, j) => {
      const values = rows.map((r) => r.levels[j]);
      return {
        factor,
        lowestLevel: values.length ? Math.min(...values) : 0,
        highestLevel: values.length ? Math.max(...values) : 0,
        coefficientPerUnit: null,
        standardErrorPerUnit: null,
        effectOverRange: null,
        standardErrorOverRange: null,
        t: null,
        p: null,
        aliasedWith: [],
        constant: false,
      };
    });
  if (n === 0 || factors.length === 0) {
    return {
      effects: emptyEffects(),
      responseAtCentre: null,
      observationCount: n,
      residualDf: 0,
      residualMeanSquare: null,
      saturated: false,
      aliasGroups: [],
      warnings,
      message: n === 0 ? 'No responses to analyse.' : 'No factors given.',
    };
  }
  const yMean = stableMean(rows.map((r) => r.y));
  const levelMeans = factors.map((_, j) => stableMean(rows.map((r) => r.levels[j])));
  const design = rows.map((r) => [1, ...r.levels.map((l, j) => l - levelMeans[j])]);
  const fit = fitLeastSquares(
    design,
    rows.map((r) => r.y - yMean),
  );
  const aliasing = findAliasGroups(Object.fromEntries(factors.map((f, j) => [f, rows.map((r) => r.levels[j])])));
  const groupOf = (factor: string) => aliasing.groups.find((g) => g.includes(factor));
  const residualDf = fit.residualDf;
  const saturated = residualDf === 0;
  const residualMeanSquare = residualDf > 0 ? fit.residualSumOfSquares / residualDf : null;
  let message: string | null = null;
  if (saturated) {
    message = 'The design is saturated (no residual degrees of freedom): effects are estimated but their standard errors cannot be.';
  }
  if (residualMeanSquare === 0) warnings.push('The model fits every response exactly: standard errors are zero.');
  for (const group of aliasing.groups) {
    warnings.push(`${group.join(', ')}: changed together in these runs, so their effects cannot be separated.`);
  }
  if (aliasing.groups.length) {
    message = `Some factors changed together in the runs analysed (${aliasing.groups.map((g) => g.join(' with ')).join('; ')}): their effects cannot be separated.`;
  }

  const effects = emptyEffects().map((effect, j) => {
    const column = j + 1;
    const coefficient = fit.coefficients[column];
    if (aliasing.constant.includes(effect.factor)) {
      warnings.push(`${effect.factor}: held one level in every run, so its effect cannot be estimated.`);
      return { ...effect, constant: true };
    }
    const group = groupOf(effect.factor);
    // A slope for one member of an aliased group is the sum of the group's effects: report none.
    if (group) return { ...effect, aliasedWith: group.filter((f) => f !== effect.factor) };
    if (coefficient === null) return effect;
    const range = effect.highestLevel - effect.lowestLevel;
    const se = residualMeanSquare === null ? null : Math.sqrt(residualMeanSquare * fit.unscaledCovariance[column][column]);
    const t = se !== null && se > 0 ? coefficient / se : null;
    return {
      ...effect,
      coefficientPerUnit: coefficient,
      standardErrorPerUnit: se,
      effectOverRange: coefficient * range,
      standardErrorOverRange: se === null ? null : se * range,
      t,
      p: t === null ? null : studentTTwoSided(t, residualDf),
    };
  });
  const intercept = fit.coefficients[0];
  return {
    effects,
    responseAtCentre: intercept === null ? null : intercept + yMean,
    observationCount: n,
    residualDf,
    residualMeanSquare,
    saturated,
    aliasGroups: aliasing.groups,
    warnings,
    message,
  };
}
