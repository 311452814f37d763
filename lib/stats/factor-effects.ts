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
}

export interface FactorEffectsResult {
  effects: FactorEffect[];
  /** Fitted response at the mean level of every factor. */
  responseAtCentre: number | null;
  observationCount: number;
  residualDf: number;
  residualMeanSquare: number | null;
  saturated: boolean;
  warnings: string[];
  message: string | null;
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
  const residualDf = fit.residualDf;
  const saturated = residualDf === 0;
  const residualMeanSquare = residualDf > 0 ? fit.residualSumOfSquares / residualDf : null;
  let message: string | null = null;
  if (saturated) {
    message = 'The design is saturated (no residual degrees of freedom): effects are estimated but their standard errors cannot be.';
  }
  if (residualMeanSquare === 0) warnings.push('The model fits every response exactly: standard errors are zero.');

  const effects = emptyEffects().map((effect, j) => {
    const column = j + 1;
    const coefficient = fit.coefficients[column];
    if (coefficient === null) {
      warnings.push(
        `${effect.factor}: its levels are constant or confounded with other factors, so its effect cannot be estimated.`,
      );
      return effect;
    }
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
    warnings,
    message,
  };
}
