// @vitest-environment jsdom
/**
 * A home page's worklist counts what waits, not the links that start new work: production's "Today's
 * batches" said 12 for nine batches and three "Record a batch of …" links, and never said that no
 * batch was recorded today while a product was in production.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import { WorkList } from '@/components/home/WorkList';

afterEach(cleanup);

const batch = (n: number) => ({ key: `b${n}`, href: `/production/batches/${n}`, label: `BCJ-26338-${n}: Blackcurrant jam`, detail: 'Passed its checks.' });
const start = { key: 's', href: '/production/versions/v/batches/new', label: 'Record a batch of Blackcurrant jam', detail: 'Version 1' };

describe('a worklist', () => {
  it('counts its items, not the links that start new work', () => {
    render(<WorkList title="Today’s batches" empty="No batch recorded today yet." items={[batch(1), batch(2)]} actions={[start]} />);
    const part = screen.getByRole('region', { name: 'Today’s batches' });
    expect(within(part).getByRole('heading').textContent).toBe('Today’s batches2');
    expect(within(part).getByRole('list', { name: 'Start' }).textContent).toContain('Record a batch of Blackcurrant jam');
  });

  it('says nothing waits, and still offers to start', () => {
    render(<WorkList title="Today’s batches" empty="No batch recorded today yet." items={[]} actions={[start]} />);
    const part = screen.getByRole('region', { name: 'Today’s batches' });
    expect(within(part).getByText('No batch recorded today yet.')).toBeTruthy();
    expect(within(part).getByRole('heading').textContent).toBe('Today’s batches');
    expect(within(part).getByRole('link', { name: 'Record a batch of Blackcurrant jam' }).getAttribute('href')).toBe('/production/versions/v/batches/new');
  });
});
