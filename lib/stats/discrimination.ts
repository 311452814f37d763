/**
 * Forced-choice discrimination tests: triangle (ISO 4120, guessing probability 1/3),
 * duo-trio (ISO 10399, 1/2) and directional paired / 2-AFC (ISO 5495, one-sided, 1/2).
 *
 * - Difference: exact binomial upper tail P(X ≥ x | n, p0); the minimum number correct
 *   for α is the smallest x with P(X ≥ x) ≤ α (how the ISO tables are built).
 * - Similarity: for a chosen largest acceptable proportion of discriminators pd and
 *   risk β, the chance of a correct answer is pc = p0 + pd·(1 − p0); the largest number
 *   correct that still shows similarity is the largest x with P(X ≤ x | n, pc) ≤ β.
 * - Proportion of discriminators: pd = (x/n − p0)/(1 − p0), with the one-sided upper
 *   confidence limit from the normal approximation (Wald) used in ISO 4120 / ISO 5495
 *   and Lawless & Heymann, Sensory Evaluation of Food:
 *   upper = pd + z(1 − β) · √(pc(1 − pc)/n) / (1 − p0), pc = x/n.
 *   (The standards print rounded z: 0.84, 1.28, 1.64, 2.33, 3.09; here z is exact.)
 */
import { binomialLowerTail, binomialUpperTail, normalQuantile } from './numeric';

export type DiscriminationMethod = 'triangle' | 'duo-trio' | 'paired-2afc';

/** Probability of a correct answer by guessing. */
export function guessingProbability(method: DiscriminationMethod): number {
  return method === 'triangle' ? 1 / 3 : 1 / 2;
}

/** Smallest number correct out of `n` that shows a difference at `alpha`; null if none can. */
export function minimumCorrectForDifference(n: number, guessProbability: number, alpha: number): number | null {
  for (let x = 0; x <= n; x++) {
    if (binomialUpperTail(x, n, guessProbability) <= alpha) return x;
  }
  return null;
}

/**
 * Largest number correct out of `n` that still shows similarity, for a largest
 * acceptable proportion of discriminators `maxDiscriminatorProportion` and risk `beta`;
 * null if even 0 correct would not.
 */
export function maximumCorrectForSimilarity(
  n: number,
  guessProbability: number,
  maxDiscriminatorProportion: number,
  beta: number,
): number | null {
  const correctChance = guessProbability + maxDiscriminatorProportion * (1 - guessProbability);
  let best: number | null = null;
  for (let x = 0; x <= n; x++) {
    if (binomialLowerTail(x, n, correctChance) <= beta) best = x;
    else break;
  }
  return best;
}

export interface DiscriminatorEstimate {
  /** (x/n − p0)/(1 − p0), floored at 0. */
  estimate: number;
  /** Same, not floored (may be negative when fewer than chance answered correctly). */
  rawEstimate: number;
  standardError: number;
  /** One-sided upper limit at confidence 1 − β, capped at 1. */
  upperConfidenceLimit: number;
  confidenceLevel: number;
}

/** Proportion of discriminators with its one-sided upper confidence limit (normal approximation). */
export function estimateDiscriminators(
  correct: number,
  n: number,
  guessProbability: number,
  beta = 0.05,
): DiscriminatorEstimate {
  const proportionCorrect = n > 0 ? correct / n : 0;
  const rawEstimate = (proportionCorrect - guessProbability) / (1 - guessProbability);
  const standardError =
    n > 0 ? Math.sqrt((proportionCorrect * (1 - proportionCorrect)) / n) / (1 - guessProbability) : 0;
  const z = normalQuantile(1 - beta);
  return {
    estimate: Math.max(0, rawEstimate),
    rawEstimate,
    standardError,
    upperConfidenceLimit: Math.min(1, Math.max(0, rawEstimate + z * standardError)),
    confidenceLevel: 1 - beta,
  };
}

export interface DiscriminationInput {
  method: DiscriminationMethod;
  correct: number;
  total: number;
  /** Risk for the difference test; default 0.05. */
  alpha?: number;
  /** Similarity question: largest acceptable proportion of discriminators and β. */
  similarity?: { maxDiscriminatorProportion: number; beta: number };
}

export interface DiscriminationResult {
  method: DiscriminationMethod;
  guessProbability: number;
  correct: number;
  total: number;
  alpha: number;
  /** Exact P(X ≥ correct) under guessing. */
  pValue: number | null;
  minimumCorrectForDifference: number | null;
  differenceShown: boolean;
  discriminators: DiscriminatorEstimate | null;
  similarity: {
    maxDiscriminatorProportion: number;
    beta: number;
    maximumCorrectForSimilarity: number | null;
    similarityShown: boolean;
  } | null;
  warnings: string[];
  message: string | null;
}

/** Analyse one forced-choice discrimination test. */
export function analyseDiscriminationTest(input: DiscriminationInput): DiscriminationResult {
  const alpha = input.alpha ?? 0.05;
  const p0 = guessingProbability(input.method);
  const warnings: string[] = [];
  const { correct, total } = input;
  const base = { method: input.method, guessProbability: p0, correct, total, alpha };
  if (!Number.isInteger(total) || total < 1 || !Number.isInteger(correct) || correct < 0 || correct > total) {
    return {
      ...base,
      pValue: null,
      minimumCorrectForDifference: null,
      differenceShown: false,
      discriminators: null,
      similarity: null,
      warnings,
      message: 'Counts must be whole numbers with 0 ≤ correct ≤ total and total ≥ 1.',
    };
  }
  const pValue = binomialUpperTail(correct, total, p0);
  const minimum = minimumCorrectForDifference(total, p0, alpha);
  if (minimum === null) warnings.push(`With ${total} answers no result can show a difference at α = ${alpha}.`);
  const beta = input.similarity?.beta ?? 0.05;
  const discriminators = estimateDiscriminators(correct, total, p0, beta);
  let similarity: DiscriminationResult['similarity'] = null;
  if (input.similarity) {
    const { maxDiscriminatorProportion } = input.similarity;
    const maximum = maximumCorrectForSimilarity(total, p0, maxDiscriminatorProportion, beta);
    if (maximum === null) {
      warnings.push(`With ${total} answers no result can show similarity for pd ${maxDiscriminatorProportion} and β ${beta}.`);
    } else if (maximum < total * p0) {
      // ISO 4120: no conclusion when the largest number is below chance level.
      warnings.push('The similarity limit is below the number expected by chance: more assessors are needed.');
    }
    similarity = {
      maxDiscriminatorProportion,
      beta,
      maximumCorrectForSimilarity: maximum,
      similarityShown: maximum !== null && correct <= maximum,
    };
  }
  if (total < 12 && input.method === 'triangle') warnings.push('Fewer than 12 answers: the test has little power.');
  return {
    ...base,
    pValue,
    minimumCorrectForDifference: minimum,
    differenceShown: minimum !== null && correct >= minimum,
    discriminators,
    similarity,
    warnings,
    message: null,
  };
}
