/**
 * Penalty analysis for 5-point just-about-right (JAR) scales.
 *
 * Scores 1–2 collapse to "too little", 3 is "just about right", 4–5 "too much".
 * For each non-JAR group: share of respondents, mean liking, mean drop
 * (mean liking of JAR − mean liking of the group) and weighted penalty
 * (share × drop). Groups of at least 20 % of respondents are flagged for
 * interpretation: common practice, no published source.
 */
import { stableMean } from './numeric';

export interface JarResponse {
  /** 1…5 on the just-about-right scale. */
  jarScore: number;
  /** Overall liking, e.g. 9-point hedonic. */
  liking: number;
}

export type JarGroupName = 'tooLittle' | 'justAboutRight' | 'tooMuch';

export interface JarGroup {
  count: number;
  /** Fraction of valid respondents, 0…1. */
  share: number;
  meanLiking: number | null;
  /** mean(JAR) − mean(this group); null for the JAR group itself or when undefined. */
  meanDrop: number | null;
  /** share × meanDrop */
  weightedPenalty: number | null;
  /** share ≥ the threshold (default 0.20). */
  largeEnoughToInterpret: boolean;
}

export interface PenaltyAnalysisResult {
  respondentCount: number;
  groups: Record<JarGroupName, JarGroup>;
  shareThreshold: number;
  /** Where the threshold comes from. */
  thresholdSource: string;
  warnings: string[];
  message: string | null;
}

/** Collapse a 5-point JAR score; null for anything that is not 1…5. */
export function collapseJarScore(score: number): JarGroupName | null {
  if (!Number.isInteger(score) || score < 1 || score > 5) return null;
  if (score <= 2) return 'tooLittle';
  if (score === 3) return 'justAboutRight';
  return 'tooMuch';
}

/** Penalty analysis of one JAR attribute against overall liking. */
export function penaltyAnalysis(
  responses: readonly JarResponse[],
  options: { shareThreshold?: number } = {},
): PenaltyAnalysisResult {
  const shareThreshold = options.shareThreshold ?? 0.2;
  const warnings: string[] = [];
  const buckets: Record<JarGroupName, number[]> = { tooLittle: [], justAboutRight: [], tooMuch: [] };
  let invalid = 0;
  for (const response of responses) {
    const group = collapseJarScore(response.jarScore);
    if (group === null || !Number.isFinite(response.liking)) {
      invalid++;
      continue;
    }
    buckets[group].push(response.liking);
  }
  if (invalid > 0) warnings.push(`${invalid} response(s) without a valid JAR score (1–5) or liking were ignored.`);
  const respondentCount = buckets.tooLittle.length + buckets.justAboutRight.length + buckets.tooMuch.length;
  const jarMean = buckets.justAboutRight.length > 0 ? stableMean(buckets.justAboutRight) : null;
  const describe = (name: JarGroupName): JarGroup => {
    const likings = buckets[name];
    const count = likings.length;
    const share = respondentCount > 0 ? count / respondentCount : 0;
    const meanLiking = count > 0 ? stableMean(likings) : null;
    const meanDrop =
      name === 'justAboutRight' || meanLiking === null || jarMean === null ? null : jarMean - meanLiking;
    return {
      count,
      share,
      meanLiking,
      meanDrop,
      weightedPenalty: meanDrop === null ? null : share * meanDrop,
      largeEnoughToInterpret: respondentCount > 0 && share >= shareThreshold,
    };
  };
  const groups = {
    tooLittle: describe('tooLittle'),
    justAboutRight: describe('justAboutRight'),
    tooMuch: describe('tooMuch'),
  };
  let message: string | null = null;
  if (respondentCount === 0) message = 'No valid responses.';
  else if (jarMean === null) message = 'Nobody answered "just about right": mean drops cannot be computed.';
  return {
    respondentCount,
    groups,
    shareThreshold,
    thresholdSource: 'Common practice, no published source (interpret groups of at least 20 % of respondents).',
    warnings,
    message,
  };
}
