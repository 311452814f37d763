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

/** An ingredient's sugars per 100 g as used (from its composition); a null value means not known. */
export interface SugarProfile {
  sucroseG: number | null;
  glucoseG: number | null;
  fructoseG: number | null;
}

/** A resolved formula line with its sugar profile, when the library holds one. */
export interface SugarProfileLine {
  line: ResolvedLine;
  sugars?: SugarProfile | null;
}

export interface SugarMixOptions {
  /** Share of the sucrose inverted to glucose + fructose during the boil, 0–1 (stated by the user; 0 when not stated). */
  sucroseInversionFraction?: number;
}

export interface SugarMixEstimate extends WaterActivityEstimate {
  solutes: SoluteAmount[];
  waterG: number;
  sucroseInversionFraction: number;
  /** Line indexes whose sugars came from their profile, and those modelled from their kind (the older method). */
  linesFromProfile: number[];
  linesFromKind: number[];
}

/**
 * Sucrose + water → glucose + fructose: 1 g of sucrose takes 18.015 / 342.3 g of water and gives
 * half the sum as each monosaccharide (mass conserved exactly, whatever the rounding of the molar masses).
 */
const HYDROLYSIS_WATER_PER_G = WATER_MOLAR_MASS / SOLUTE_MOLAR_MASS.sucrose;
const HYDROLYSIS_PRODUCT_PER_G = (1 + HYDROLYSIS_WATER_PER_G) / 2;

function knownProfile(sugars: SugarProfile | null | undefined): sugars is { sucroseG: number; glucoseG: number; fructoseG: number } {
  return !!sugars && [sugars.sucroseG, sugars.glucoseG, sugars.fructoseG].every((v) => typeof v === 'number' && Number.isFinite(v) && v >= 0);
}

/**
 * The solutes of a batch from each line's own sugars: a line with a full profile (sucrose,
 * glucose and fructose all known) contributes those sugars, and the rest of its soluble solids
 * (acids, soluble pectin, minerals) is modelled by its kind as `solutesFromLines` does; a line
 * without one is modelled by its kind throughout.
 */
export function solutesFromSugarProfiles(lines: SugarProfileLine[]): { solutes: SoluteAmount[]; fromProfile: number[]; fromKind: number[] } {
  const totals: Record<ModelledSolute, number> = { sucrose: 0, glucose: 0, fructose: 0 };
  const modelled: ResolvedLine[] = [];
  const fromProfile: number[] = [];
  const fromKind: number[] = [];
  for (const { line, sugars } of lines) {
    if (line.massG <= 0) continue;
    if (!knownProfile(sugars)) {
      modelled.push(line);
      if (line.solidsG > 0) fromKind.push(line.index);
      continue;
    }
    const sucrose = (line.massG * sugars.sucroseG) / 100;
    const glucose = (line.massG * sugars.glucoseG) / 100;
    const fructose = (line.massG * sugars.fructoseG) / 100;
    totals.sucrose += sucrose;
    totals.glucose += glucose;
    totals.fructose += fructose;
    fromProfile.push(line.index);
    const rest = line.solidsG - (sucrose + glucose + fructose);
    if (rest > 0) modelled.push({ ...line, solidsG: rest });
  }
  for (const s of solutesFromLines(modelled)) totals[s.solute] += s.massG;
  const solutes = (Object.keys(totals) as ModelledSolute[])
    .filter((solute) => totals[solute] > 0)
    .map((solute) => ({ solute, massG: totals[solute] }));
  return { solutes, fromProfile, fromKind };
}

/**
 * aw of the finished batch from the real mix of sucrose, glucose and fructose: Norrish for each
 * sugar, combined by Ross's rule (as `rossMixtureAw`), with the stated share of sucrose inverted
 * during the boil. Inversion turns 1 g of sucrose into 1.053 g of glucose + fructose and takes the
 * 0.053 g of water from the syrup; the finished mass stays the mass balance's.
 *
 * Expected error: in sugar solutions Norrish/Ross predictions agree with measurement to about 2 %
 * of aw on average (Sereno, Hubinger, Comesaña and Correa, "Prediction of water activity of
 * osmotic solutions", 2001; journal recalled as the Journal of Food Engineering). In a jam, pectin,
 * acids and fruit solids add to this: a 68 °Brix strawberry jam with a quarter of its sucrose
 * inverted comes out at 0.831, inside the "below 0.85" group where the New York State Department
 * of Agriculture and Markets places jams and jellies, and about 0.03 above the 0.75–0.80 that aw
 * tables give for jam. Read the estimate as erring high by up to 0.05, which is the safe side for
 * the cautions, and measure the product before relying on it.
 */
export function estimateWaterActivityFromSugars(lines: SugarProfileLine[], finishedMassG: number, options: SugarMixOptions = {}): SugarMixEstimate {
  requireFiniteNumber(finishedMassG, 'finishedMassG');
  const inversion = options.sucroseInversionFraction ?? 0;
  requireFiniteNumber(inversion, 'sucroseInversionFraction');
  if (inversion < 0 || inversion > 1) throw new ChemistryInputError('sucroseInversionFraction', 'the inverted share of sucrose must be between 0 and 1');
  const { solutes: raw, fromProfile, fromKind } = solutesFromSugarProfiles(lines);
  const totals: Record<ModelledSolute, number> = { sucrose: 0, glucose: 0, fructose: 0 };
  for (const s of raw) totals[s.solute] += s.massG;
  const inverted = totals.sucrose * inversion;
  totals.sucrose -= inverted;
  totals.glucose += inverted * HYDROLYSIS_PRODUCT_PER_G;
  totals.fructose += inverted * HYDROLYSIS_PRODUCT_PER_G;
  const solutes = (Object.keys(totals) as ModelledSolute[])
    .filter((solute) => totals[solute] > 0)
    .map((solute) => ({ solute, massG: totals[solute] }));
  const solidsG = solutes.reduce((t, s) => t + s.massG, 0);
  const waterG = finishedMassG - solidsG;
  if (waterG <= 0) throw new ChemistryInputError('finishedMassG', 'finished mass must exceed its soluble solids');
  const mixture = rossMixtureAw(solutes, waterG);
  const basis = fromKind.length === 0
    ? 'sugars from the ingredients\' profiles'
    : fromProfile.length === 0
      ? 'sugars modelled from the ingredient kinds (no sugar profiles)'
      : 'sugars from the ingredients\' profiles where known, modelled from the ingredient kind elsewhere';
  const inversionText = inversion > 0 ? `; ${Math.round(inversion * 100)} % of the sucrose taken as inverted` : '';
  return {
    aw: mixture.aw,
    model: `${mixture.model}; ${basis}${inversionText}`,
    isEstimate: true,
    solutes,
    waterG,
    sucroseInversionFraction: inversion,
    linesFromProfile: fromProfile,
    linesFromKind: fromKind,
  };
}
