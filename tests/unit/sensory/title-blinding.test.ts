/** A tasting's title is shown to tasters: it must not name a variant or the recipe (a walk created "Variant J vs Q: low sugar strawberry spread"). */
import { describe, expect, it } from 'vitest';
import { titleBlindingProblem } from '@/lib/tastings/vocabulary';

const trial = { variantLabels: ['A', 'B', 'J', 'Q'], formulaName: 'Strawberry spread, low sugar' };

describe('titleBlindingProblem', () => {
  it('refuses a title naming a variant of the trial', () => {
    expect(titleBlindingProblem('Variant J vs Q: low sugar strawberry spread', trial)).toBe('Tasters see the title: leave out the variant names (“Variant J”) so the tasting stays blind.');
    expect(titleBlindingProblem('variants b and c', trial)).toMatch(/Variant B/);
  });

  it('refuses a title holding the recipe’s name', () => {
    expect(titleBlindingProblem('Friday: strawberry spread, low sugar', trial)).toBe('Tasters see the title: leave out the recipe’s name (“Strawberry spread, low sugar”) so the tasting stays blind.');
  });

  it('accepts a plain title, a letter that is no variant of the trial, and a short generic recipe name', () => {
    expect(titleBlindingProblem('Thursday tasting', trial)).toBeNull();
    expect(titleBlindingProblem('Variant Z check', trial)).toBeNull();
    expect(titleBlindingProblem('Jam round', { variantLabels: ['A'], formulaName: 'Jam' })).toBeNull();
  });
});
