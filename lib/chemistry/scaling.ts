import { ChemistryInputError, requireFiniteNumber } from './errors';
import { computeMassBalance, jarsFromFinishedMass, resolveLines } from './mass-balance';
import { fromGrams, toGrams } from './units';
import type { FormulaLineInput, FormulaSettings, MassUnit } from './types';

export type ScaleTarget =
  | { kind: 'total_charge'; mass: number; unit: MassUnit }
  | { kind: 'finished_mass'; mass: number; unit: MassUnit }
  | { kind: 'jar_count'; jars: number };

/** Scale resolution, e.g. { step: 5, unit: 'g' } or { step: 0.01, unit: 'lb' }. */
export interface ScaleResolution {
  step: number;
  unit: MassUnit;
}

export interface ScaledLine {
  index: number;
  name: string;
  exactG: number;
  roundedG: number;
  /** Rounded weight expressed in the resolution unit, e.g. 2.35 (lb). */
  roundedInResolutionUnit: number;
  /** rounded − exact, g. */
  roundingErrorG: number;
  /** The step this line is weighed to, g: the scale's, or a finer one for a small addition (lineStepG). */
  stepG: number;
  /** The same step in the resolution unit, e.g. 0.01 (g). */
  stepInResolutionUnit: number;
  /** Weighed on a finer step than the scale's. */
  finerStep: boolean;
  /** rounded − exact as a share of exact, %; null for a line of 0 g. */
  roundingErrorPct: number | null;
}

/** A line whose rounded weight is off its exact weight by more than ROUNDING_SHARE_LIMIT. */
export interface NoticeableRounding {
  index: number;
  name: string;
  roundingErrorPct: number;
}

export interface ScaledFormula {
  scaleFactor: number;
  resolution: ScaleResolution;
  lines: ScaledLine[];
  exact: { totalChargeG: number; solubleSolidsInG: number; finishedMassG: number; jarsFilled: number };
  rounded: { totalChargeG: number; solubleSolidsInG: number; finishedMassG: number; jarsFilled: number };
  effectOfRounding: {
    totalChargeDeltaG: number;
    solubleSolidsDeltaG: number;
    /** Cooking the rounded batch to the same target solids changes the finished mass by this. */
    finishedMassDeltaG: number;
    /** Evaporating the planned water instead would leave this finished solids %, not the target. */
    solidsPctIfPlannedEvaporation: number;
    solidsPctDeltaIfPlannedEvaporation: number;
    /** Lines rounding still moves by more than ROUNDING_SHARE_LIMIT (only those too small for the finest step). */
    noticeableLines: NoticeableRounding[];
  };
}

/**
 * The largest share of a line's mass that rounding may move it by, worst case (half a step). The
 * scale's step suits the fruit and sugar; a small addition (acid, pectin, preservative) it would move
 * further is weighed on a finer step. 2 % is common practice, no published source.
 */
export const ROUNDING_SHARE_LIMIT = 0.02;
/** The finest step a finer weighing goes to: a 0.01 g bench scale. Common practice, no published source. */
export const FINEST_STEP_G = 0.01;

export function roundToStep(massG: number, stepG: number): number {
  return Math.round(massG / stepG) * stepG;
}

/**
 * The step a line is weighed to: the scale's step when half of it is within ROUNDING_SHARE_LIMIT of
 * the line's mass; otherwise the coarsest power of ten of the scale's unit below the step that is
 * (5 g → 1 g → 0.1 g → 0.01 g; 0.05 lb → 0.01 lb → 0.001 lb …), never below FINEST_STEP_G. A line
 * too small even for that is weighed to the finest step, and the effect of rounding names it.
 */
export function lineStepG(exactG: number, stepG: number, unit: MassUnit): number {
  const fits = (candidateG: number) => candidateG / 2 <= ROUNDING_SHARE_LIMIT * exactG;
  if (exactG <= 0 || fits(stepG)) return stepG;
  const step = fromGrams(stepG, unit);
  let finest = stepG;
  // Strictly below the step: 1 g is the step below 5 g, 0.1 g the one below 1 g.
  for (let power = Math.floor(Math.log10(step) - 1e-9); ; power -= 1) {
    const candidateG = toGrams(10 ** power, unit);
    if (candidateG < FINEST_STEP_G * (1 - 1e-9)) return finest;
    finest = candidateG;
    if (fits(candidateG)) return candidateG;
  }
}

/** The line rounded to its step; a line with any mass never rounds to nothing (it takes one step). */
function roundLine(exactG: number, stepG: number): number {
  const rounded = roundToStep(exactG, stepG);
  return rounded === 0 && exactG > 0 ? stepG : rounded;
}

export function scaleFormula(
  lines: FormulaLineInput[],
  settings: FormulaSettings,
  target: ScaleTarget,
  resolution: ScaleResolution,
): ScaledFormula {
  const base = computeMassBalance(lines, settings);
  const step = requireFiniteNumber(resolution?.step, 'resolution.step');
  if (step <= 0) throw new ChemistryInputError('resolution.step', 'scale resolution must be positive');
  const stepG = toGrams(step, resolution.unit);

  let scaleFactor: number;
  if (target.kind === 'jar_count') {
    const jars = requireFiniteNumber(target.jars, 'target.jars');
    if (jars <= 0 || !Number.isInteger(jars)) throw new ChemistryInputError('target.jars', 'jar count must be a positive whole number');
    scaleFactor = (jars * settings.jarNetFillG) / base.finishedMassG;
  } else {
    const mass = requireFiniteNumber(target.mass, 'target.mass');
    if (mass <= 0) throw new ChemistryInputError('target.mass', 'target mass must be positive');
    const targetG = toGrams(mass, target.unit);
    scaleFactor = targetG / (target.kind === 'total_charge' ? base.totalChargeG : base.finishedMassG);
  }

  const resolved = resolveLines(lines);
  const targetFraction = settings.targetSolidsPct / 100;
  const solidsShare = (i: number) => resolved[i].ingredient.solidsPct / 100;
  const weighed = resolved.map((line) => {
    const exactG = line.massG * scaleFactor;
    const lineStep = lineStepG(exactG, stepG, resolution.unit);
    return { exactG, stepG: lineStep, roundedG: roundLine(exactG, lineStep) };
  });
  const solidsOf = () => weighed.reduce((t, l, i) => t + l.roundedG * solidsShare(i), 0);

  if (target.kind === 'jar_count') {
    // The jars asked for must fill: lines rounded down are rounded up instead, the line giving the
    // most solids first, until the rounded batch (cooked to the target) fills them.
    const roundedDown = weighed
      .map((l, i) => ({ i, solidsG: l.exactG * solidsShare(i) }))
      .filter(({ i }) => weighed[i].roundedG < weighed[i].exactG && solidsShare(i) > 0)
      .sort((a, b) => b.solidsG - a.solidsG);
    for (const { i } of roundedDown) {
      if (jarsFromFinishedMass(solidsOf() / targetFraction, settings.jarNetFillG) >= target.jars) break;
      weighed[i].roundedG += weighed[i].stepG;
    }
  }

  const scaledLines: ScaledLine[] = resolved.map((line, i) => {
    const { exactG, stepG: lineStep, roundedG } = weighed[i];
    return {
      index: line.index,
      name: line.ingredient.name,
      exactG,
      roundedG,
      roundedInResolutionUnit: fromGrams(roundedG, resolution.unit),
      roundingErrorG: roundedG - exactG,
      stepG: lineStep,
      stepInResolutionUnit: fromGrams(lineStep, resolution.unit),
      finerStep: lineStep < stepG,
      roundingErrorPct: exactG > 0 ? ((roundedG - exactG) / exactG) * 100 : null,
    };
  });

  const exactChargeG = base.totalChargeG * scaleFactor;
  const exactSolidsG = base.solubleSolidsInG * scaleFactor;
  const exactFinishedG = exactSolidsG / targetFraction;
  const roundedChargeG = scaledLines.reduce((t, l) => t + l.roundedG, 0);
  const roundedSolidsG = solidsOf();
  const roundedFinishedG = roundedSolidsG / targetFraction;
  const plannedEvaporationG = exactChargeG - exactFinishedG;
  const massAfterPlannedEvaporationG = roundedChargeG - plannedEvaporationG;
  const solidsPctIfPlannedEvaporation = (roundedSolidsG / massAfterPlannedEvaporationG) * 100;

  return {
    scaleFactor,
    resolution,
    lines: scaledLines,
    exact: {
      totalChargeG: exactChargeG,
      solubleSolidsInG: exactSolidsG,
      finishedMassG: exactFinishedG,
      jarsFilled: jarsFromFinishedMass(exactFinishedG, settings.jarNetFillG),
    },
    rounded: {
      totalChargeG: roundedChargeG,
      solubleSolidsInG: roundedSolidsG,
      finishedMassG: roundedFinishedG,
      jarsFilled: jarsFromFinishedMass(roundedFinishedG, settings.jarNetFillG),
    },
    effectOfRounding: {
      totalChargeDeltaG: roundedChargeG - exactChargeG,
      solubleSolidsDeltaG: roundedSolidsG - exactSolidsG,
      finishedMassDeltaG: roundedFinishedG - exactFinishedG,
      solidsPctIfPlannedEvaporation,
      solidsPctDeltaIfPlannedEvaporation: solidsPctIfPlannedEvaporation - settings.targetSolidsPct,
      noticeableLines: scaledLines.flatMap((l) =>
        l.roundingErrorPct !== null && Math.abs(l.roundingErrorPct) > ROUNDING_SHARE_LIMIT * 100 * (1 + 1e-9)
          ? [{ index: l.index, name: l.name, roundingErrorPct: l.roundingErrorPct }]
          : []),
    },
  };
}
