// @vitest-environment jsdom
import { afterEach, beforeEach, describe, it, expect, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { waitFor } from '@testing-library/dom';
import { ingredientInputSchema } from '@/lib/ingredients/schema';
import { typicalRow } from './fixtures';

const router = vi.hoisted(() => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }));
const saveIngredientAction = vi.hoisted(() => vi.fn());

vi.mock('next/navigation', () => ({ useRouter: () => router, usePathname: () => '/', useSearchParams: () => new URLSearchParams() }));
vi.mock('@/lib/ingredients/actions', () => ({ saveIngredientAction, archiveIngredientAction: vi.fn() }));

import { IngredientForm, buildIngredientInput, stripFieldPrefix } from '@/components/ingredients/IngredientForm';

beforeEach(() => {
  saveIngredientAction.mockReset();
  router.push.mockReset();
  router.refresh.mockReset();
});
afterEach(cleanup);

const KIND_SPECIFIC = ['pH, lower', 'pH, upper', 'Pectin level', 'EU fruit group', 'US fruit group (21 CFR 150.160)', 'Sweetener type', 'Pectin type', 'Pectin grade', 'Acid type', 'Acid content (% as citric)', 'Supplies calcium (for low-methoxyl pectin sets)'];

function visibleKindFields(): string[] {
  return KIND_SPECIFIC.filter((label) => screen.queryByLabelText(label) !== null);
}

function chooseKind(kind: string) {
  fireEvent.change(screen.getByLabelText('Kind'), { target: { value: kind } });
}

describe('IngredientForm', () => {
  it('asks only for the properties that apply to the chosen kind', () => {
    render(<IngredientForm />);
    expect(visibleKindFields()).toEqual(['pH, lower', 'pH, upper', 'Pectin level', 'EU fruit group', 'US fruit group (21 CFR 150.160)']);
    chooseKind('pectin');
    expect(visibleKindFields()).toEqual(['Pectin type', 'Pectin grade']);
    chooseKind('sweetener');
    expect(visibleKindFields()).toEqual(['Sweetener type']);
    chooseKind('acid');
    expect(visibleKindFields()).toEqual(['pH, lower', 'pH, upper', 'Acid type', 'Acid content (% as citric)']);
    chooseKind('other');
    expect(visibleKindFields()).toEqual(['pH, lower', 'pH, upper', 'Supplies calcium (for low-methoxyl pectin sets)']);
    chooseKind('water');
    expect(visibleKindFields()).toEqual([]);
    // Name, solids and notes are asked for every kind.
    expect(screen.getByLabelText('Name')).toBeTruthy();
    expect(screen.getByLabelText('Soluble solids (°Brix / %)')).toBeTruthy();
    expect(screen.getByLabelText('Notes')).toBeTruthy();
  });

  it('sends typed values the shared schema accepts, and goes back to the library on success', async () => {
    saveIngredientAction.mockResolvedValue({ ok: true, data: { ingredientId: 'x' } });
    render(<IngredientForm />);
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: '  Orchard quince  ' } });
    // Source: 21 CFR 101.30(h)(1) Brix table for single-strength juices (memory): quince 13.3 °Brix
    fireEvent.change(screen.getByLabelText('Soluble solids (°Brix / %)'), { target: { value: '13,3' } });
    fireEvent.change(screen.getByLabelText('pH, upper'), { target: { value: '3.6' } });
    // Source: National Center for Home Food Preservation guidance: quinces are high in pectin
    fireEvent.change(screen.getByLabelText('Pectin level'), { target: { value: 'high' } });
    // Source: Council Directive 2001/113/EC, Annex I: quince has the reduced fruit minimum
    fireEvent.change(screen.getByLabelText('EU fruit group'), { target: { value: 'reduced_minimum_fruits' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add ingredient' }));

    await waitFor(() => expect(saveIngredientAction).toHaveBeenCalledTimes(1));
    const [id, data] = saveIngredientAction.mock.calls[0];
    expect(id).toBeNull();
    expect(data).toMatchObject({
      name: 'Orchard quince',
      kind: 'fruit',
      solidsPct: 13.3,
      phMin: null,
      phMax: 3.6,
      pectinLevel: 'high',
      euFruitGroup: 'reduced_minimum_fruits',
      usFruitGroup: null,
      pectinType: null,
      pectinGrade: null,
      sweetenerType: null,
      acidType: null,
      acidPct: null,
      notes: null,
    });
    expect(ingredientInputSchema.safeParse(data).success).toBe(true);
    await waitFor(() => expect(router.push).toHaveBeenCalledWith('/ingredients?saved=x'));
    expect(router.refresh).toHaveBeenCalled();
  });

  it('shows server field errors inline, with the data. prefix stripped', async () => {
    saveIngredientAction.mockResolvedValue({
      ok: false,
      status: 400,
      error: 'Some fields need attention.',
      fields: { 'data.solidsPct': ['Soluble solids cannot exceed 100 %.'] },
    });
    render(<IngredientForm />);
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Syrup' } });
    fireEvent.change(screen.getByLabelText('Soluble solids (°Brix / %)'), { target: { value: '120' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add ingredient' }));

    const input = screen.getByLabelText('Soluble solids (°Brix / %)');
    await waitFor(() => expect(input.getAttribute('aria-invalid')).toBe('true'));
    const errorId = input.getAttribute('aria-describedby');
    expect(errorId).toBeTruthy();
    expect(document.getElementById(errorId as string)?.textContent).toBe('Soluble solids cannot exceed 100 %.');
    expect(router.push).not.toHaveBeenCalled();
    // The error sits with its field, not in a general banner.
    expect(screen.queryByText('Some fields need attention.')).toBeNull();
  });

  it('shows an error that belongs to no field in a banner', async () => {
    saveIngredientAction.mockResolvedValue({ ok: false, status: 404, error: 'That ingredient no longer exists.' });
    render(<IngredientForm initial={typicalRow('strawberry', { origin: 'custom', source: null })} />);
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    expect((await screen.findByRole('alert')).textContent).toContain('That ingredient no longer exists.');
  });

  it('rejects a number it cannot read before calling the server', () => {
    render(<IngredientForm />);
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Pulp' } });
    fireEvent.change(screen.getByLabelText('Soluble solids (°Brix / %)'), { target: { value: 'ten' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add ingredient' }));
    expect(screen.getByText('Soluble solids must be a number.')).toBeTruthy();
    expect(saveIngredientAction).not.toHaveBeenCalled();
  });

  it('warns that editing a typical value makes it the workspace’s own and drops the handbook source', async () => {
    saveIngredientAction.mockResolvedValue({ ok: true, data: { ingredientId: 'x' } });
    const strawberry = typicalRow('strawberry');
    render(<IngredientForm initial={strawberry} onSavedHref="/ingredients?q=straw" />);
    expect(screen.getByText('You are editing a typical value')).toBeTruthy();
    expect(screen.getByText(/own edited value/).textContent).toMatch(/will no longer apply/);
    expect((screen.getByLabelText('Soluble solids (°Brix / %)') as HTMLInputElement).value).toBe('8');
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(saveIngredientAction).toHaveBeenCalledWith(strawberry.id, expect.objectContaining({ kind: 'fruit', solidsPct: 8, usFruitGroup: '1' })));
    await waitFor(() => expect(router.push).toHaveBeenCalledWith('/ingredients?q=straw&saved=x'));
  });
});

describe('buildIngredientInput and stripFieldPrefix', () => {
  it('nulls properties that do not apply to the kind, so an old value cannot linger', () => {
    const form = new FormData();
    form.set('name', 'Grade-150 pectin');
    form.set('solidsPct', '100');
    form.set('pectinType', 'hm_rapid_set');
    // Source: pectin grade definition: grade 150 sets 150 g of sugar per 1 g at 65 % solids and optimum pH
    form.set('pectinGrade', '150');
    form.set('pectinLevel', 'high'); // left over from an earlier choice of "fruit"
    const { data, errors } = buildIngredientInput(form, 'pectin');
    expect(errors).toEqual({});
    expect(data.pectinGrade).toBe(150);
    expect(data.pectinLevel).toBeNull();
    expect(data.calciumSource).toBe(false);
    expect(ingredientInputSchema.safeParse(data).success).toBe(true);
  });

  it('strips a leading data. or change. from field keys', () => {
    expect(stripFieldPrefix({ 'data.solidsPct': ['a'], 'change.name': ['b'], kind: ['c'] })).toEqual({ solidsPct: ['a'], name: ['b'], kind: ['c'] });
  });
});
