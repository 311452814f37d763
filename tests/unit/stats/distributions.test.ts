import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  binomialUpperTail,
  centredSumOfSquares,
  chiSquareUpperTail,
  fUpperTail,
  normalQuantile,
  studentizedRangeCdf,
  studentizedRangeQuantile,
  studentTQuantile,
} from '@/lib/stats';

describe('jstat spot checks', () => {
  it('F cdf(3.5; 4, 20)', () => {
    // Source: reference statistical implementations of these distributions, which agree to 1e-9 (values from the team reference notes)
    expect(jStat.centralF.cdf(3.5, 4, 20)).toBeCloseTo(0.9746147691, 7);
    expect(1 - fUpperTail(3.5, 4, 20)).toBeCloseTo(0.9746147691, 9);
  });
  it('studentized range cdf(3.5; 3, 20)', () => {
    // Source: reference statistical implementations (values from the team reference notes)
    expect(jStat.tukey.cdf(3.5, 3, 20)).toBeCloseTo(0.9441081509, 7);
    expect(studentizedRangeCdf(3.5, 3, 20)).toBeCloseTo(0.9441081509, 7);
  });
  it('chi-square cdf(7.8; 3)', () => {
    // Source: reference statistical implementations (values from the team reference notes)
    expect(jStat.chisquare.cdf(7.8, 3)).toBeCloseTo(0.9496689021, 7);
    expect(1 - chiSquareUpperTail(7.8, 3)).toBeCloseTo(0.9496689021, 9);
  });
});

describe('upper tails and quantiles', () => {
  it('binomial upper tail P(X ≥ 13 | n = 24, p = 1/3)', () => {
    // Source: ISO 4120 triangle test (exact binomial tail)
    expect(binomialUpperTail(13, 24, 1 / 3)).toBeCloseTo(0.0284411281, 10);
  });
  it('F upper tail of Montgomery Example 4.1 treatments', () => {
    // Source: Montgomery, Design and Analysis of Experiments, Example 4.1: F = 8.10708 on (3, 15) df, p = 0.0019163
    expect(fUpperTail(8.10708, 3, 15)).toBeCloseTo(0.0019163, 7);
  });
  it('small upper tails keep their relative accuracy (no 1 − cdf cancellation)', () => {
    // Source: chi-square with 2 df has the closed form P(X² > x) = exp(−x/2) (standard identity)
    expect(chiSquareUpperTail(80, 2) / Math.exp(-40)).toBeCloseTo(1, 10);
    // Source: F(2, 2) has the closed form P(F > f) = 1/(1 + f) (standard identity)
    const exact = 1 / (1 + 1e13);
    expect(Math.abs(fUpperTail(1e13, 2, 2) / exact - 1)).toBeLessThan(1e-12);
    // The 1 − cdf route keeps only a few digits there:
    expect(Math.abs((1 - jStat.centralF.cdf(1e13, 2, 2)) / exact - 1)).toBeGreaterThan(1e-6);
  });
  it('normal and t quantiles match printed tables', () => {
    // Source: standard normal table, z(0.975) = 1.960, z(0.95) = 1.645
    expect(normalQuantile(0.975)).toBeCloseTo(1.959964, 6);
    expect(normalQuantile(0.95)).toBeCloseTo(1.644854, 6);
    // Source: Montgomery, Design and Analysis of Experiments, Appendix table of t: t(0.025, 15) = 2.131, t(0.025, 16) = 2.120
    expect(studentTQuantile(0.975, 15)).toBeCloseTo(2.131, 3);
    expect(studentTQuantile(0.975, 16)).toBeCloseTo(2.12, 3);
  });
  it('studentized range quantile matches printed tables', () => {
    // Source: Montgomery, Design and Analysis of Experiments, Appendix table of q(0.05): q(4, 15) = 4.08, q(4, 16) = 4.05 (memory)
    expect(studentizedRangeQuantile(0.95, 4, 15)).toBeCloseTo(4.08, 2);
    expect(studentizedRangeQuantile(0.95, 4, 16)).toBeCloseTo(4.05, 2);
  });
});

describe('centred sums of squares', () => {
  it('survive a large constant offset where the one-pass formula fails', () => {
    // Source: Montgomery, Example 3.1, 160 W group: 575, 542, 530, 539, 570 (mean 551.2).
    // By hand: deviations 23.8, −9.2, −21.2, −12.2, 18.8; squares 566.44 + 84.64 + 449.44 + 148.84 + 353.44 = 1602.8
    const values = [575, 542, 530, 539, 570];
    const offset = values.map((v) => v + 1e12 + 0.4);
    expect(centredSumOfSquares(values)).toBeCloseTo(1602.8, 9);
    expect(centredSumOfSquares(offset)).toBeCloseTo(1602.8, 2);
    const naive = offset.reduce((s, v) => s + v * v, 0) - offset.reduce((s, v) => s + v, 0) ** 2 / offset.length;
    expect(Math.abs(naive - 1602.8)).toBeGreaterThan(1000);
  });
});
