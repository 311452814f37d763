// @vitest-environment jsdom
/**
 * The model page's summary: the residual SD in the response's own units, and weighted figures
 * (panel means weighted n / s²) labelled for what they are.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';

vi.mock('react-chartjs-2', () => ({ Scatter: () => <div data-testid="scatter" /> }));

import { ModelReport } from '@/components/models/ModelReport';
import { fitResponse } from '@/lib/modelling/fit';
import { datasetCsv } from '@/lib/modelling/export';
import type { ModelPageData } from '@/lib/modelling/page-query';
import type { DatasetRow, ModelFactor, ResponseInfo } from '@/lib/modelling/schema';

afterEach(() => cleanup());

const LIKING: ResponseInfo = { key: 'attribute:00000000-0000-4000-8000-0000000000a1', name: 'Overall liking', unit: 'points on a 1–9 scale', kind: 'sensory', decimals: 1, libraryKey: 'overall-liking', scale: { min: 1, max: 9 } };
const FACTORS: ModelFactor[] = ['sugarRatio'];

// Invented panel means over one factor: liking = 3 + 4·ratio with fixed misses, panels of 10 with SDs 0.5–1.0.
const ratios = [0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0, 1.1];
const misses = [0.3, -0.4, 0.2, 0.5, -0.3, -0.2, 0.4, -0.5];
const sds = [0.5, 0.6, 0.7, 0.8, 0.9, 1.0, 0.6, 0.7];
const rows: DatasetRow[] = ratios.map((r, i) => ({
  trialId: 't1', trialCode: 'T-001', trialTitle: 'Sugar', trialDate: '2026-01-01', variantId: `v${i}`, variantLabel: String.fromCharCode(65 + i), pectinFamily: 'lm',
  factors: { sugarRatio: r, targetSolidsPct: 46, pectinPct: 0.8, acidPct: 0.2, fruitPer1000g: 900 },
  responses: { [LIKING.key]: { mean: 3 + 4 * r + misses[i], n: 10, sd: sds[i] } },
}));

function page(fitRows: DatasetRow[]): ModelPageData {
  return {
    family: { productClass: 'reduced_sugar_spread', fruitIngredientId: '00000000-0000-4000-8000-0000000000f1', slug: 'x', name: 'Apricot reduced-sugar spread', fruitName: 'Apricot' },
    dataset: { family: null, rows: fitRows, responses: [LIKING], excluded: [] },
    trials: [{ id: 't1', code: 'T-001', title: 'Sugar', date: '2026-01-01', variants: fitRows.length, selected: true }],
    response: LIKING, kind: 'main_effects', factors: FACTORS,
    fit: fitResponse(fitRows, LIKING, FACTORS, 'main_effects'),
    curvature: null, history: [], contour: null,
  };
}

describe('the model report of weighted panel means', () => {
  it('gives the residual SD on the liking scale, not in weighted units', () => {
    const data = page(rows);
    if (!data.fit?.ok) throw new Error('no fit');
    const fit = data.fit.model.surface.fit;
    expect(fit.weighted).toBe(true);
    // The misses of the means themselves: √(Σe² / (n − 2)).
    const onScale = Math.sqrt(fit.residuals.reduce((t, e) => t + e * e, 0) / fit.residualDf);
    render(<ModelReport data={data} />);
    expect(screen.getByTestId('model-residual-sd').textContent).toBe(onScale.toFixed(2));
    expect(Math.abs(fit.residualStandardError! - onScale)).toBeGreaterThan(0.05);
    expect(screen.getByTestId('model-weighted-scatter').textContent).toContain(`${fit.residualStandardError!.toFixed(2)} times the standard error`);
    expect(screen.getByRole('columnheader', { name: 'Weighted sum of squares' })).toBeTruthy();
    expect(screen.getByTestId('model-anova-weighted').textContent).toContain('not in the response’s units');
  });
});

describe('the model report with too few variants', () => {
  it('says “1 factor”, not “1 factors”', () => {
    const data = { ...page(rows.slice(0, 3)), kind: 'full_quadratic' as const };
    data.fit = fitResponse(rows.slice(0, 3), LIKING, FACTORS, 'full_quadratic');
    render(<ModelReport data={data} />);
    expect(screen.getByText(/A full quadratic in 1 factor needs 6\./)).toBeTruthy();
    expect(screen.queryByText(/1 factors/)).toBeNull();
  });
});

describe('the data set CSV', () => {
  it('names each factor with its unit in one pair of brackets', () => {
    const header = datasetCsv({ family: null, rows, responses: [LIKING], excluded: [] }).split('\n')[0];
    expect(header).toContain('Target soluble solids (°Brix)');
    expect(header).not.toMatch(/\([^)]*\(/);
  });
});
