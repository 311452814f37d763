// @vitest-environment jsdom
/** The price forms share one state (components/pricing/usePriceForm): what each sends, keeps and resets. */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';

const router = vi.hoisted(() => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }));
vi.mock('next/navigation', () => ({ useRouter: () => router }));
const actions = vi.hoisted(() => ({
  addIngredientPriceAction: vi.fn(), addPackagingPriceAction: vi.fn(), saveCostSettingsAction: vi.fn(), setRefuseAction: vi.fn(),
}));
vi.mock('@/lib/pricing/actions', () => actions);

import { IngredientPriceForm } from '@/components/pricing/IngredientPriceForm';
import { PackagingPriceForm } from '@/components/pricing/PackagingPriceForm';
import { CostSettingsForm } from '@/components/pricing/CostSettingsForm';
import { RefuseForm } from '@/components/pricing/RefuseForm';

const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });
const valueOf = (label: string) => (screen.getByLabelText(label) as HTMLInputElement).value;
const SUGAR = '11111111-1111-4111-8111-111111111111';
const LID = '22222222-2222-4222-8222-222222222222';

afterEach(() => {
  cleanup();
  vi.clearAllMocks();
});

describe('the ingredient price form', () => {
  it('sends typed numbers, keeps the ingredient and unit after a save and empties the rest; a refusal keeps everything', async () => {
    actions.addIngredientPriceAction.mockResolvedValueOnce({ ok: false, status: 422, error: 'A price cannot be negative.', fields: { packPrice: ['A price cannot be negative.'] } });
    render(<IngredientPriceForm currency="GBP" ingredients={[{ id: SUGAR, name: 'Sucrose' }]} defaultUnit="kg" today="2026-12-03" />);
    fireEvent.change(screen.getByLabelText('Ingredient'), { target: { value: SUGAR } });
    type('Price of one pack (GBP)', '-4');
    type('Pack size', '2,5');
    type('Supplier (optional)', '  ');
    fireEvent.click(screen.getByRole('button', { name: 'Add price' }));
    expect((await screen.findAllByText('A price cannot be negative.')).length).toBeGreaterThan(0);
    expect(actions.addIngredientPriceAction).toHaveBeenCalledWith({ ingredientId: SUGAR, packPrice: '-4', packSize: 2.5, packUnit: 'kg', supplier: null, validFrom: '2026-12-03' });
    expect(valueOf('Price of one pack (GBP)')).toBe('-4');
    expect(router.refresh).not.toHaveBeenCalled();

    actions.addIngredientPriceAction.mockResolvedValueOnce({ ok: true, data: { priceId: 'x' } });
    type('Price of one pack (GBP)', '24.50');
    fireEvent.change(screen.getByLabelText('Unit'), { target: { value: 'lb' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add price' }));
    await screen.findByText('Price added. Earlier prices are kept.');
    expect(router.refresh).toHaveBeenCalledTimes(1);
    expect(valueOf('Ingredient')).toBe(SUGAR);
    expect(valueOf('Unit')).toBe('lb');
    expect(valueOf('Price of one pack (GBP)')).toBe('');
    expect(valueOf('Pack size')).toBe('');
    // The next edit takes the "saved" line away.
    type('Pack size', '25');
    expect(screen.queryByText('Price added. Earlier prices are kept.')).toBeNull();
  });

  it('has no ingredient list on an ingredient’s own page', () => {
    render(<IngredientPriceForm currency="EUR" ingredients={[]} fixedIngredientId={SUGAR} defaultUnit="kg" today="2026-12-03" />);
    expect(screen.queryByLabelText('Ingredient')).toBeNull();
  });
});

describe('the packaging price form', () => {
  it('sends the pieces as a number and keeps the item after a save', async () => {
    actions.addPackagingPriceAction.mockResolvedValueOnce({ ok: true, data: { priceId: 'x' } });
    render(<PackagingPriceForm currency="GBP" items={[{ id: LID, name: 'Lid' }]} today="2026-12-03" />);
    fireEvent.change(screen.getByLabelText('Packaging item'), { target: { value: LID } });
    type('Price of one pack (GBP)', '61.00');
    type('Pieces in the pack', '1000');
    fireEvent.click(screen.getByRole('button', { name: 'Add packaging price' }));
    await screen.findByText('Price added. Earlier prices are kept.');
    expect(actions.addPackagingPriceAction).toHaveBeenCalledWith({ packagingItemId: LID, packPrice: '61.00', piecesPerPack: 1000, supplier: null, validFrom: '2026-12-03' });
    expect(valueOf('Packaging item')).toBe(LID);
    expect(valueOf('Pieces in the pack')).toBe('1');
  });
});

describe('the packaging price form’s hint', () => {
  it('fits any packaging item, not only labels (a jar’s own price page showed “Labels by the thousand”)', () => {
    render(<PackagingPriceForm currency="GBP" items={[{ id: LID, name: 'Jar 340 g' }]} fixedItemId={LID} today="2026-12-03" />);
    const hint = screen.getByText(/How many pieces the price buys/);
    expect(hint.textContent).toContain('12 for a tray of 12 jars');
    expect(screen.queryByText(/Labels by the thousand/)).toBeNull();
  });
});

describe('the cost settings and refuse forms', () => {
  it('keep what was saved on screen, and blank or junk numbers go to the server as NaN for its message', async () => {
    actions.saveCostSettingsAction.mockResolvedValueOnce({ ok: true, data: undefined });
    render(<CostSettingsForm settings={{ currency: 'GBP', overfillPct: 2, costWarningPct: 5 }} currencies={[{ code: 'GBP', label: 'Pound sterling' }]} currencyLocked={false} />);
    type('Filling overfill (%)', '1,5');
    type('Warn when a product’s cost per jar has moved by more than (%)', 'lots');
    fireEvent.click(screen.getByRole('button', { name: 'Save cost settings' }));
    await screen.findByText('Saved.');
    expect(actions.saveCostSettingsAction).toHaveBeenCalledWith({ currency: 'GBP', overfillPct: 1.5, costWarningPct: Number.NaN });
    expect(valueOf('Filling overfill (%)')).toBe('1,5');
    cleanup();

    actions.setRefuseAction.mockResolvedValueOnce({ ok: false, status: 422, error: 'Some fields need attention.', fields: { refusePct: ['At most 95 %.'] } });
    render(<RefuseForm ingredientId={SUGAR} refusePct={0} />);
    type('Refuse and trim (% of the bought mass)', '120');
    fireEvent.click(screen.getByRole('button', { name: 'Save refuse' }));
    await screen.findByText('At most 95 %.');
    expect(actions.setRefuseAction).toHaveBeenCalledWith({ ingredientId: SUGAR, refusePct: 120 });
    // The field says what is wrong; the summary line is not repeated above it.
    expect(screen.queryByText('Some fields need attention.')).toBeNull();
  });
});
