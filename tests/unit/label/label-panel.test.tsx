// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import { LabelPanel } from '@/components/label/LabelPanel';
import { sampleLabel } from './sample-label';

afterEach(cleanup);

describe('LabelPanel', () => {
  it('shows an unknown figure as unknown, never as 0', () => {
    render(<LabelPanel label={sampleLabel()} />);
    const eu = screen.getByRole('region', { name: 'EU nutrition declaration' });
    const saturates = within(eu).getByRole('rowheader', { name: 'of which saturates' }).closest('tr')!;
    expect(within(saturates).getAllByText('unknown')).toHaveLength(2);
    expect(saturates.textContent).not.toMatch(/\b0\b/);
    const us = screen.getByRole('region', { name: 'US nutrition facts' });
    const added = within(us).getByRole('rowheader', { name: 'Includes added sugars' }).closest('tr')!;
    expect(within(added).getAllByText('unknown').length).toBeGreaterThanOrEqual(2);
  });

  it('shows the label value with the unrounded value beside it, and marks an incomplete sum', () => {
    render(<LabelPanel label={sampleLabel()} />);
    const eu = screen.getByRole('region', { name: 'EU nutrition declaration' });
    const fat = within(eu).getByRole('rowheader', { name: 'Fat' }).closest('tr')!;
    expect(fat.textContent).toContain('<0.5 g');
    expect(fat.textContent).toContain('0.12 g');
    const carbohydrate = within(eu).getByRole('rowheader', { name: 'Carbohydrate' }).closest('tr')!;
    expect(carbohydrate.textContent).toContain('(incomplete)');
    expect(screen.getByRole('region', { name: 'US nutrition facts' }).querySelector('caption')!.textContent).toContain('Serving size 1 tbsp (20 g); 12.5 servings per container.');
  });

  it('emphasises allergens in the ingredient list and only them', () => {
    render(<LabelPanel label={sampleLabel()} />);
    const [eu] = screen.getAllByTestId('ingredient-list');
    const strong = eu.querySelectorAll('strong');
    expect([...strong].map((s) => s.textContent)).toEqual(['sulphites']);
  });

  it('lists what is incomplete and why', () => {
    render(<LabelPanel label={sampleLabel()} />);
    const box = screen.getByTestId('label-incomplete');
    expect(box.textContent).toContain('Saturates:');
    expect(box.textContent).toContain('Not known for pectin.');
  });

  it('states the claim and the additive check with their figures', () => {
    render(<LabelPanel label={sampleLabel()} />);
    const claims = screen.getByRole('region', { name: 'Claims' });
    expect(claims.textContent).toContain('May be made');
    expect(claims.textContent).toContain('26 % less');
    const additives = screen.getByRole('region', { name: 'Additive limits' });
    expect(additives.textContent).toContain('Over the limit');
    expect(additives.textContent).toContain('1100 mg/kg as sorbic acid');
  });

  it('shows a statement it cannot make as unknown', () => {
    const label = sampleLabel();
    label.statements[0] = { kind: 'fruit', text: null, gramsPer100g: null, notes: [] };
    label.incomplete = [];
    render(<LabelPanel label={label} />);
    expect(screen.getByText('Fruit:').parentElement!.textContent).toContain('unknown');
    expect(screen.queryByTestId('label-incomplete')).toBeNull();
  });
});
