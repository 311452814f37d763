// @vitest-environment jsdom
/** The shared loading placeholder: announced as busy with words, bars hidden from screen readers, no inline style (CSP). */
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { renderToStaticMarkup } from 'react-dom/server';
import { Skeleton } from '@/components/ui/Skeleton';

afterEach(cleanup);

describe('Skeleton', () => {
  it('is a busy status that says what is loading, with its bars hidden from assistive technology', () => {
    render(<Skeleton what="the statistics" lines={5} />);
    const status = screen.getByRole('status');
    expect(status.getAttribute('aria-busy')).toBe('true');
    expect(status.textContent).toBe('Loading the statistics…');
    expect(status.querySelector('.sr-only')?.textContent).toBe('Loading the statistics…');
    const bars = status.querySelectorAll('[aria-hidden="true"]');
    expect(bars).toHaveLength(5);
    // The pulse stops for people who ask for less motion.
    expect([...bars].every((b) => b.classList.contains('animate-pulse') && b.classList.contains('motion-reduce:animate-none'))).toBe(true);
  });

  it('shows at least one bar and never an inline style', () => {
    const html = renderToStaticMarkup(<Skeleton what="the tastings" lines={0} />);
    expect(html).not.toMatch(/style=/);
    expect(html.match(/aria-hidden="true"/g)).toHaveLength(1);
  });
});
