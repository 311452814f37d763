// @vitest-environment jsdom
import { describe, it, expect, vi, afterEach } from 'vitest';
import { render, screen, cleanup, within } from '@testing-library/react';
import { analyseTasting } from '@/lib/results/analysis';

// chart.js has no canvas under jsdom: the charts render as labelled stand-ins.
vi.mock('react-chartjs-2', () => ({ Bar: (props: { data: { labels: string[] } }) => <div data-testid="bar">{props.data.labels.join('|')}</div> }));

import { ResultsView } from '@/components/results/ResultsView';

afterEach(cleanup);

// Source: Montgomery, Design and Analysis of Experiments, Example 4.1 (treatments p = 0.0019163).
const DATA = {
  A: [90.3, 89.2, 98.2, 93.9, 87.4, 97.9],
  B: [92.5, 89.5, 90.6, 94.7, 87.0, 95.8],
  C: [85.5, 90.8, 89.6, 86.2, 88.0, 93.4],
  D: [82.5, 89.5, 85.6, 87.4, 78.9, 90.7],
};

describe('the results view', () => {
  it('shows the verdict, the summary table with letters, and the ANOVA table', () => {
    const analysis = analyseTasting({
      method: 'rated',
      samples: Object.keys(DATA).map((l) => ({ sampleId: l, label: l, description: '' })),
      attributes: [{ id: 'f', name: 'Set firmness', purpose: 'intensity', highAnchor: 'Very firm' }],
      answers: Object.entries(DATA).flatMap(([l, vs]) => vs.map((value, seatIndex) => ({ seatIndex, kind: 'rating' as const, attribute: 'f', sampleId: l, value, rankingSampleIds: null, correct: null }))),
      seatCount: 6,
      submittedSeats: 6,
    });
    render(<ResultsView analysis={analysis} />);
    expect(screen.getByTestId('verdict').textContent).toMatch(/p = 0\.002/);
    const table = screen.getByTestId('summary-table');
    const rowA = within(table).getByRole('row', { name: /^A/ });
    expect(rowA.textContent).toContain('92.82'); // mean of A: 556.9 / 6
    expect(screen.getByText('ANOVA table')).toBeTruthy();
    expect(screen.getAllByTestId('bar')[0].textContent).toContain('A (');
    expect(document.body.textContent).not.toContain('NaN');
  });
});
