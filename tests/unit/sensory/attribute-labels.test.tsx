// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';

vi.mock('next/navigation', () => ({ useRouter: () => ({ push: vi.fn(), refresh: vi.fn() }) }));

import { NewTastingForm } from '@/components/tastings/NewTastingForm';
import { SET_FIRMNESS_LINE, scaleNote } from '@/lib/sensory/scales';

afterEach(cleanup);

describe('attribute labels', () => {
  it('an intensity line named after its attribute is not named twice', () => {
    expect(scaleNote('Set firmness', SET_FIRMNESS_LINE.name)).toBeNull();
    expect(scaleNote('Overall liking', '9-point hedonic')).toBe('9-point hedonic');
  });

  it('the new-tasting form says "Set firmness", not "Set firmness (Set firmness)"', () => {
    render(
      <NewTastingForm
        trialId="t1"
        variants={[{ id: 'v1', label: 'A', description: 'Base' }, { id: 'v2', label: 'B', description: 'Less sugar' }]}
        attributes={[{ id: 'a1', name: 'Set firmness', scaleName: SET_FIRMNESS_LINE.name }, { id: 'a2', name: 'Overall liking', scaleName: '9-point hedonic' }]}
        suggestedAttributeIds={['a1', 'a2']}
      />,
    );
    const text = document.body.textContent ?? '';
    expect(text).not.toContain('Set firmness (Set firmness)');
    expect(screen.getByText(/9-point hedonic/)).toBeTruthy();
  });
});
