// @vitest-environment jsdom
/**
 * Every area of the staff app has its own loading skeleton, error boundary and 404, so a slow or
 * failing page keeps the navigation and says what did not load (issue 18, part 6).
 */
import { readdirSync, existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { render, screen, fireEvent } from '@testing-library/react';
import { PageSkeleton } from '@/components/shell/PageSkeleton';
import { AreaError } from '@/components/shell/AreaError';

const LAB = path.join(process.cwd(), 'app', '(lab)');
const areas = readdirSync(LAB).filter((name) => statSync(path.join(LAB, name)).isDirectory());

describe('area boundaries', () => {
  it('finds the areas', () => {
    expect(areas).toEqual(expect.arrayContaining(['formulas', 'trials', 'panels', 'production', 'ingredients', 'settings', 'home', 'tastings', 'prices']));
  });

  it.each(areas)('%s has loading.tsx, error.tsx and not-found.tsx', (area) => {
    const missing = ['loading.tsx', 'error.tsx', 'not-found.tsx'].filter((file) => !existsSync(path.join(LAB, area, file)));
    expect(missing).toEqual([]);
  });

  it('the skeleton announces loading once and draws no headings a test or reader could mistake for content', () => {
    const { container } = render(<PageSkeleton shape="detail" />);
    expect(screen.getByRole('status').textContent).toBe('Loading…');
    expect(container.querySelector('h1, h2, h3')).toBeNull();
  });

  it('the error boundary names what failed and retries on request', () => {
    const reset = vi.fn();
    render(<AreaError what="Trials" reset={reset} />);
    expect(screen.getByRole('heading', { level: 1 }).textContent).toBe('Trials did not load');
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(reset).toHaveBeenCalledTimes(1);
  });
});
