// @vitest-environment jsdom
/** The ingredient library's CSV import screen (issue 15, part 1: suppliers' values from a spreadsheet). */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';

const importIngredientsAction = vi.fn();
vi.mock('next/navigation', () => ({ useRouter: () => ({ push: vi.fn(), refresh: vi.fn() }) }));
vi.mock('@/lib/ingredients/actions', () => ({ importIngredientsAction: (...args: unknown[]) => importIngredientsAction(...args) }));

const { IngredientCsvImport } = await import('@/components/ingredients/IngredientCsvImport');

afterEach(() => {
  cleanup();
  importIngredientsAction.mockReset();
});

function choose(text: string) {
  const input = screen.getByLabelText('CSV file of ingredients');
  fireEvent.change(input, { target: { files: [new File([text], 'library.csv', { type: 'text/csv' })] } });
}

describe('ingredient CSV import', () => {
  it('sends the file’s text and says what changed', async () => {
    importIngredientsAction.mockResolvedValue({ ok: true, data: { imported: true, created: 1, updated: 2, unchanged: 17, updates: [] } });
    render(<IngredientCsvImport />);
    choose('name,kind,soluble_solids_pct\nPlum,fruit,12\n');
    fireEvent.click(screen.getByRole('button', { name: 'Import' }));
    await waitFor(() => expect(screen.getByText('Imported: 1 added, 2 changed, 17 unchanged.')).toBeTruthy());
    expect(importIngredientsAction).toHaveBeenCalledWith('name,kind,soluble_solids_pct\nPlum,fruit,12\n', false);
  });

  it('shows which rows update an ingredient already there, before → after, and imports only once confirmed', async () => {
    const text = 'name,kind,soluble_solids_pct,label_name\nSugar,sweetener,99.5,\nPlum,fruit,12,plums\n';
    importIngredientsAction
      .mockResolvedValueOnce({ ok: true, data: { imported: false, created: 1, updated: 1, unchanged: 0, updates: [{ row: 2, ingredientId: 'i1', name: 'Sugar', changes: [{ column: 'soluble_solids_pct', before: '99.8', after: '99.5' }, { column: 'label_name', before: 'sugar', after: '' }] }] } })
      .mockResolvedValueOnce({ ok: true, data: { imported: true, created: 1, updated: 1, unchanged: 0, updates: [] } });
    render(<IngredientCsvImport />);
    choose(text);
    fireEvent.click(screen.getByRole('button', { name: 'Import' }));
    await waitFor(() => expect(screen.getByText(/Nothing imported yet: 1 row changes an ingredient you already have/)).toBeTruthy());
    expect(screen.getByTestId('csv-updates').textContent).toBe('Row 2 updates Sugar: column soluble_solids_pct 99.8 → 99.5; column label_name sugar → blank');
    // Counts of 0 are left out of the sentence (not "leaves 0 unchanged").
    expect(screen.getByText(/The file also adds 1 new ingredient\. Nothing is imported unless you confirm\./)).toBeTruthy();
    expect(screen.queryByText(/^Imported:/)).toBeNull();
    expect(importIngredientsAction).toHaveBeenCalledTimes(1);
    expect(importIngredientsAction).toHaveBeenLastCalledWith(text, false);
    fireEvent.click(screen.getByRole('button', { name: 'Import and update 1 ingredient' }));
    await waitFor(() => expect(screen.getByText('Imported: 1 added, 1 changed, 0 unchanged.')).toBeTruthy());
    expect(importIngredientsAction).toHaveBeenLastCalledWith(text, true);
  });

  it('lists every bad cell and imports nothing', async () => {
    importIngredientsAction.mockResolvedValue({ ok: false, status: 422, error: 'Nothing was imported: 1 problem.', fields: { 'row 2, sugars_g': ['Sugars cannot exceed carbohydrate.'] } });
    render(<IngredientCsvImport />);
    choose('name\nx\n');
    fireEvent.click(screen.getByRole('button', { name: 'Import' }));
    await waitFor(() => expect(screen.getByText('row 2, sugars_g:')).toBeTruthy());
    expect(screen.getByText(/Sugars cannot exceed carbohydrate/)).toBeTruthy();
  });

  it('a lost connection says so and keeps the chosen file', async () => {
    importIngredientsAction.mockRejectedValue(new TypeError('fetch failed'));
    render(<IngredientCsvImport />);
    choose('name\nx\n');
    fireEvent.click(screen.getByRole('button', { name: 'Import' }));
    await waitFor(() => expect(screen.getByText(/server could not be reached/)).toBeTruthy());
    expect((screen.getByRole('button', { name: 'Import' }) as HTMLButtonElement).disabled).toBe(false);
  });
});
