// @vitest-environment jsdom
/**
 * The editor's predictions while typing: numbers with 95 % prediction intervals inside the trials'
 * region, the reason alone outside it. The model is fitted here on invented runs around the test
 * formula (a 2⁴ factorial plus centre runs in the four default factors), so the expected values are
 * the fit's own predictions at the formula's features (lib/models is checked against R's lm in
 * tests/unit/models).
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { BASE_SETTINGS, FORMULA_ID, LIBRARY, PRACTICAL_ACTION_STORED_LINES } from './fixtures';
import { fitResponseSurface, predictResponse } from '@/lib/models';
import { formulaFeatures } from '@/lib/modelling/features';
import { DEFAULT_MODEL_FACTORS, type FamilyModel, type ModelFactor } from '@/lib/modelling/schema';
import { computeFormula } from '@/lib/formulas/compute';

vi.mock('next/navigation', () => ({ useRouter: () => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }), usePathname: () => '/', useSearchParams: () => new URLSearchParams() }));
vi.mock('@/lib/formulas/actions', () => ({ createFormulaAction: vi.fn(), reviseFormulaAction: vi.fn() }));

import { FormulaEditor } from '@/components/formulas/FormulaEditor';

afterEach(cleanup);

const byId = new Map(LIBRARY.map((i) => [i.id, i]));
const storedLines = PRACTICAL_ACTION_STORED_LINES.map((l) => ({ ...l, ingredient: byId.get(l.ingredientId)! }));
const computation = computeFormula(BASE_SETTINGS, storedLines);
if (!computation.ok) throw new Error('fixture formula does not compute');
const features = formulaFeatures(BASE_SETTINGS, storedLines, computation.computation);
if (!features.ok || !features.features.family) throw new Error('fixture formula has no family');
const centre = features.features.factors;
const family = features.features.family;

/** Runs at ±10 % of each factor around the formula; a response linear in the factors with fixed scatter. */
function runs(truth: (p: Record<ModelFactor, number>) => number) {
  const points: Array<Record<ModelFactor, number>> = [];
  for (let r = 0; r < 16; r++) {
    points.push(Object.fromEntries(DEFAULT_MODEL_FACTORS.map((f, j) => [f, centre[f] * ((r >> j) & 1 ? 1.1 : 0.9)])) as Record<ModelFactor, number>);
  }
  for (let c = 0; c < 3; c++) points.push({ ...centre });
  const scatter = [0.12, -0.08, 0.05, -0.11, 0.09, -0.04, 0.02, -0.1, 0.07, -0.06, 0.1, -0.03, 0.04, -0.09, 0.08, -0.05, 0.06, -0.07, 0.01];
  return points.map((point, i) => ({ point, response: truth(point) + scatter[i] }));
}

const firmness = fitResponseSurface({ factors: [...DEFAULT_MODEL_FACTORS], kind: 'main_effects', runs: runs((p) => 2 + 4 * p.pectinPct + 0.05 * p.targetSolidsPct) });
const liking = fitResponseSurface({ factors: [...DEFAULT_MODEL_FACTORS], kind: 'main_effects', runs: runs((p) => 6 - 2 * p.acidPct + p.sugarRatio) });

const MODEL: FamilyModel = {
  family,
  factors: [...DEFAULT_MODEL_FACTORS],
  runs: 19,
  responses: [
    { key: 'attribute:00000000-0000-4000-8000-000000000001', name: 'Set firmness', unit: 'intensity line, 0–10', kind: 'sensory', decimals: 1, libraryKey: 'set-firmness', scale: { min: 0, max: 10 }, surface: firmness, weighting: 'unweighted', newRunWeight: null },
    { key: 'attribute:00000000-0000-4000-8000-000000000002', name: 'Overall liking', unit: '9-point hedonic, 1–9', kind: 'sensory', decimals: 1, libraryKey: 'overall-liking', scale: { min: 1, max: 9 }, surface: liking, weighting: 'unweighted', newRunWeight: null },
  ],
  unfitted: [],
  fruitContent: null,
  fittedAt: '2026-12-03T12:00:00.000Z',
};

function renderEditor(models: FamilyModel[] = [MODEL]) {
  render(
    <FormulaEditor
      mode="revise"
      initial={{ formulaId: FORMULA_ID, name: 'Plum jam', revision: 3, settings: BASE_SETTINGS, lines: PRACTICAL_ACTION_STORED_LINES }}
      ingredients={LIBRARY}
      massUnits="metric"
      temperatureUnit="C"
      models={models}
    />,
  );
}

describe('PredictionPanel in the formula editor', () => {
  it('shows each modelled response with its 95 % prediction interval inside the data', () => {
    renderEditor();
    const panel = screen.getByTestId('prediction-panel');
    const expected = predictResponse(firmness, centre);
    if (!expected.inRegion || !expected.prediction) throw new Error('centre should predict');
    const text = panel.textContent ?? '';
    expect(text).toContain(`Set firmness`);
    expect(text).toContain(`95 % prediction interval ${expected.prediction.low.toFixed(1)} to ${expected.prediction.high.toFixed(1)}`);
    const values = within(panel).getAllByTestId('predicted-value').map((e) => e.textContent);
    expect(values[0]).toBe(expected.estimate.toFixed(1));
    expect(values).toHaveLength(2);
    expect(within(panel).queryByTestId('prediction-withdrawn')).toBeNull();
    // The phone's sticky bar carries the first two, linking to the panel.
    expect(screen.getByTestId('prediction-summary').textContent).toContain(`Overall liking ${(predictResponse(liking, centre) as { estimate: number }).estimate.toFixed(1)} · Set firmness ${expected.estimate.toFixed(1)}`);
  });

  it('withdraws every number when a keystroke takes the pectin beyond the data, and says why in plain words', () => {
    renderEditor();
    fireEvent.change(screen.getByLabelText('Line 3: quantity'), { target: { value: '120' } });
    const panel = screen.getByTestId('prediction-panel');
    expect(within(panel).queryAllByTestId('predicted-value')).toHaveLength(0);
    const reason = within(panel).getByTestId('prediction-withdrawn').textContent ?? '';
    expect(reason).toMatch(/Pectin at \d+\.\d{3} % of finished product is above anything the trials covered \(\d+\.\d{3} to \d+\.\d{3} % of finished product\)/);
    expect(reason).not.toMatch(/pectinPct/);
    expect(screen.getByTestId('prediction-summary').textContent).toContain('none: outside the trials');
    // Back inside: the numbers return.
    fireEvent.change(screen.getByLabelText('Line 3: quantity'), { target: { value: '60' } });
    expect(within(screen.getByTestId('prediction-panel')).getAllByTestId('predicted-value')).toHaveLength(2);
  });

  it('says so when the formula belongs to a family without a model, and shows nothing without models', () => {
    renderEditor([{ ...MODEL, family: { ...family, slug: 'jam.other', name: 'Other jam' } }]);
    expect(screen.getByTestId('prediction-panel').textContent).toContain(`No model for ${family.name} yet`);
    cleanup();
    renderEditor([]);
    expect(screen.queryByTestId('prediction-panel')).toBeNull();
  });
});
