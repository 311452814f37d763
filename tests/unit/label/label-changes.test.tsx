// @vitest-environment jsdom
/**
 * Issue 15 part 8: "the version diff says when the label changes". The review page's panel
 * (components/label/LabelChanges.tsx) states the verdict from the rows of labelChanges() and lists
 * each row whose printed text differs. The wording is the issue's own ("the declaration changes:
 * relabel before this batch"); the rows and figures come from the sample label (sample-label.ts).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import { LabelChanges } from '@/components/label/LabelChanges';
import { labelChanges } from '@/lib/label/label';
import { sampleLabel } from './sample-label';

afterEach(cleanup);

type Comparison = Parameters<typeof LabelChanges>[0]['comparison'];

describe('the label changes of a new version', () => {
  it('says to relabel before the batch and names the rows that change, with both printed texts', () => {
    const after = sampleLabel();
    after.eu.rows[5] = { ...after.eu.rows[5], unrounded: 39.8, label: '40 g' };
    const comparison: Comparison = { baselineVersion: 3, baselineKept: 'frozen', changes: labelChanges(sampleLabel(), after), problem: null };
    render(<LabelChanges comparison={comparison} />);
    expect(screen.getByText('The declaration changes: relabel before this batch.')).toBeTruthy();
    expect(screen.getByText('Compared with the label frozen when version 3 was approved.')).toBeTruthy();
    const table = screen.getByRole('region', { name: 'Label rows that change' });
    const row = within(table).getByRole('rowheader', { name: 'of which sugars' }).closest('tr')!;
    expect(row.textContent).toContain('EU declaration, 100 g');
    expect(row.textContent).toContain('44 g');
    expect(row.textContent).toContain('40 g');
    expect(within(table).getAllByRole('row')).toHaveLength(2);
  });

  it('says no relabelling is needed when only unrounded figures move', () => {
    const after = sampleLabel();
    after.eu.rows[0].unrounded = 771.2;
    const comparison: Comparison = { baselineVersion: 2, baselineKept: 'not_frozen', changes: labelChanges(sampleLabel(), after), problem: null };
    render(<LabelChanges comparison={comparison} />);
    expect(screen.getByText("The label reads the same as version 2's: no relabelling is needed.")).toBeTruthy();
    expect(screen.getByText(/Version 2's label was not frozen at approval/)).toBeTruthy();
    expect(screen.queryByRole('region', { name: 'Label rows that change' })).toBeNull();
  });

  it('does not ask to relabel when only the additive limits (not printed on the pack) differ', () => {
    const before = sampleLabel();
    const after = sampleLabel();
    after.additives = [...after.additives, { ...after.additives[0], name: 'Calcium citrate (E 333)' }];
    const changes = labelChanges(before, after);
    expect(changes.map((c) => [c.section, c.printed])).toEqual([['Additive limits', false]]);
    render(<LabelChanges comparison={{ baselineVersion: 4, baselineKept: 'frozen', changes, problem: null }} />);
    expect(screen.queryByText(/relabel before this batch/)).toBeNull();
    expect(screen.getByText("The printed label reads the same as version 4's: no relabelling is needed. Some checks behind it change (below).")).toBeTruthy();
    const table = screen.getByRole('region', { name: 'Label rows that change' });
    expect(within(table).getByText('not printed on the pack')).toBeTruthy();
  });

  it('says when the labels cannot be compared instead of claiming no change', () => {
    const comparison: Comparison = { baselineVersion: 1, baselineKept: 'frozen', changes: [], problem: 'The proposed formula has an ingredient without label data.' };
    render(<LabelChanges comparison={comparison} />);
    expect(screen.getByText('The labels cannot be compared')).toBeTruthy();
    expect(screen.queryByText(/no relabelling is needed/)).toBeNull();
  });
});
