/** What a seat lacks before it may be submitted: only stored answers count (a walk found "Thank you" over nothing stored). */
import { describe, expect, it } from 'vitest';
import { missingBeforeSubmit } from '@/lib/taster/seat';

const need = { consented: true, codes: ['381', '527'], attributeIds: ['liking', 'firmness'] };
const rating = (item: string, attribute: string) => ({ kind: 'rating', item, attribute });

describe('missingBeforeSubmit', () => {
  it('asks for consent first', () => {
    expect(missingBeforeSubmit('rated', [], { ...need, consented: false })).toBe('Agree to take part first.');
  });

  it('a rated seat needs every sample on every attribute, and names the samples still open', () => {
    expect(missingBeforeSubmit('rated', [rating('381', 'liking'), rating('381', 'firmness'), rating('527', 'liking')], need))
      .toBe('Some answers have not reached the organiser yet (sample 527): answer them again, then submit.');
    expect(missingBeforeSubmit('rated', [], need)).toBe('Some answers have not reached the organiser yet (samples 381, 527): answer them again, then submit.');
    expect(missingBeforeSubmit('rated', [rating('381', 'liking'), rating('381', 'firmness'), rating('527', 'liking'), rating('527', 'firmness')], need)).toBeNull();
  });

  it('a ranking seat needs its stored order, a triangle seat its stored choice', () => {
    expect(missingBeforeSubmit('ranking', [], need)).toMatch(/order of the samples has not reached the organiser/);
    expect(missingBeforeSubmit('ranking', [{ kind: 'ranking', item: '*', attribute: '*' }], need)).toBeNull();
    expect(missingBeforeSubmit('triangle', [], need)).toMatch(/odd sample has not reached the organiser/);
    expect(missingBeforeSubmit('triangle', [{ kind: 'triangle', item: '*', attribute: '*' }], need)).toBeNull();
  });
});
