import { describe, expect, it } from 'vitest';
import { fitRegression } from '@/lib/models';
import { filip, longley, norris, wampler1, wampler4, type CertifiedFit } from './nist-strd';
import { fewestDigits, agreeingDigits } from './digits';

function powers(x: number, degree: number): number[] {
  return Array.from({ length: degree + 1 }, (_, k) => x ** k);
}

function check(rows: number[][], response: number[], certified: CertifiedFit) {
  const fit = fitRegression({ termNames: rows[0].map((_, j) => `b${j}`), rows, response });
  return {
    fit,
    coefficients: fewestDigits(fit.terms.map((t) => t.estimate), certified.coefficients),
    standardErrors: fewestDigits(fit.terms.map((t) => t.standardError), certified.standardErrors),
    residualSd: agreeingDigits(fit.residualStandardError, certified.residualStandardDeviation),
    rSquared: agreeingDigits(fit.rSquared, certified.rSquared),
  };
}

// Source: NIST StRD, Linear Least Squares Regression, certified values (15 significant digits).
// The digit counts asserted are what this QR reaches, with a margin of about one digit; NIST's own
// guidance counts 6 or more digits as acceptable for the higher-difficulty sets.
describe('least squares against the NIST StRD certified values', () => {
  it('Norris (lower difficulty): 12+ digits on coefficients, standard errors, residual SD and R²', () => {
    const result = check(norris.x.map((x) => [1, x]), norris.y, norris.certified);
    expect(result.coefficients).toBeGreaterThanOrEqual(12);
    expect(result.standardErrors).toBeGreaterThanOrEqual(12);
    expect(result.residualSd).toBeGreaterThanOrEqual(12);
    expect(result.rSquared).toBeGreaterThanOrEqual(12);
    expect(result.fit.residualDf).toBe(34);
  });

  it('Longley (higher difficulty, collinear economic series): 12+ digits', () => {
    const result = check(longley.rows.map((r) => [1, ...r.slice(1)]), longley.rows.map((r) => r[0]), longley.certified);
    expect(result.coefficients).toBeGreaterThanOrEqual(12);
    expect(result.standardErrors).toBeGreaterThanOrEqual(12);
    expect(result.residualSd).toBeGreaterThanOrEqual(12);
    expect(result.rSquared).toBeGreaterThanOrEqual(12);
    expect(result.fit.warnings.filter((w) => w.kind === 'aliased')).toEqual([]);
  });

  it('Filip (higher difficulty, 10th-degree polynomial): all 11 terms kept, 7+ digits', () => {
    // Condition number of the design about 1.8e15 (NIST): many solvers drop a term here.
    const result = check(filip.rows.map(([, x]) => powers(x, 10)), filip.rows.map(([y]) => y), filip.certified);
    expect(result.fit.parameterCount).toBe(11);
    expect(result.coefficients).toBeGreaterThanOrEqual(7);
    expect(result.standardErrors).toBeGreaterThanOrEqual(7);
    expect(result.residualSd).toBeGreaterThanOrEqual(7);
    expect(result.rSquared).toBeGreaterThanOrEqual(7);
  });

  it('Wampler1 (exact fifth-degree polynomial): coefficients 1 to 9+ digits, residual SD ~0', () => {
    const result = check(wampler1.x.map((x) => powers(x, 5)), wampler1.y, wampler1.certified);
    expect(result.coefficients).toBeGreaterThanOrEqual(9);
    expect(result.fit.residualStandardError).toBeLessThan(1e-6);
    expect(result.fit.rSquared).toBeCloseTo(1, 12);
  });

  it('Wampler4 (same polynomial, large deviations): 8+ digits, standard errors 12+', () => {
    const result = check(wampler4.x.map((x) => powers(x, 5)), wampler4.y, wampler4.certified);
    expect(result.coefficients).toBeGreaterThanOrEqual(8);
    expect(result.standardErrors).toBeGreaterThanOrEqual(12);
    expect(result.residualSd).toBeGreaterThanOrEqual(12);
    expect(result.rSquared).toBeGreaterThanOrEqual(12);
  });
});
