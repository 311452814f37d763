/**
 * Response-surface designs over any named factors with a low and a high level (coded −1 and +1):
 * - central composite, face-centred (α = 1: three levels, every run inside low…high);
 * - central composite, rotatable (α = F^¼ with F = 2^k factorial runs: the prediction variance
 *   depends only on the distance from the centre; the axial runs lie beyond low and high);
 * - Box–Behnken for 3 or 4 factors (every pair of factors at ±1 with the rest at the centre; no
 *   corner runs, three levels).
 * Layout and α follow the NIST/SEMATECH e-Handbook of Statistical Methods, §5.3.3.6 (Box & Wilson
 * 1951; Box & Behnken 1960). Run order is the standard order; randomise it when cooking.
 */
import { decodePoint, ModelSpecError, validateRanges, type FactorRange } from './terms';

export type DesignRunKind = 'factorial' | 'axial' | 'edge' | 'centre';
export type SurfaceDesignKind = 'central_composite_face_centred' | 'central_composite_rotatable' | 'box_behnken';

export interface DesignRun {
  kind: DesignRunKind;
  /** Coded levels in the factors' order. */
  coded: number[];
  /** Natural levels by factor name. */
  natural: Record<string, number>;
}

export interface SurfaceDesign {
  kind: SurfaceDesignKind;
  factors: FactorRange[];
  /** Distance of the axial runs (central composite only). */
  alpha: number | null;
  runs: DesignRun[];
  /** Things to check before cooking, e.g. axial levels beyond the stated range or below zero. */
  warnings: string[];
}

const MAX_CENTRE_POINTS = 10;

function checkCentrePoints(count: number): void {
  if (!Number.isInteger(count) || count < 1 || count > MAX_CENTRE_POINTS) {
    throw new ModelSpecError(`Choose between 1 and ${MAX_CENTRE_POINTS} centre runs.`);
  }
}

function run(factors: readonly FactorRange[], kind: DesignRunKind, coded: number[]): DesignRun {
  return { kind, coded, natural: decodePoint(factors, coded) };
}

function negativeLevels(factors: readonly FactorRange[], runs: readonly DesignRun[]): string[] {
  return factors.flatMap((f) => {
    const lowest = Math.min(...runs.map((r) => r.natural[f.name]));
    return lowest < 0 ? [`${f.name} would go below zero (${Number(lowest.toPrecision(4))}); narrow its range or use the face-centred design.`] : [];
  });
}

/** Central composite design: 2^k corners in standard order (first factor fastest), 2k axial runs, centre runs. */
export function centralComposite(
  factors: readonly FactorRange[],
  options: { alpha: 'face_centred' | 'rotatable'; centrePoints: number },
): SurfaceDesign {
  validateRanges(factors);
  const k = factors.length;
  if (k < 2 || k > 5) throw new ModelSpecError('A central composite design here takes 2 to 5 factors.');
  checkCentrePoints(options.centrePoints);
  const corners = 2 ** k;
  const alpha = options.alpha === 'face_centred' ? 1 : corners ** 0.25;
  const runs: DesignRun[] = [];
  for (let r = 0; r < corners; r++) runs.push(run(factors, 'factorial', factors.map((_, j) => ((r >> j) & 1 ? 1 : -1))));
  for (let j = 0; j < k; j++) {
    for (const sign of [-1, 1]) runs.push(run(factors, 'axial', factors.map((_, i) => (i === j ? sign * alpha : 0))));
  }
  for (let c = 0; c < options.centrePoints; c++) runs.push(run(factors, 'centre', factors.map(() => 0)));
  const warnings = options.alpha === 'rotatable'
    ? [`The axial runs go ${Number(alpha.toFixed(3))} half-ranges from the centre, beyond each low and high level.`, ...negativeLevels(factors, runs)]
    : [];
  return {
    kind: options.alpha === 'face_centred' ? 'central_composite_face_centred' : 'central_composite_rotatable',
    factors: factors.map((f) => ({ ...f })),
    alpha,
    runs,
    warnings,
  };
}

/** Box–Behnken design for 3 or 4 factors: each pair of factors in a 2² at ±1, the others at 0; then centre runs. */
export function boxBehnken(factors: readonly FactorRange[], options: { centrePoints: number }): SurfaceDesign {
  validateRanges(factors);
  const k = factors.length;
  if (k < 3 || k > 4) throw new ModelSpecError('A Box–Behnken design here takes 3 or 4 factors.');
  checkCentrePoints(options.centrePoints);
  const runs: DesignRun[] = [];
  for (let a = 0; a < k; a++) {
    for (let b = a + 1; b < k; b++) {
      for (const [sa, sb] of [[-1, -1], [1, -1], [-1, 1], [1, 1]]) {
        runs.push(run(factors, 'edge', factors.map((_, i) => (i === a ? sa : i === b ? sb : 0))));
      }
    }
  }
  for (let c = 0; c < options.centrePoints; c++) runs.push(run(factors, 'centre', factors.map(() => 0)));
  return { kind: 'box_behnken', factors: factors.map((f) => ({ ...f })), alpha: null, runs, warnings: [] };
}
