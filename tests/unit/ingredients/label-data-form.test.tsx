// @vitest-environment jsdom
import { afterEach, beforeEach, describe, it, expect, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { waitFor } from '@testing-library/dom';
import { ingredientInputSchema } from '@/lib/ingredients/schema';
import { typicalRow } from '../formulas-library/fixtures';

const router = vi.hoisted(() => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }));
const saveIngredientAction = vi.hoisted(() => vi.fn());
vi.mock('next/navigation', () => ({ useRouter: () => router, usePathname: () => '/', useSearchParams: () => new URLSearchParams() }));
vi.mock('@/lib/ingredients/actions', () => ({ saveIngredientAction, archiveIngredientAction: vi.fn() }));

import { IngredientForm } from '@/components/ingredients/IngredientForm';
import { IngredientTable } from '@/components/ingredients/IngredientTable';

beforeEach(() => saveIngredientAction.mockReset());
afterEach(cleanup);

describe('the label and nutrition section', () => {
  it('shows a starter entry’s values, with empty boxes where the source has none', () => {
    render(<IngredientForm initial={typicalRow('blackcurrant')} />);
    // Source: USDA SR28 NDB 09083 (currants, european black, raw): water 81.96 g; no fibre or sugars given.
    expect(screen.getByLabelText('Water (g)')).toHaveProperty('value', '81.96');
    expect(screen.getByLabelText('Sugars (g)')).toHaveProperty('value', '');
    expect(screen.getByLabelText('Sugars (g)').getAttribute('placeholder')).toBe('unknown');
    expect(screen.getByText('Unknown: sugars (g), fibre (g)')).toBeTruthy();
    expect(screen.getByLabelText('Name in the ingredient list')).toHaveProperty('value', 'blackcurrants');
  });

  it('sends typed values, checked allergens and the additive; empty boxes as unknown (null)', async () => {
    saveIngredientAction.mockResolvedValue({ ok: true, data: { ingredientId: 'x' } });
    render(<IngredientForm />);
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Almond paste' } });
    fireEvent.change(screen.getByLabelText('Kind'), { target: { value: 'other' } });
    fireEvent.change(screen.getByLabelText('Soluble solids (°Brix / %)'), { target: { value: '60' } });
    fireEvent.change(screen.getByLabelText('Fat (g)'), { target: { value: '24,5' } });
    fireEvent.click(screen.getByLabelText('Nuts (almond, hazelnut, walnut and other tree nuts)'));
    fireEvent.click(screen.getByLabelText('Tree nuts'));
    fireEvent.change(screen.getByLabelText('E-number, if an additive'), { target: { value: 'e 330' } });
    fireEvent.change(screen.getByLabelText('Additive class'), { target: { value: 'acid' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add ingredient' }));
    await waitFor(() => expect(saveIngredientAction).toHaveBeenCalledTimes(1));
    const [, data] = saveIngredientAction.mock.calls[0];
    expect(data.labelData).toMatchObject({ euAllergens: ['nuts'], usAllergens: ['tree_nuts'], additive: { eNumber: 'e 330', functionalClass: 'acid' }, labelName: null });
    expect(data.labelData.nutrients.fatG).toBe(24.5);
    expect(data.labelData.nutrients.waterG).toBeNull();
    // The shared schema accepts it and writes the E-number as the EU does.
    expect(ingredientInputSchema.parse(data).labelData?.additive?.eNumber).toBe('E330');
  });

  it('refuses a number it cannot read before calling the server, and shows the server’s errors by the field', async () => {
    render(<IngredientForm />);
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'X' } });
    fireEvent.change(screen.getByLabelText('Soluble solids (°Brix / %)'), { target: { value: '10' } });
    fireEvent.change(screen.getByLabelText('Sodium (mg)'), { target: { value: 'a pinch' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add ingredient' }));
    expect(await screen.findByText('Sodium (mg) must be a number, or empty when not known.')).toBeTruthy();
    expect(saveIngredientAction).not.toHaveBeenCalled();

    saveIngredientAction.mockResolvedValue({ ok: false, status: 422, error: 'Check the values.', fields: { 'data.labelData.additive.eNumber': ['Write the E-number like E440, E160a or E472(ii).'] } });
    fireEvent.change(screen.getByLabelText('Sodium (mg)'), { target: { value: '' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add ingredient' }));
    expect(await screen.findByText('Write the E-number like E440, E160a or E472(ii).')).toBeTruthy();
    expect(screen.getByLabelText('E-number, if an additive').getAttribute('aria-invalid')).toBe('true');
  });
});

describe('the library list', () => {
  it('says whether each ingredient’s composition is complete', () => {
    render(<IngredientTable rows={[typicalRow('strawberry'), typicalRow('quince')]} query={{}} canEdit />);
    expect(screen.getByText('Complete')).toBeTruthy();
    // Source: USDA SR28 NDB 09296 (quinces, raw) gives no sugars.
    expect(screen.getByText('Unknown: sugars (g)')).toBeTruthy();
  });
});
