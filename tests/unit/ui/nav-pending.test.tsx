// @vitest-environment jsdom
/**
 * Pages have no loading.tsx (it would turn a 404 or 403 into HTTP 200), so the main navigation
 * marks the link whose page is loading: a pulsing dot and "Loading…" for screen readers, only while
 * Next.js reports that link's navigation as pending (useLinkStatus).
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';

const status = vi.hoisted(() => ({ pending: false }));
vi.mock('next/link', async () => {
  const React = await import('react');
  return {
    default: ({ href, children, ...rest }: { href: string; children: React.ReactNode }) => React.createElement('a', { href, ...rest }, children),
    useLinkStatus: () => ({ pending: status.pending }),
  };
});
vi.mock('next/navigation', () => ({ usePathname: () => '/home' }));

const { NavLinks } = await import('@/components/shell/NavLinks');
const { NAV_ITEMS } = await import('@/lib/navigation');
const items = NAV_ITEMS.filter((i) => i.href === '/home' || i.href === '/formulas');

afterEach(cleanup);

describe('the main navigation while a page loads', () => {
  it('shows nothing extra when no navigation is pending', () => {
    status.pending = false;
    render(<NavLinks items={items} />);
    expect(screen.queryByTestId('nav-pending')).toBeNull();
    expect(screen.getByRole('link', { name: 'Formulas' }).textContent).toBe('Formulas');
  });

  it('marks a pending link with a status that says it is loading, its dot hidden from screen readers and still for reduced motion', () => {
    status.pending = true;
    render(<NavLinks items={items} />);
    const link = screen.getByRole('link', { name: /Formulas/ });
    const mark = within(link).getByRole('status');
    expect(mark.textContent).toBe('Loading…');
    const dot = mark.querySelector('[aria-hidden="true"]')!;
    expect(dot.classList.contains('animate-pulse') && dot.classList.contains('motion-reduce:animate-none')).toBe(true);
    expect(mark.getAttribute('style')).toBeNull();
  });
});
