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
      const cells = within(row).getAllByRole('cell');
      const weights = cells.map((c) => c.textContent ?? '').filter((t) => /\d g$|kg$/.test(t));
      expect(weights.length, row.textContent ?? '').toBe(2);
      for (const w of weights) expect(w).toMatch(/^\d+(\.\d)? g$/);
    }
    expect(table.textContent).not.toMatch(/kg/);
    // The charge asked for, exactly, beside the sum of the rounded weights.
    expect(rows.at(-1)!.textContent).toMatch(/Kettle charge362\d0 g36200\.0 g/);
  });
});
