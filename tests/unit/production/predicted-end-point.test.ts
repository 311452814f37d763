/**
 * The review page's predicted end point says where water boils (a walk found "103.5 °C at sea level"
 * beside the spec's "103.9 °C at sea level" for one formula kept at 120 m).
 */
import { describe, expect, it } from 'vitest';
import { predictedEndPointText } from '@/lib/production/review';
import { sucroseBoilingElevationC, waterBoilingPointAtAltitudeC } from '@/lib/chemistry';

const show = (c: number) => `${c.toFixed(1)} °C`;

describe('predicted end point on the review', () => {
  it('gives the local end point with its sea-level equivalent, which matches the sea-level computation', () => {
    const water = waterBoilingPointAtAltitudeC(120);
    const local = water + sucroseBoilingElevationC(65);
    // Lowe, quoting Cruess & McNair: 65 °Brix boils at 103.9 °C at sea level (lib/chemistry/end-point.ts).
    expect(predictedEndPointText({ endPointC: local, waterBoilingC: water }, show)).toBe(`${show(local)} where water boils at ${show(water)} (103.9 °C at sea level)`);
    expect(water).toBeLessThan(100);
  });

  it('says "at sea level" only at sea level, and makes no claim for old evidence without the boiling point', () => {
    expect(predictedEndPointText({ endPointC: 103.9, waterBoilingC: 100 }, show)).toBe('103.9 °C at sea level');
    expect(predictedEndPointText({ endPointC: 103.5 }, show)).toBe("103.5 °C at the trial's altitude");
  });
});
