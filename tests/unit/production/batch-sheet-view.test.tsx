// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import { BatchSheetView } from '@/components/production/BatchSheetView';
import { buildBatchSheet, type SheetSource } from '@/lib/production/sheet';
import { batchSheetQuerySchema } from '@/lib/production/schema';
import { computeBatch, defaultQcSpec } from '@/lib/chemistry';
import { toChemistrySettings } from '@/lib/formulas/compute';
import type { RevisionLine } from '@/lib/formulas/schema';
import { PRACTICAL_ACTION_LINES, settings } from '../chemistry/fixtures';

// Source: Practical Action technical brief's worked batch (10 kg fruit, 10 kg sugar, 60 g pectin, 55 g citric acid).
const lines: RevisionLine[] = PRACTICAL_ACTION_LINES.map((l, i) => ({ ingredientId: `00000000-0000-4000-8000-00000000000${i}`, ingredient: l.ingredient, quantity: l.quantity * 1000, unit: 'g' }));
const formulaSettings = { ...settings(), ruleDate: '2026-01-15' };
const source: SheetSource = {
  productName: 'Worked example jam', productCode: 'WEJ', version: 3, settings: formulaSettings, lines,
  spec: defaultQcSpec(computeBatch(lines, toChemistrySettings(formulaSettings))),
  process: { endPointSeaLevelC: 104.5, fillTempC: 88, cookNotes: '' },
};

afterEach(cleanup);

describe('the batch sheet on screen', () => {
  it('gives every weight of the ingredient table in the one unit of the scale, not grams beside kilograms', () => {
    const sheet = buildBatchSheet(source, batchSheetQuerySchema.parse({ target: 'total_charge', amount: '36.2', unit: 'kg', step: '10', stepUnit: 'g' }));
    render(<BatchSheetView sheet={sheet} paper="a4" massUnits="metric" temperatures="metric" superseded={false} />);
    const table = screen.getByTestId('sheet-ingredients');
    const rows = within(table).getAllByRole('row').slice(1);
    for (const row of rows) {
      const cells = within(row).getAllByRole('cell').filter((c) => c.dataset.testid !== 'line-step');
      const weights = cells.map((c) => c.textContent ?? '').filter((t) => /\d g$|kg$/.test(t));
      expect(weights.length, row.textContent ?? '').toBe(2);
      for (const w of weights) expect(w).toMatch(/^\d+(\.\d+)? g$/);
    }
    expect(table.textContent).not.toMatch(/kg/);
    // The charge asked for, exactly, beside the sum of the rounded weights (the pectin and acid on a 1 g step).
    expect(rows.at(-1)!.textContent).toMatch(/Kettle charge362\d\d g36200\.0 g/);
  });

  it('writes the exact kettle charge to at least the decimals of the rounded one, and no change as "-0"', () => {
    const sheet = buildBatchSheet(source, batchSheetQuerySchema.parse({ target: 'total_charge', amount: '2', unit: 'kg', step: '0.1', stepUnit: 'kg' }));
    render(<BatchSheetView sheet={sheet} paper="a4" massUnits="metric" temperatures="metric" superseded={false} />);
    const charge = within(screen.getByTestId('sheet-ingredients')).getAllByRole('row').at(-1)!;
    const [rounded, exact] = within(charge).getAllByRole('cell').map((c) => c.textContent ?? '').filter((t) => / kg$/.test(t));
    const places = (t: string) => t.replace(' kg', '').split('.')[1]?.length ?? 0;
    expect(places(exact)).toBeGreaterThanOrEqual(places(rounded));
    const fine = buildBatchSheet(source, batchSheetQuerySchema.parse({ target: 'total_charge', amount: '20', unit: 'kg', step: '0.001', stepUnit: 'g' }));
    cleanup();
    render(<BatchSheetView sheet={fine} paper="a4" massUnits="metric" temperatures="metric" superseded={false} />);
    expect(screen.getByTestId('rounding-effect').textContent).not.toMatch(/-0(\.0+)?\b/);
  });

  it('gives each line its scale step, names the small additions weighed finer, and drops none to 0 g', () => {
    // The walk's strawberry sheet: 0.8 g of citric acid and 8 g of pectin on a 5 g scale (the 2 % share is
    // common practice, no published source; the rest is arithmetic).
    const small: RevisionLine[] = [
      { ...lines[0], quantity: 1000 }, { ...lines[1], quantity: 850 }, { ...lines[2], quantity: 8 }, { ...lines[3], quantity: 0.8 },
    ];
    const sheet = buildBatchSheet({ ...source, lines: small }, batchSheetQuerySchema.parse({ step: '5', stepUnit: 'g' }));
    render(<BatchSheetView sheet={sheet} paper="a4" massUnits="metric" temperatures="metric" superseded={false} />);
    const rows = within(screen.getByTestId('sheet-ingredients')).getAllByRole('row').slice(1, 5);
    const row = (i: number) => within(rows[i]).getAllByRole('cell').map((c) => c.textContent ?? '');
    expect(row(3).slice(1, 4)).toEqual(['Citric acid', '0.80 g', '0.01 g, finer scale']);
    expect(row(2).slice(1, 4)).toEqual(['HM pectin grade 200', '8.0 g', '0.1 g, finer scale']);
    expect(row(0).slice(2, 4)).toEqual(['1000 g', '5 g']);
    expect(screen.getByTestId('rounding-effect').textContent).toMatch(/Weighed on a finer scale, so rounding moves no line by more than 2 %: HM pectin grade 200, Citric acid\./);
  });
});