/** A batch's corrected Brix against its version's label (issue 15, part 4). */
import { describe, expect, it } from 'vitest';
import { statedSugarAgainst } from '@/lib/label';
import type { Label } from '@/lib/label/label';

const labelStating = (grams: number | null) => ({ statements: [{ kind: 'total_sugar', text: null, gramsPer100g: grams, notes: [] }] }) as unknown as Label;

describe('stated total sugar against a batch', () => {
  // Source: Directive 2001/113/EC Annex III — the refractometer value at 20 °C, tolerance ± 3 refractometric degrees.
  it('68 g stated: 65.0 °Brix is within, 64.9 is outside', () => {
    expect(statedSugarAgainst(labelStating(68), 65)).toMatchObject({ stated: 68, withinTolerance: true });
    expect(statedSugarAgainst(labelStating(68), 64.9)).toMatchObject({ stated: 68, withinTolerance: false, difference: -3.1 });
  });

  it('the stated figure is the label’s, rounded as printed (67.5 → 68)', () => {
    expect(statedSugarAgainst(labelStating(67.5), 68)?.stated).toBe(68);
  });

  it('nothing to compare without a statement, a reading or a plausible value', () => {
    expect(statedSugarAgainst(null, 65)).toBeNull();
    expect(statedSugarAgainst(labelStating(null), 65)).toBeNull();
    expect(statedSugarAgainst(labelStating(68), null)).toBeNull();
    expect(statedSugarAgainst(labelStating(68), Number.NaN)).toBeNull();
  });
});
