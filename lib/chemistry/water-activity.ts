import { ChemistryInputError, requireFiniteNumber } from './errors';
import type { ResolvedLine } from './mass-balance';

export type ModelledSolute = 'sucrose' | 'glucose' | 'fructose';

/** Molar masses, g/mol. */
export const WATER_MOLAR_MASS = 18.015;
export const SOLUTE_MOLAR_MASS: Record<ModelledSolute, number> = {
  sucrose: 342.3,
  glucose: 180.16,
  fructose: 180.16,
};

/**
 * Norrish constants K. Sucrose 6.47 (Chirife et al. 1980, memory). Glucose and fructose 2.25
 * (same source, memory). The K table of Chirife et al. was searched for but not found, so these
 * stay recalled; the 65 % sucrose result is checked against Beuchat's measured aw instead.
 */
export const NORRISH_K: Record<ModelledSolute, number> = {
  sucrose: 6.47,
  glucose: 2.25,
  fructose: 2.25,
};

export interface WaterActivityEstimate {
  aw: number;
  model: string;
  isEstimate: true;
}

/** Norrish: aw = x_w · exp(−K · x_s²) for one solute in water. */
export function norrishBinaryAw(soluteMassG: number, waterMassG: number, solute: ModelledSolute): number {
  requireFiniteNumber(soluteMassG, 'soluteMassG');
  requireFiniteNumber(waterMassG, 'waterMassG');
  if (soluteMassG < 0) throw new ChemistryInputError('soluteMassG', 'solute mass cannot be negative');
  if (waterMassG <= 0) throw new ChemistryInputError('waterMassG', 'water mass must be positive');
  const soluteMol = soluteMassG / SOLUTE_MOLAR_MASS[solute];
  const waterMol = waterMassG / WATER_MOLAR_MASS;
  const soluteFraction = soluteMol / (soluteMol + waterMol);
  return (1 - soluteFraction) * Math.exp(-NORRISH_K[solute] * soluteFraction * soluteFraction);
}

/** aw of a sucrose solution at `solidsPct` % w/w. */
export function sucroseSolutionAw(solidsPct: number): WaterActivityEstimate {
  requireFiniteNumber(solidsPct, 'solidsPct');
  if (solidsPct < 0 || solidsPct >= 100) throw new ChemistryInputError('solidsPct', 'solids must be at least 0 and below 100 %');
  return { aw: norrishBinaryAw(solidsPct, 100 - solidsPct, 'sucrose'), model: 'Norrish (sucrose)', isEstimate: true };
}

export interface SoluteAmount {
  solute: ModelledSolute;
  massG: number;
}

/**
 * Ross's rule: aw of the mixture = product of each solute's binary aw, each computed at its own
 * molality in the total water of the mixture.
 */
export function rossMixtureAw(solutes: SoluteAmount[], waterMassG: number): WaterActivityEstimate {
  if (solutes.length === 0) throw new ChemistryInputError('solutes', 'at least one solute is needed');
  let aw = 1;
  solutes.forEach((s, i) => {
    if (s.massG < 0) throw new ChemistryInputError(`solutes[${i}].massG`, 'solute mass cannot be negative');
    if (s.massG > 0) aw *= norrishBinaryAw(s.massG, waterMassG, s.solute);
  });
  const kinds = [...new Set(solutes.filter((s) => s.massG > 0).map((s) => s.solute))];
  const model = kinds.length === 1 && kinds[0] === 'sucrose'
    ? 'Norrish (sucrose)'
    : `Ross rule over Norrish binaries (${kinds.join(', ')})`;
  return { aw, model, isEstimate: true };
}

/**
 * How each ingredient's soluble solids are modelled. These are simplifications, which is why
 * every result is flagged as an estimate:
 * - fruit solids are mostly glucose and fructose: modelled as invert (half each);
 * - invert sugar and honey: half glucose, half fructose;
 * - glucose syrup (DE ~42) holds oligosaccharides of high mean molar mass: modelled as sucrose,
 *   which is closer than glucose would be;
 * - pectin, acid and 'other' solids: modelled as sucrose (small masses).
 * Inversion of sucrose during boiling is ignored; it lowers aw slightly, so the estimate errs high.
 */
export function solutesFromLines(lines: ResolvedLine[]): SoluteAmount[] {
  const totals: Record<ModelledSolute, number> = { sucrose: 0, glucose: 0, fructose: 0 };
  for (const line of lines) {
    const solidsG = line.solidsG;
    if (solidsG <= 0) continue;
    const ingredient = line.ingredient;
    if (ingredient.kind === 'fruit') {
      totals.glucose += solidsG / 2;
      totals.fructose += solidsG / 2;
    } else if (ingredient.kind === 'sweetener') {
      switch (ingredient.sweetenerType) {
        case 'invert_sugar':
        case 'honey':
          totals.glucose += solidsG / 2;
          totals.fructose += solidsG / 2;
          break;
        case 'fructose':
          totals.fructose += solidsG;
          break;
        case 'dextrose':
          totals.glucose += solidsG;
          break;
        default:
          totals.sucrose += solidsG;
      }
    } else {
      totals.sucrose += solidsG;
    }
  }
  return (Object.keys(totals) as ModelledSolute[])
    .filter((solute) => totals[solute] > 0)
    .map((solute) => ({ solute, massG: totals[solute] }));
}

/** aw of the finished batch: solutes from the lines, water = finished mass − soluble solids. */
export function estimateBatchWaterActivity(lines: ResolvedLine[], finishedMassG: number): WaterActivityEstimate {
  const solutes = solutesFromLines(lines);
  const solidsG = solutes.reduce((t, s) => t + s.massG, 0);
  const waterMassG = finishedMassG - solidsG;
  if (waterMassG <= 0) throw new ChemistryInputError('finishedMassG', 'finished mass must exceed its soluble solids');
  return rossMixtureAw(solutes, waterMassG);
}
