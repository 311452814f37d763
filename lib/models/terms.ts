/**
 * Model builders: named numeric features → coded factors → the columns of a design matrix.
 *
 * Coding (Montgomery, Design and Analysis of Experiments, ch. 11; Myers & Montgomery, Response
 * Surface Methodology): x = (natural − centre) / halfRange, so the chosen low and high are −1 and +1.
 * Coded columns are centred and of one size, which keeps the squares and products from being near
 * copies of the main effects (the conditioning the raw units would lose) and makes the coefficients
 * comparable with one another.
 */

export interface FactorRange {
  /** The feature's name, e.g. "pectinPercent". */
  name: string;
  /** Natural value coded −1. */
  low: number;
  /** Natural value coded +1. */
  high: number;
}

export type ModelKind = 'main_effects' | 'two_factor_interactions' | 'full_quadratic';

export interface ModelTerm {
  /** "1", "A", "A×B" or "A²" with the factors' own names. */
  name: string;
  /** Exponent per factor index; empty for the intercept. */
  powers: ReadonlyArray<{ factor: number; power: number }>;
}

export class ModelSpecError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ModelSpecError';
  }
}

/** More factors than a kitchen can vary at once; also bounds the terms (a full quadratic in 12 has 91). */
export const MAX_FACTORS = 12;

function checkFactorCount(count: number): void {
  if (count === 0) throw new ModelSpecError('Choose at least one factor.');
  if (count > MAX_FACTORS) throw new ModelSpecError(`A model here takes at most ${MAX_FACTORS} factors.`);
}

/** Checks the ranges: unique names, finite levels, high above low. */
export function validateRanges(ranges: readonly FactorRange[]): void {
  checkFactorCount(ranges.length);
  const seen = new Set<string>();
  for (const range of ranges) {
    if (seen.has(range.name)) throw new ModelSpecError(`The factor ${range.name} is listed twice.`);
    seen.add(range.name);
    if (!Number.isFinite(range.low) || !Number.isFinite(range.high)) throw new ModelSpecError(`The levels of ${range.name} must be numbers.`);
    if (!(range.high > range.low)) throw new ModelSpecError(`The high level of ${range.name} must be above its low level.`);
  }
}

/** The range each factor spans in the data: lowest and highest observed value. */
export function rangesFromData(names: readonly string[], points: ReadonlyArray<Readonly<Record<string, number>>>): FactorRange[] {
  return names.map((name) => {
    const values = points.map((p) => p[name]);
    if (values.some((v) => !Number.isFinite(v))) throw new ModelSpecError(`Every run needs a number for ${name}.`);
    return { name, low: Math.min(...values), high: Math.max(...values) };
  });
}

export function codeValue(range: FactorRange, natural: number): number {
  return (natural - (range.low + range.high) / 2) / ((range.high - range.low) / 2);
}

export function decodeValue(range: FactorRange, coded: number): number {
  return (range.low + range.high) / 2 + coded * ((range.high - range.low) / 2);
}

/** A natural point (by name) → coded values in the ranges' order. */
export function codePoint(ranges: readonly FactorRange[], natural: Readonly<Record<string, number>>): number[] {
  return ranges.map((range) => {
    const value = natural[range.name];
    if (!Number.isFinite(value)) throw new ModelSpecError(`A number is needed for ${range.name}.`);
    return codeValue(range, value);
  });
}

/** Coded values in the ranges' order → a natural point by name. */
export function decodePoint(ranges: readonly FactorRange[], coded: readonly number[]): Record<string, number> {
  const point: Record<string, number> = Object.create(null);
  ranges.forEach((range, i) => {
    point[range.name] = decodeValue(range, coded[i]);
  });
  return point;
}

/**
 * The terms of a model in the usual order: intercept, main effects, then two-factor products
 * (A×B, A×C, …, B×C, …), then squares.
 */
export function buildTerms(factorNames: readonly string[], kind: ModelKind): ModelTerm[] {
  checkFactorCount(factorNames.length);
  const terms: ModelTerm[] = [{ name: '1', powers: [] }];
  factorNames.forEach((name, i) => terms.push({ name, powers: [{ factor: i, power: 1 }] }));
  if (kind === 'main_effects') return terms;
  for (let i = 0; i < factorNames.length; i++) {
    for (let j = i + 1; j < factorNames.length; j++) {
      terms.push({ name: `${factorNames[i]}×${factorNames[j]}`, powers: [{ factor: i, power: 1 }, { factor: j, power: 1 }] });
    }
  }
  if (kind === 'two_factor_interactions') return terms;
  factorNames.forEach((name, i) => terms.push({ name: `${name}²`, powers: [{ factor: i, power: 2 }] }));
  return terms;
}

/** One row of the design matrix for a coded point. */
export function designRow(terms: readonly ModelTerm[], coded: readonly number[]): number[] {
  return terms.map((term) => term.powers.reduce((product, { factor, power }) => product * coded[factor] ** power, 1));
}
