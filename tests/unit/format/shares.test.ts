import { describe, expect, it } from 'vitest';
import { lineMassDecimals, showLineMass, showSharePct } from '@/lib/format/quantities';

// The decimals are this screen's rule (common practice, no published source): enough that a small
// line never reads as nothing.
describe('a small line keeps its decimals', () => {
  it('masses: hundredths below 1 g, tenths below 100 g, grams below 1 kg, then kilograms to 10 g', () => {
    expect([0.5, 0.83, 5.5, 60, 250, 1200].map((g) => showLineMass(g, 'metric'))).toEqual(['0.50 g', '0.83 g', '5.5 g', '60.0 g', '250 g', '1.20 kg']);
    expect(lineMassDecimals(0.5, 'imperial')).toBe(2);
  });

  it('shares of the batch: 0.5 g in 2.24 kg is 0.02 %, not "0.0 %"', () => {
    expect(showSharePct((0.5 / 2240) * 100)).toBe('0.02 %');
    expect(showSharePct(0.004)).toBe('0.004 %');
    expect(showSharePct(0.0001)).toBe('< 0.001 %');
    expect(showSharePct(0)).toBe('0 %');
    expect(showSharePct(49.72)).toBe('49.7 %');
  });
});
