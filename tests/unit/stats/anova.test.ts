import { describe, expect, it } from 'vitest';
import { blockedAnova, describeGroup, oneWayAnova, type AnovaResult, type BlockedObservation } from '@/lib/stats';
import { collectNonFiniteNumbers, etchRate, vascularGraft, vascularGraftObservations, warpbreaks } from './fixtures';

const rowOf = (result: AnovaResult, source: string) => {
  const found = result.rows.find((r) => r.source === source);
  if (!found) throw new Error(`no ${source} row`);
  return found;
};

/** Every number in a result must be finite or null: never NaN or Infinity. */
function expectNoNaN(value: unknown): void {
  expect(collectNonFiniteNumbers(value)).toEqual([]);
}

describe('randomised complete block ANOVA', () => {
  it('reproduces Montgomery Example 4.1 (vascular graft)', () => {
    const result = blockedAnova(vascularGraftObservations());
    // Source: Montgomery, Design and Analysis of Experiments, Example 4.1
    expect(result.method).toBe('closed-form');
    expect(result.incomplete).toBe(false);
    expect(rowOf(result, 'treatments').sumOfSquares).toBeCloseTo(178.17125, 5);
    expect(rowOf(result, 'treatments').df).toBe(3);
    expect(rowOf(result, 'treatments').f).toBeCloseTo(8.10708, 5);
    expect(rowOf(result, 'treatments').p).toBeCloseTo(0.0019163, 7);
    expect(rowOf(result, 'blocks').sumOfSquares).toBeCloseTo(192.25208, 5);
    expect(rowOf(result, 'blocks').df).toBe(5);
    expect(rowOf(result, 'error').sumOfSquares).toBeCloseTo(109.88625, 5);
    expect(rowOf(result, 'error').df).toBe(15);
    expect(result.meanSquareError).toBeCloseTo(7.32575, 5);
  });

  it('the least-squares route reproduces Example 4.1 too', () => {
    const result = blockedAnova(vascularGraftObservations(), { method: 'least-squares' });
    // Source: Montgomery, Design and Analysis of Experiments, Example 4.1
    expect(result.method).toBe('least-squares');
    expect(rowOf(result, 'treatments').sumOfSquares).toBeCloseTo(178.17125, 5);
    expect(rowOf(result, 'blocks').sumOfSquares).toBeCloseTo(192.25208, 5);
    expect(rowOf(result, 'error').sumOfSquares).toBeCloseTo(109.88625, 5);
    expect(rowOf(result, 'treatments').p).toBeCloseTo(0.0019163, 7);
    // Balanced: SE of a difference = √(2·MSE/b) = √(2 · 7.32575 / 6)
    expect(result.differenceStandardErrors[0][1]).toBeCloseTo(Math.sqrt((2 * 7.32575) / 6), 6);
  });

  it('survives a large constant offset (values like 1000000000090.3)', () => {
    // Source: Montgomery, Example 4.1 — adding a constant to every score changes no sum of squares.
    const result = blockedAnova(vascularGraftObservations(1e12));
    expect(rowOf(result, 'treatments').f).toBeCloseTo(8.10708, 4);
    expect(rowOf(result, 'error').sumOfSquares).toBeCloseTo(109.88625, 2);
    expect(result.treatments[0].rawMean - 1e12).toBeCloseTo(92.8167, 3);
  });

  it('reproduces R aov(breaks ~ wool + tension, warpbreaks): two factors, 9 replicates per cell', () => {
    const observations = warpbreaks.map((w) => ({ treatment: w.tension, block: w.wool, value: w.breaks }));
    const result = blockedAnova(observations);
    // Source: R stats::TukeyHSD help page example, summary(aov(breaks ~ wool + tension, data = warpbreaks)):
    // wool Df 1, Sum Sq 450.7, F 3.339, p 0.0736; tension Df 2, Sum Sq 2034.3, F 7.537, p 0.00138;
    // Residuals Df 50, Sum Sq 6747.9, Mean Sq 135.0 (memory)
    expect(rowOf(result, 'blocks').sumOfSquares).toBeCloseTo(450.7, 1);
    expect(rowOf(result, 'blocks').f).toBeCloseTo(3.339, 3);
    expect(rowOf(result, 'blocks').p).toBeCloseTo(0.0736, 4);
    expect(rowOf(result, 'treatments').sumOfSquares).toBeCloseTo(2034.3, 1);
    expect(rowOf(result, 'treatments').f).toBeCloseTo(7.537, 3);
    expect(rowOf(result, 'treatments').p).toBeCloseTo(0.00138, 5);
    expect(rowOf(result, 'error').sumOfSquares).toBeCloseTo(6747.9, 1);
    expect(rowOf(result, 'error').df).toBe(50);
  });

  it('analyses a missing cell by least squares, matching Yates’ missing-value method', () => {
    // Source: Montgomery, Design and Analysis of Experiments, ch. 4, estimating a missing value in an RCBD
    // (Yates 1933): x = (a·T'ᵢ + b·T'ⱼ − T')/((a − 1)(b − 1)). Filling it in and losing one error df gives
    // exactly the least-squares error SS.
    const missingTreatment = '8700';
    const missingBlock = 'batch 3';
    const observations = vascularGraftObservations().filter(
      (o) => !(o.treatment === missingTreatment && o.block === missingBlock),
    );
    const result = blockedAnova(observations);
    expect(result.incomplete).toBe(true);
    expect(result.method).toBe('least-squares');
    expect(result.message).toMatch(/Incomplete data/);

    const a = 4; // treatments
    const b = 6; // blocks
    const treatmentTotal = observations.filter((o) => o.treatment === missingTreatment).reduce((s, o) => s + o.value, 0);
    const blockTotal = observations.filter((o) => o.block === missingBlock).reduce((s, o) => s + o.value, 0);
    const grandTotal = observations.reduce((s, o) => s + o.value, 0);
    const estimate = (a * treatmentTotal + b * blockTotal - grandTotal) / ((a - 1) * (b - 1));
    const filled = blockedAnova([...observations, { treatment: missingTreatment, block: missingBlock, value: estimate }]);
    expect(rowOf(result, 'error').sumOfSquares).toBeCloseTo(rowOf(filled, 'error').sumOfSquares, 9);
    expect(rowOf(result, 'error').df).toBe(rowOf(filled, 'error').df - 1);
    // The adjusted mean of the incomplete sample is its Yates-filled mean.
    const adjusted = result.treatments.find((t) => t.label === missingTreatment)?.adjustedMean;
    const filledMean = filled.treatments.find((t) => t.label === missingTreatment)?.rawMean;
    expect(adjusted).toBeCloseTo(filledMean ?? NaN, 9);
    // Source: Cochran & Cox, Experimental Designs, RCBD with one missing value: variance of the difference between
    // the sample with the missing value and another sample = σ²·(2/b + a/(b(a − 1)(b − 1))) (memory)
    const iMissing = result.treatments.findIndex((t) => t.label === missingTreatment);
    const seWithMissing = result.differenceStandardErrors[iMissing][0] ?? NaN;
    const mse = result.meanSquareError ?? NaN;
    expect(seWithMissing ** 2 / mse).toBeCloseTo(2 / b + a / (b * (a - 1) * (b - 1)), 10);
    expect((result.differenceStandardErrors[0][2] ?? NaN) ** 2 / mse).toBeCloseTo(2 / b, 10);
    // The approximate (filled-in) treatment SS is biased upwards (Montgomery, same section).
    expect(rowOf(filled, 'treatments').sumOfSquares).toBeGreaterThan(rowOf(result, 'treatments').sumOfSquares);
    expectNoNaN(result);
  });

  it('single assessor: no error df, a clear message, no NaN', () => {
    const observations: BlockedObservation[] = Object.entries(vascularGraft).map(([treatment, values]) => ({
      treatment,
      block: 'only assessor',
      value: values[0],
    }));
    const result = blockedAnova(observations);
    expect(rowOf(result, 'treatments').f).toBeNull();
    expect(result.message).toMatch(/No residual degrees of freedom/);
    expect(result.warnings.join(' ')).toMatch(/Only one assessor/);
    expectNoNaN(result);
  });

  it('zero variance: F undefined with a message, no NaN', () => {
    const observations: BlockedObservation[] = ['s1', 's2', 's3'].flatMap((treatment) =>
      ['a1', 'a2', 'a3'].map((block) => ({ treatment, block, value: 6 })),
    );
    const result = blockedAnova(observations);
    expect(result.meanSquareError).toBe(0);
    expect(rowOf(result, 'treatments').f).toBeNull();
    expect(result.message).toMatch(/residual variance is zero/);
    expectNoNaN(result);
  });

  it('disconnected incomplete design: flagged, no NaN', () => {
    // Assessor a1 scored only s1, assessor a2 only s2: the sample difference is confounded with assessors.
    const observations: BlockedObservation[] = [
      { treatment: 's1', block: 'a1', value: 5 },
      { treatment: 's1', block: 'a1', value: 6 },
      { treatment: 's2', block: 'a2', value: 7 },
      { treatment: 's2', block: 'a2', value: 9 },
    ];
    const result = blockedAnova(observations);
    expect(result.incomplete).toBe(true);
    expect(result.warnings.join(' ')).toMatch(/not fully connected/);
    expectNoNaN(result);
  });
});

describe('one-way ANOVA', () => {
  it('reproduces Montgomery Example 3.1 (etch rate)', () => {
    const result = oneWayAnova(etchRate);
    // Source: Montgomery, Design and Analysis of Experiments, Example 3.1: F 66.797, MSE 333.70, error df 16
    expect(rowOf(result, 'treatments').f).toBeCloseTo(66.797, 3);
    expect(result.meanSquareError).toBeCloseTo(333.7, 2);
    expect(result.dfError).toBe(16);
    // Source: Montgomery, Example 3.1: SS treatments 66,870.55; SS error 5339.20; SS total 72,209.75 (memory)
    expect(rowOf(result, 'treatments').sumOfSquares).toBeCloseTo(66870.55, 2);
    expect(rowOf(result, 'total').sumOfSquares).toBeCloseTo(72209.75, 2);
  });

  it('survives the offset 1000000000000.4 where the one-pass formula fails', () => {
    const shifted = etchRate.map((g) => ({ label: g.label, values: g.values.map((v) => v + 1e12 + 0.4) }));
    // Source: Montgomery, Example 3.1 — a constant shift leaves F = 66.797 unchanged.
    expect(rowOf(oneWayAnova(shifted), 'treatments').f).toBeCloseTo(66.797, 3);
    // The textbook one-pass shortcut SS = Σx² − (Σx)²/N collapses on the same data:
    const all = shifted.flatMap((g) => g.values);
    const correction = all.reduce((s, v) => s + v, 0) ** 2 / all.length;
    const naiveTotal = all.reduce((s, v) => s + v * v, 0) - correction;
    expect(Math.abs(naiveTotal - 72209.75)).toBeGreaterThan(1000);
  });

  it('descriptive statistics with a t interval', () => {
    const described = describeGroup('160 W', etchRate[0].values);
    // By hand from Montgomery Example 3.1 data: mean 551.2, SS 1602.8, SD √(1602.8/4) = 20.0175
    expect(described.mean).toBeCloseTo(551.2, 10);
    expect(described.standardDeviation).toBeCloseTo(Math.sqrt(1602.8 / 4), 10);
    expect(described.standardError).toBeCloseTo(Math.sqrt(1602.8 / 4) / Math.sqrt(5), 10);
    // Source: t table, t(0.025, 4) = 2.776
    expect(described.confidenceInterval?.upper).toBeCloseTo(551.2 + 2.776 * (Math.sqrt(1602.8 / 4) / Math.sqrt(5)), 1);
  });

  it('degenerate groups: n < 2, empty group, single group, zero variance — never NaN', () => {
    const single = describeGroup('one score', [7]);
    expect(single.standardDeviation).toBeNull();
    expect(single.warnings.join(' ')).toMatch(/n < 2/);
    const empty = describeGroup('nothing', []);
    expect(empty.mean).toBeNull();
    expectNoNaN([single, empty]);

    const oneGroup = oneWayAnova([{ label: 'only', values: [1, 2, 3] }]);
    expect(oneGroup.message).toMatch(/Fewer than two samples/);
    expectNoNaN(oneGroup);

    const flat = oneWayAnova([
      { label: 'x', values: [4, 4] },
      { label: 'y', values: [5, 5] },
      { label: 'z', values: [] },
    ]);
    expect(flat.meanSquareError).toBe(0);
    expect(rowOf(flat, 'treatments').f).toBeNull();
    expect(flat.warnings.join(' ')).toMatch(/z: no values/);
    expectNoNaN(flat);

    const oneEach = oneWayAnova([
      { label: 'x', values: [4] },
      { label: 'y', values: [5] },
    ]);
    expect(oneEach.message).toMatch(/No residual degrees of freedom/);
    expectNoNaN(oneEach);
  });
});
