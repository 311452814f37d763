import { describe, expect, it } from 'vitest';
import { collapseJarScore, penaltyAnalysis, type JarResponse } from '@/lib/stats';
import { collectNonFiniteNumbers } from './fixtures';

describe('penalty analysis (5-point JAR)', () => {
  // Invented demo data: ten respondents, JAR sweetness and 9-point liking, plus one invalid answer.
  const responses: JarResponse[] = [
    { jarScore: 1, liking: 4 },
    { jarScore: 2, liking: 5 },
    { jarScore: 3, liking: 7 },
    { jarScore: 3, liking: 8 },
    { jarScore: 3, liking: 6 },
    { jarScore: 3, liking: 7 },
    { jarScore: 4, liking: 5 },
    { jarScore: 5, liking: 3 },
    { jarScore: 4, liking: 6 },
    { jarScore: 3, liking: 8 },
    { jarScore: 6, liking: 9 },
  ];

  it('matches the hand computation', () => {
    // Hand computation (method: collapse 1–2 / 3 / 4–5; drop = mean(JAR) − mean(group); penalty = share × drop):
    //   valid respondents: 10 (the score 6 is not on the scale)
    //   too little: likings 4, 5        → n 2, share 0.2, mean 4.5
    //   JAR:        7, 8, 6, 7, 8       → n 5, share 0.5, mean 36/5 = 7.2
    //   too much:   5, 3, 6             → n 3, share 0.3, mean 14/3 = 4.6667
    //   drop too little = 7.2 − 4.5 = 2.7;      penalty = 0.2 × 2.7 = 0.54
    //   drop too much   = 7.2 − 4.6667 = 2.5333; penalty = 0.3 × 2.5333 = 0.76
    const result = penaltyAnalysis(responses);
    expect(result.respondentCount).toBe(10);
    expect(result.warnings.join(' ')).toMatch(/1 response/);
    expect(result.groups.tooLittle.share).toBeCloseTo(0.2, 12);
    expect(result.groups.tooLittle.meanLiking).toBeCloseTo(4.5, 12);
    expect(result.groups.justAboutRight.meanLiking).toBeCloseTo(7.2, 12);
    expect(result.groups.tooMuch.meanLiking).toBeCloseTo(14 / 3, 12);
    expect(result.groups.tooLittle.meanDrop).toBeCloseTo(2.7, 12);
    expect(result.groups.tooLittle.weightedPenalty).toBeCloseTo(0.54, 12);
    expect(result.groups.tooMuch.meanDrop).toBeCloseTo(7.2 - 14 / 3, 12);
    expect(result.groups.tooMuch.weightedPenalty).toBeCloseTo(0.76, 12);
    expect(result.groups.justAboutRight.meanDrop).toBeNull();
  });

  it('flags groups of at least 20 % of respondents', () => {
    // Common practice, no published source: interpret only groups of ≥ 20 % of respondents.
    const result = penaltyAnalysis(responses);
    expect(result.groups.tooLittle.largeEnoughToInterpret).toBe(true); // exactly 20 %
    expect(result.groups.tooMuch.largeEnoughToInterpret).toBe(true);
    const small = penaltyAnalysis(responses, { shareThreshold: 0.25 });
    expect(small.groups.tooLittle.largeEnoughToInterpret).toBe(false);
    expect(result.thresholdSource).toMatch(/Common practice, no published source/);
  });

  it('collapses the 5-point scale', () => {
    expect([1, 2, 3, 4, 5, 0, 2.5].map(collapseJarScore)).toEqual([
      'tooLittle',
      'tooLittle',
      'justAboutRight',
      'tooMuch',
      'tooMuch',
      null,
      null,
    ]);
  });

  it('no JAR respondents or no responses: message, no NaN', () => {
    const noJar = penaltyAnalysis([
      { jarScore: 1, liking: 5 },
      { jarScore: 5, liking: 4 },
    ]);
    expect(noJar.message).toMatch(/Nobody answered/);
    expect(noJar.groups.tooLittle.meanDrop).toBeNull();
    const none = penaltyAnalysis([]);
    expect(none.message).toMatch(/No valid responses/);
    expect(collectNonFiniteNumbers([noJar, none])).toEqual([]);
  });
});
