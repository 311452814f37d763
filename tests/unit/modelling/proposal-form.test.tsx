// @vitest-environment jsdom
/**
 * The Propose form's cost ceiling per jar: offered only with the day's prices (users who may see
 * prices), read in the workspace currency, held by the search, and each proposal's cost per jar shown.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { base, basis, MODEL } from './fixtures';

const router = vi.hoisted(() => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }));
vi.mock('next/navigation', () => ({ useRouter: () => router, usePathname: () => '/', useSearchParams: () => new URLSearchParams() }));
vi.mock('@/lib/trials/actions', () => ({ createProposalTrialAction: vi.fn() }));

import { ProposalForm } from '@/components/modelling/ProposalForm';

afterEach(() => cleanup());

const props = { model: MODEL, base, formulaId: '00000000-0000-4000-8000-0000000000f1', formulaName: 'Apricot spread', fruitMinimum: null, canCreateTrial: false };
const costPerJar = /^EUR\s?\d+\.\d{2}|€\s?\d+\.\d{2}/;

describe('the cost ceiling on the Propose form', () => {
  it('is not offered, and no cost is shown, without the prices', () => {
    render(<ProposalForm {...props} />);
    expect(screen.queryByLabelText(/Cost ceiling per jar/)).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Find the best formula' }));
    expect(screen.getAllByTestId('proposal').length).toBeGreaterThan(0);
    expect(screen.queryByText('Cost per jar:')).toBeNull();
  });

  it('shows each proposal’s cost per jar and holds a ceiling typed with a decimal comma', () => {
    render(<ProposalForm {...props} cost={{ basis, packFormatId: 'pf' }} />);
    fireEvent.click(screen.getByRole('button', { name: 'Find the best formula' }));
    const free = screen.getAllByText('Cost per jar:').map((dt) => dt.nextElementSibling!.textContent!);
    expect(free.length).toBeGreaterThan(0);
    for (const text of free) expect(text).toMatch(costPerJar);
    // The free search's best costs more than the ceiling below, so the ceiling must move the search.
    expect(Number(free[0].match(/(\d+\.\d{2})/)![1])).toBeGreaterThan(1.45);
    fireEvent.change(screen.getByLabelText(/Cost ceiling per jar \(EUR\)/), { target: { value: '1,45' } });
    fireEvent.click(screen.getByRole('button', { name: 'Find the best formula' }));
    const held = screen.getAllByText('Cost per jar:').map((dt) => dt.nextElementSibling!.textContent!);
    expect(held.length).toBeGreaterThan(0);
    for (const text of held) {
      expect(text).toMatch(/\(at most (EUR\s?|€\s?)1\.45\)$/);
      expect(Number(text.match(/(\d+\.\d{2})/)![1])).toBeLessThanOrEqual(1.45);
    }
  });

  it('says when the pack format fills another jar than the formula’s, naming both fills', () => {
    const jar340 = { ...basis, packFormats: [{ ...basis.packFormats[0], id: 'pf340', name: '340 g jar', netFillG: 340 }] };
    render(<ProposalForm {...props} cost={{ basis: jar340, packFormatId: 'pf340' }} />);
    expect(screen.getByTestId('proposal-cost-fill').textContent).toContain('The pack format fills 340 g jars, but the formula’s jar net fill is 250 g');
    cleanup();
    render(<ProposalForm {...props} cost={{ basis, packFormatId: 'pf' }} />);
    expect(screen.queryByTestId('proposal-cost-fill')).toBeNull();
  });

  it('names a bad ceiling and a missing pack format, and searches nothing', () => {
    render(<ProposalForm {...props} cost={{ basis, packFormatId: null }} />);
    expect(screen.getByText('This formula has no pack format, so it has no cost per jar: choose its pack format (jar and packaging) first.')).toBeTruthy();
    const field = screen.getByLabelText(/Cost ceiling per jar/);
    fireEvent.change(field, { target: { value: '0' } });
    fireEvent.click(screen.getByRole('button', { name: 'Find the best formula' }));
    expect(screen.getByText('The cost ceiling per jar must be above 0.')).toBeTruthy();
    expect(field.getAttribute('aria-invalid')).toBe('true');
    expect(screen.queryAllByTestId('proposal')).toHaveLength(0);
    fireEvent.change(field, { target: { value: '2' } });
    fireEvent.click(screen.getByRole('button', { name: 'Find the best formula' }));
    expect(screen.getByText('This formula has no pack format, so it has no cost per jar: choose its pack format (jar and packaging) first. Until then the search cannot hold a cost ceiling.')).toBeTruthy();
    expect(screen.queryAllByTestId('proposal')).toHaveLength(0);
  });
});
