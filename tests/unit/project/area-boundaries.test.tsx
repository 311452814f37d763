// @vitest-environment jsdom
/**
 * Every area of the staff app has its own error boundary and 404, so a failing page keeps the
 * navigation and says what did not load (issue 18, part 6). No area has a loading.tsx: a loading
 * boundary streams the page, and a 404 or 403 decided after streaming has begun goes out as HTTP
 * 200 — the status codes the API, the fuzz test and every client rely on come first.
 */
import { readdirSync, existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { render, screen, fireEvent } from '@testing-library/react';
import { AreaError } from '@/components/shell/AreaError';

const LAB = path.join(process.cwd(), 'app', '(lab)');
const areas = readdirSync(LAB).filter((name) => statSync(path.join(LAB, name)).isDirectory());

describe('area boundaries', () => {
  it('finds the areas', () => {
    expect(areas).toEqual(expect.arrayContaining(['formulas', 'trials', 'production', 'ingredients', 'settings', 'home', 'tastings', 'prices']));
  });

  it.each(areas)('%s has error.tsx and not-found.tsx, and no loading.tsx that would turn its 404s into 200s', (area) => {
    const missing = ['error.tsx', 'not-found.tsx'].filter((file) => !existsSync(path.join(LAB, area, file)));
    expect(missing).toEqual([]);
    expect(existsSync(path.join(LAB, area, 'loading.tsx'))).toBe(false);
  });

  it('the error boundary names what failed and retries on request', () => {
    const reset = vi.fn();
    render(<AreaError what="Trials" reset={reset} />);
    expect(screen.getByRole('heading', { level: 1 }).textContent).toBe('Trials did not load');
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(reset).toHaveBeenCalledTimes(1);
  });
});
