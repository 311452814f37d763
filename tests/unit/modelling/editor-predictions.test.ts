import { describe, expect, it } from 'vitest';
import { fitResponseSurface, leverageAt } from '@/lib/models';
import { intervalText, outsideReason, predictOne, responseRange } from '@/lib/modelling/predict';
import { editorModelOf } from '@/lib/modelling/editor-predictions';
import { MODEL, centre } from './fixtures';

// Runs along a diagonal band: sugar ratio and pectin rose together in the trials.
const band = [
  [0.3, 0.4], [0.32, 0.44], [0.35, 0.5], [0.38, 0.56], [0.4, 0.6], [0.42, 0.64], [0.45, 0.7], [0.48, 0.76], [0.5, 0.8],
  [0.31, 0.43], [0.36, 0.5], [0.44, 0.67], [0.49, 0.77],
];
const surface = fitResponseSurface({
  factors: ['sugarRatio', 'pectinPct'],
  kind: 'two_factor_interactions',
  runs: band.map(([s, p], i) => ({ point: { sugarRatio: s, pectinPct: p }, response: 3 + 2 * p + s + 0.05 * Math.sin(i) })),
});

describe('why the editor withdraws a prediction, in words', () => {
  it('inside the data it gives no reason', () => {
    expect(outsideReason(surface, { sugarRatio: 0.4, pectinPct: 0.6 })).toBeNull();
  });

  it('names the factor, its value and the range the trials covered when a factor leaves the box', () => {
    expect(outsideReason(surface, { sugarRatio: 0.4, pectinPct: 0.95 })).toBe(
      'Pectin at 0.950 % of finished product is above anything the trials covered (0.400 to 0.800 % of finished product), so the model cannot say.',
    );
    expect(outsideReason(surface, { sugarRatio: 0.2, pectinPct: 0.6 })).toMatch(/^Sugar ratio at 0\.200 g sweetener per g fruit is below anything the trials covered/);
  });

  it('names the leverage test for a combination unlike the trials though each factor is in range', () => {
    // Low sugar with high pectin: both inside their ranges, far off the band.
    const point = { sugarRatio: 0.3, pectinPct: 0.8 };
    expect(leverageAt(surface, point)).toBeGreaterThan(surface.fit.basis.maxLeverage);
    expect(outsideReason(surface, point)).toMatch(/^Each factor is within what the trials covered, but not in this combination: .*\(leverage test\)/);
  });
});

describe('the editor’s cut of a family model (editorModelOf)', () => {
  // Invented runs around a reduced-sugar apricot base (tests/unit/modelling/fixtures.ts).
  const slim = JSON.parse(JSON.stringify(editorModelOf(MODEL))) as ReturnType<typeof editorModelOf>;
  const points = [
    centre,
    { ...centre, sugarRatio: centre.sugarRatio * 1.1, pectinPct: centre.pectinPct * 0.9 },
    { ...centre, acidPct: centre.acidPct * 1.5 },
    { ...centre, sugarRatio: centre.sugarRatio * 1.15, pectinPct: centre.pectinPct * 0.85, targetSolidsPct: centre.targetSolidsPct * 1.15, acidPct: centre.acidPct * 0.85 },
  ];

  it('predicts exactly as the whole model, after the trip to the browser as JSON, inside and outside the data', () => {
    for (const point of points) {
      MODEL.responses.forEach((full, i) => expect(predictOne(slim.responses[i], point)).toEqual(predictOne(full, point)));
    }
    // The points cover both outcomes, so both paths were compared.
    const outcomes = points.map((p) => predictOne(slim.responses[0], p).inRegion);
    expect(outcomes).toContain(true);
    expect(outcomes).toContain(false);
  });

  it('leaves out the per-run diagnostics and the fitting time, and keeps the labels', () => {
    const sent = JSON.stringify(slim);
    for (const field of ['residuals', 'leverages', 'fitted', 'codedRuns', 'anova', 'lackOfFit', 'fittedAt', 'weighting']) expect(sent).not.toContain(`"${field}"`);
    expect(sent.length).toBeLessThan(JSON.stringify(MODEL).length / 2);
    expect(slim.responses.map((r) => [r.name, r.libraryKey, r.scale])).toEqual(MODEL.responses.map((r) => [r.name, r.libraryKey, r.scale]));
  });
});

describe('a prediction interval on screen', () => {
  it('is cut where the response cannot go, and says so', () => {
    // A made-up interval below a 0–2 scale's end (the demo's weeping: −0.08 to 1.62); the scale ends
    // are the response's definition (0 none, 1 slight, 2 marked), not a statistic.
    const weeping = responseRange({ key: 'lab:syneresis', scale: null });
    expect(weeping).toEqual({ min: 0, max: 2 });
    expect(intervalText({ low: -0.08, high: 1.62 }, weeping, 2)).toBe('0.00 to 1.62, cut at the end of the scale');
    expect(intervalText({ low: 0.2, high: 1.62 }, weeping, 2)).toBe('0.20 to 1.62');
  });

  it('takes a sensory attribute’s own scale, cutting either end', () => {
    const liking = responseRange({ key: 'attribute:00000000-0000-4000-8000-000000000001', scale: { min: 1, max: 9 } });
    expect(intervalText({ low: 7.9, high: 10.48 }, liking, 1)).toBe('7.9 to 9.0, cut at the end of the scale');
    expect(intervalText({ low: 0.5, high: 9.5 }, liking, 1)).toBe('1.0 to 9.0, cut at the end of the scale');
  });

  it('knows every lab measure’s range and leaves an interval whole without one', () => {
    expect(responseRange({ key: 'lab:setTest', scale: null })).toEqual({ min: 1, max: 5 });
    expect(responseRange({ key: 'lab:measuredPh', scale: null })).toEqual({ min: 0, max: 14 });
    expect(responseRange({ key: 'lab:measuredSolids', scale: null })).toEqual({ min: 0, max: 100 });
    expect(intervalText({ low: -1, high: 1 }, null, 1)).toBe('-1.0 to 1.0');
  });
});
