// @vitest-environment jsdom
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, it, expect, vi, afterEach } from 'vitest';
import { render, screen, cleanup, within } from '@testing-library/react';
import { analyseTasting, type TastingData } from '@/lib/results/analysis';
import { clipInterval, jarDiverging } from '@/lib/results/chart-data';

// chart.js has no canvas under jsdom: the charts render as stand-ins that keep the props they were given.
const charts = vi.hoisted(() => ({ props: [] as Array<{ data: any; options: any }> }));
vi.mock('react-chartjs-2', () => ({
  Bar: (props: { data: { labels: string[] }; options: unknown }) => {
    charts.props.push(props as never);
    return <div data-testid="bar">{props.data.labels.join('|')}</div>;
  },
}));

import { ResultsView } from '@/components/results/ResultsView';

afterEach(() => {
  cleanup();
  charts.props.length = 0;
});

// Invented answers of four tasters on two samples: liking (1–9), sweetness (JAR 1–5) and set firmness (0–10).
const LIKING = { a: [9, 9, 9, 5], b: [6, 7, 6, 5] };
const SWEET = { a: [3, 3, 4, 5], b: [1, 3, 3, 2] };
const FIRM = { a: [6, 7, 5.5, 6], b: [4, 3.5, 5, 4] };
function data(): TastingData {
  const samples = [{ sampleId: 'a', label: 'A', description: '' }, { sampleId: 'b', label: 'B', description: '' }];
  const answers = (['a', 'b'] as const).flatMap((sampleId) => [0, 1, 2, 3].flatMap((seatIndex) => [
    { seatIndex, kind: 'rating' as const, attribute: 'like', sampleId, value: LIKING[sampleId][seatIndex], rankingSampleIds: null, correct: null },
    { seatIndex, kind: 'rating' as const, attribute: 'sweet', sampleId, value: SWEET[sampleId][seatIndex], rankingSampleIds: null, correct: null },
    { seatIndex, kind: 'rating' as const, attribute: 'firm', sampleId, value: FIRM[sampleId][seatIndex], rankingSampleIds: null, correct: null },
  ]));
  return {
    method: 'rated', samples, answers, seatCount: 4, submittedSeats: 4,
    attributes: [
      { id: 'like', name: 'Overall liking', purpose: 'liking' },
      { id: 'sweet', name: 'Sweetness', purpose: 'just-about-right' },
      { id: 'firm', name: 'Set firmness', purpose: 'intensity', highAnchor: 'Very firm' },
    ],
  };
}

describe('results that read well', () => {
  it('tables have real columns: one header per column, padded cells, numbers in their own cells, and a box that scrolls sideways', () => {
    render(<ResultsView analysis={analyseTasting(data())} />);
    const summary = screen.getAllByTestId('summary-table')[0];
    expect(summary.parentElement!.className).toContain('overflow-x-auto');
    expect(within(summary).getAllByRole('columnheader').map((h) => h.textContent)).toEqual(['Sample', 'Group', 'n', 'Mean', '95 % CI', 'SD']);
    const rowA = within(summary).getByRole('row', { name: /^A/ });
    const cells = [...rowA.children].map((c) => c.textContent);
    expect(cells[0]).toBe('A');
    expect(cells[1]).toMatch(/^[a-z]+$/); // the group letters, beside the sample
    expect(cells.slice(2, 4)).toEqual(['4', '8.00']); // mean of 9, 9, 9, 5
    // Each cell is one of the data table's padded kinds (defined once in app/globals.css, below).
    for (const cell of rowA.children) expect(cell.className).toMatch(/\bdata-(cell|num)\b/);
    const css = readFileSync(resolve(__dirname, '../../../app/globals.css'), 'utf8');
    for (const kind of ['data-cell', 'data-num', 'data-th', 'data-th-num']) expect(css).toMatch(new RegExp(`\\.${kind} \\{\\s*@apply px-3 py-`));
    expect(css).toMatch(/\.data-num \{\s*@apply [^;]*text-right tabular-nums/);

    const penalty = screen.getByTestId('penalty-table');
    expect(penalty.parentElement!.className).toContain('overflow-x-auto');
    const headers = within(penalty).getAllByRole('columnheader').map((h) => h.textContent);
    expect(headers).toEqual(['Sample', 'Group', 'Share', 'Note', 'Mean liking', 'Mean drop', 'Weighted penalty']);
    // Sample A, too much: seats 3 and 4 (scores 4, 5) of four, liking 9 and 5 → share 50 %, mean 7.00; JAR mean 9, drop 2.00.
    const tooMuchA = within(penalty).getAllByRole('row', { name: /Too much/ })[0];
    expect([...tooMuchA.querySelectorAll('td')].map((c) => c.textContent)).toEqual(['50 %', '', '7.00', '2.00', '1.00']);
    // B, too much: nobody, so "under 20 %" sits in its own cell, never glued to the share.
    const tooMuchB = within(penalty).getAllByRole('row', { name: /Too much/ })[1];
    expect([...tooMuchB.querySelectorAll('td')].map((c) => c.textContent).slice(0, 2)).toEqual(['0 %', 'under 20 %: not read']);
  });

  it('cuts whiskers at the end of the scale and says so', () => {
    // Sample A liking 9, 9, 9, 5: mean 8, SD 2, t(0.975, 3) = 3.182 → 95 % CI 4.82 to 11.18, past the 1–9 scale.
    // Source: Student t quantile t(0.975, 3) = 3.182 (NIST/SEMATECH e-Handbook, Table 1.3.6.7.2).
    render(<ResultsView analysis={analyseTasting(data())} />);
    const liking = charts.props.find((p) => p.data.datasets[0]?.label === 'Overall liking')!;
    const [a] = liking.options.plugins.setwellErrorBars.intervals;
    expect(a.upper).toBe(9);
    expect(a.clippedUpper).toBe(true);
    expect(a.rawUpper).toBeCloseTo(8 + 3.182446 * 1, 4);
    expect(a.lower).toBeCloseTo(8 - 3.182446, 4);
    expect(screen.getAllByTestId('whisker-clip-note')[0].textContent).toBe(
      'The 95 % interval of A (to 11.18) runs past the 1–9 scale; its whisker is cut at the end of the scale and drawn open.',
    );
    expect(clipInterval([0.4, 5.77], { min: 1, max: 5 })).toEqual({ lower: 1, upper: 5, clippedLower: true, clippedUpper: true, rawLower: 0.4, rawUpper: 5.77 });
  });

  it('draws one profile chart per scale, each on its own axis', () => {
    render(<ResultsView analysis={analyseTasting(data())} />);
    const profiles = screen.getAllByTestId('profile-chart');
    expect(profiles.map((p) => p.getAttribute('aria-label'))).toEqual([
      'Profile, Liking, 1–9 hedonic scale: mean score of each sample on each attribute',
      'Profile, Just about right, 1–5 (3 = just right): mean score of each sample on each attribute',
      'Profile, Intensity, 0–10 line scale: mean score of each sample on each attribute',
    ]);
    const axes = charts.props.filter((p) => p.data.datasets[0]?.label === 'Sample A').map((p) => [p.options.scales.y.min, p.options.scales.y.max]);
    expect(axes).toEqual([[1, 9], [1, 5], [0, 10]]);
    // The JAR profile starts its bars at 3; a mean of exactly 3 keeps a visible stub instead of no bar.
    const jarProfile = charts.props.filter((p) => p.data.datasets[0]?.label === 'Sample A')[1];
    for (const d of jarProfile.data.datasets) expect([d.base, d.minBarLength]).toEqual([3, 3]);
  });

  it('shows just-about-right as diverging bars around the centre', () => {
    // Sample B sweetness 1, 3, 3, 2: too little 50 %, just right 50 % (25 % each side of the centre), too much 0 %.
    expect(jarDiverging([{ label: 'B', tooLittle: 2, justAboutRight: 2, tooMuch: 0, n: 4 }])).toEqual({
      labels: ['B'], justRightLeft: [-25], tooLittle: [-50], justRightRight: [25], tooMuch: [0],
    });
    render(<ResultsView analysis={analyseTasting(data())} />);
    const jar = charts.props.find((p) => p.data.datasets[0]?.label === 'Just about right')!;
    expect(jar.options.scales.x.min).toBe(-100);
    expect(jar.data.datasets.map((d: any) => d.data[1])).toEqual([-25, -50, 25, 0]);
  });

  it('the pooled penalty analysis appears only when asked for', () => {
    const links = { showHref: '/tastings/x/results?penalty=pooled', hideHref: '/tastings/x/results' };
    render(<ResultsView analysis={analyseTasting(data())} pooledPenalty={links} />);
    expect(screen.queryByTestId('pooled-penalty-table')).toBeNull();
    expect(screen.getByRole('link', { name: 'Also show all samples pooled' }).getAttribute('href')).toBe(links.showHref);
    cleanup();
    render(<ResultsView analysis={analyseTasting(data(), { pooledPenalty: true })} pooledPenalty={links} />);
    expect(screen.getByTestId('pooled-penalty-table')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Hide the pooled analysis' })).toBeTruthy();
  });
});
