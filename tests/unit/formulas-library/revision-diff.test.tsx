// @vitest-environment jsdom
import { afterEach, describe, it, expect } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { within } from '@testing-library/dom';
import { RevisionDiff } from '@/components/formulas/RevisionDiff';
import { CITRIC, FRUIT_10, IDS, LEMON, PRACTICAL_ACTION_LINES, SUGAR, line, revision, settings } from './fixtures';

afterEach(cleanup);

// Revisions built on the Practical Action technical brief "Jams, jellies and marmalade" worked batch.
// Which rows count as added / removed / changed is this feature's rule: Common practice, no published source.

function rowOf(name: string): HTMLElement {
  return screen.getByRole('rowheader', { name }).closest('tr') as HTMLElement;
}

describe('RevisionDiff', () => {
  it('says "No differences" for identical revisions', () => {
    render(<RevisionDiff before={revision(1, PRACTICAL_ACTION_LINES)} after={revision(2, PRACTICAL_ACTION_LINES)} massUnits="metric" />);
    expect(screen.getByText(/^No differences\./)).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();
  });

  it('shows a small line to its hundredths: 0.5 g → 0.83 g of citric acid is not "1 g → 1 g"', () => {
    const before = revision(1, [line(IDS.fruit, FRUIT_10, 1000), line(IDS.citric, CITRIC, 0.5)]);
    const after = revision(2, [line(IDS.fruit, FRUIT_10, 1000), line(IDS.citric, CITRIC, 0.83)]);
    render(<RevisionDiff before={before} after={after} massUnits="metric" />);
    const citric = rowOf('Citric acid');
    expect(citric.getAttribute('data-status')).toBe('changed');
    expect(within(citric).getByText('0.50 g')).toBeTruthy();
    expect([...citric.querySelectorAll('[data-changed]')].map((c) => c.textContent)).toEqual(['0.83 g']);
    expect(within(rowOf('Orchard fruit pulp')).getAllByText('1.00 kg').length).toBe(2);
  });

  it('shows added, removed and changed lines and the changed settings', () => {
    const before = revision(1, PRACTICAL_ACTION_LINES);
    const after = revision(2, [
      line(IDS.fruit, { ...FRUIT_10, solidsPct: 11 }, 10_000),
      line(IDS.sugar, SUGAR, 9_500),
      line(IDS.citric, CITRIC, 55),
      line(IDS.lemon, LEMON, 200),
    ], { settings: settings({ productClass: 'extra_jam', jarNetFillG: 227 }) });
    render(<RevisionDiff before={before} after={after} massUnits="metric" />);

    expect(screen.getByRole('heading', { name: 'Revision 1 → revision 2' })).toBeTruthy();
    const productClass = rowOf('Product class');
    expect(within(productClass).getByText('Jam')).toBeTruthy();
    expect(within(productClass).getByText('Extra jam')).toBeTruthy();
    expect(within(rowOf('Jar net fill (g)')).getByText('227 g')).toBeTruthy();
    expect(screen.queryByRole('rowheader', { name: 'Market rule set' })).toBeNull();

    const added = rowOf('Lemon juice');
    expect(added.getAttribute('data-status')).toBe('added');
    expect(added.className).toContain('bg-leaf-50');
    expect(within(added).getByText('Added')).toBeTruthy();

    const removed = rowOf('HM pectin grade 200');
    expect(removed.getAttribute('data-status')).toBe('removed');
    expect(removed.className).toContain('line-through');
    expect(removed.className).toContain('bg-ember-50');

    const sugar = rowOf('White sugar');
    expect(sugar.getAttribute('data-status')).toBe('changed');
    const changedSugarCells = sugar.querySelectorAll('[data-changed]');
    expect([...changedSugarCells].map((c) => c.textContent)).toEqual(['9.50 kg']);

    const fruit = rowOf('Orchard fruit pulp');
    expect([...fruit.querySelectorAll('[data-changed]')].map((c) => c.textContent)).toEqual(['11 %']);
    expect(within(fruit).getByText(/Soluble solids \(%\): 10 % →/)).toBeTruthy();

    expect(rowOf('Citric acid').getAttribute('data-status')).toBe('unchanged');
  });

  it('shows masses in the user’s units', () => {
    const before = revision(1, [line(IDS.sugar, SUGAR, 1000)]);
    const after = revision(2, [line(IDS.sugar, SUGAR, 453.59237)]);
    render(<RevisionDiff before={before} after={after} massUnits="imperial" />);
    // Source: international yard and pound agreement (1959): 1 lb = 453.59237 g exactly, 1 oz = 1/16 lb
    const sugar = rowOf('White sugar');
    expect(within(sugar).getByText('2.20 lb')).toBeTruthy();
    expect(within(sugar).getByText('1.00 lb')).toBeTruthy();
  });
});
