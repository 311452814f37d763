// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { act, cleanup, render, screen } from '@testing-library/react';
import { SavedNotice } from '@/components/ui/SavedNotice';

describe('SavedNotice', () => {
  afterEach(() => {
    cleanup();
    vi.useRealTimers();
    window.history.replaceState(null, '', '/');
  });

  it('announces the save after the live region is in the page, then drops ?saved= from the address and keeps the rest', () => {
    vi.useFakeTimers();
    window.history.replaceState(null, '', '/ingredients?archived=include&saved=abc');
    render(<SavedNotice text="Saved Apricot." />);
    const region = screen.getByRole('status');
    expect(region.textContent).toBe('');
    act(() => { vi.advanceTimersByTime(150); });
    expect(region.textContent).toBe('Saved Apricot.');
    expect(window.location.pathname).toBe('/ingredients');
    expect(window.location.search).toBe('?archived=include');
  });
});
