// @vitest-environment jsdom
import { describe, it, expect, vi, afterEach } from 'vitest';
import { render, screen, cleanup } from '@testing-library/react';
import { compareVariants } from '@/lib/results/comparison';

// chart.js has no canvas under jsdom: the charts render as labelled stand-ins.
vi.mock('react-chartjs-2', () => ({ Bar: (props: { data: { labels: string[] } }) => <div data-testid="bar">{props.data.labels.join('|')}</div> }));

import { FactorEffectsCard } from '@/components/results/FactorEffects';

afterEach(cleanup);

const lab = { ph: null, brix20: null, yieldRatio: null };

describe('the factor effects card on Compare', () => {
  it('does not credit sugar ratio with a difference it shares with pectin dose, and explains why in one sentence', () => {
    // Hand-worked (the case seen on the Compare page): base (0.78, 6.0) against B (0.65, 5.0), both factors changed.
    const { effects } = compareVariants(
      [
        { label: 'Base', factorLevels: { sugar_ratio: 0.78, pectin_dose: 6.0 }, lab },
        { label: 'B', factorLevels: { sugar_ratio: 0.65, pectin_dose: 5.0 }, lab },
      ],
      [{ attribute: 'Overall liking', label: 'Base', mean: 4.5 }, { attribute: 'Overall liking', label: 'B', mean: 7.67 }],
    );
    render(<FactorEffectsCard effect={effects[0]} />);
    const card = screen.getByTestId('factor-effects');
    expect(card.textContent).not.toContain('3.17');
    expect(card.textContent).toContain('Sugar ratio: cannot be separated from pectin dose');
    expect(card.textContent).toContain('Pectin dose: cannot be separated from sugar ratio');
    expect(screen.getAllByTestId('aliasing')).toHaveLength(1);
    expect(screen.getByTestId('aliasing').textContent).toMatch(/^Sugar ratio and pectin dose changed together/);
    expect(screen.queryByTestId('bar')).toBeNull();
    expect(card.textContent).not.toMatch(/sugar_ratio|pectin_dose/);
  });

  it('shows each effect with its standard error when the design separates them', () => {
    // Hand computation for a 2² design (Montgomery, ch. 6: effect = mean at high − mean at low):
    // sugar (7 + 9)/2 − (5 + 6)/2 = 2.50. The main-effects fit leaves the interaction as residual:
    // (5 − 7 − 6 + 9)/4 = 0.25 per run, SS 0.25 on 1 df; SE of the effect = 2·√(0.25/4) = 0.50.
    const { effects } = compareVariants(
      [
        { label: 'A', factorLevels: { sugar_ratio: 0.8, acid_dose: 3 }, lab },
        { label: 'B', factorLevels: { sugar_ratio: 1.0, acid_dose: 3 }, lab },
        { label: 'C', factorLevels: { sugar_ratio: 0.8, acid_dose: 7 }, lab },
        { label: 'D', factorLevels: { sugar_ratio: 1.0, acid_dose: 7 }, lab },
      ],
      [5, 7, 6, 9].map((mean, i) => ({ attribute: 'Overall liking', label: 'ABCD'[i], mean })),
    );
    render(<FactorEffectsCard effect={effects[0]} />);
    expect(screen.getByTestId('factor-effects').textContent).toContain('Sugar ratio: 2.50 ± 0.50');
    expect(screen.queryByTestId('aliasing')).toBeNull();
    expect(screen.getByTestId('bar').textContent).toBe('Sugar ratio|Acid dose');
  });
});
