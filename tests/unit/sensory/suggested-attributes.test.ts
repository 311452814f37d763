import { describe, it, expect } from 'vitest';
import { createDefaultAttributeLibrary, suggestAttributes } from '@/lib/sensory';

// The workspace library as seeded: every default attribute, keyed by its library key.
const library = createDefaultAttributeLibrary().map((a) => ({ id: `id-${a.id}`, libraryKey: a.id as string | null }));

describe('attributes ticked first for a tasting', () => {
  // Common practice, no published source: a factor is judged on the attribute it changes.
  it('takes the workspace defaults and what the trial’s factors change, not the whole library', () => {
    expect(suggestAttributes(library, ['sugar_ratio']).sort()).toEqual(['id-fruit-flavour', 'id-overall-liking', 'id-sweetness']);
    expect(suggestAttributes(library, ['pectin_dose', 'acid_dose']).sort()).toEqual(['id-fruit-flavour', 'id-overall-liking', 'id-set-firmness', 'id-spreadability', 'id-tartness']);
    expect(suggestAttributes(library, []).length).toBeLessThan(library.length);
  });

  it('never ticks a workspace’s own attributes on its own', () => {
    expect(suggestAttributes([...library, { id: 'own', libraryKey: null }], ['sugar_ratio'])).not.toContain('own');
  });
});
