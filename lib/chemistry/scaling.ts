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
  };
}

export function roundToStep(massG: number, stepG: number): number {
  return Math.round(massG / stepG) * stepG;
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
  const scaledLines: ScaledLine[] = resolved.map((line) => {
    const exactG = line.massG * scaleFactor;
    const roundedG = roundToStep(exactG, stepG);
    return {
      index: line.index,
      name: line.ingredient.name,
      exactG,
      roundedG,
      roundedInResolutionUnit: fromGrams(roundedG, resolution.unit),
      roundingErrorG: roundedG - exactG,
    };
  });

  const targetFraction = settings.targetSolidsPct / 100;
  const exactChargeG = base.totalChargeG * scaleFactor;
  const exactSolidsG = base.solubleSolidsInG * scaleFactor;
  const exactFinishedG = exactSolidsG / targetFraction;
  const roundedChargeG = scaledLines.reduce((t, l) => t + l.roundedG, 0);
  const roundedSolidsG = scaledLines.reduce((t, l, i) => t + l.roundedG * (resolved[i].ingredient.solidsPct / 100), 0);
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
    },
  };
}
