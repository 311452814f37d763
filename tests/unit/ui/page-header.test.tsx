// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { PageHeader } from '@/components/ui/Card';

afterEach(cleanup);

describe('PageHeader', () => {
  it('keeps record codes whole on a narrow screen (no break inside PR-004 or T-006), and the title reads the same', () => {
    render(<PageHeader title="PR-004: variant B of T-006" />);
    const heading = screen.getByRole('heading', { level: 1 });
    expect(heading.textContent).toBe('PR-004: variant B of T-006');
    const whole = [...heading.querySelectorAll('span.whitespace-nowrap')].map((s) => s.textContent);
    expect(whole).toEqual(['PR-004', 'T-006']);
  });

  it('leaves a title without codes as plain text', () => {
    render(<PageHeader title="Ingredients" />);
    expect(screen.getByRole('heading', { level: 1 }).querySelectorAll('span')).toHaveLength(0);
  });
});
