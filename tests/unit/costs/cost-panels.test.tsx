// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { waitFor } from '@testing-library/dom';
import { BASE_SETTINGS, FORMULA_ID, IDS, LIBRARY, PRACTICAL_ACTION_STORED_LINES } from '../formulas-editor/fixtures';
import type { EditorCostBasis, TrialCosts } from '@/lib/costs/schema';
import { costFormula, historiesBy } from '@/lib/costing';

vi.mock('next/navigation', () => ({ useRouter: () => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }), usePathname: () => '/', useSearchParams: () => new URLSearchParams() }));
vi.mock('@/lib/formulas/actions', () => ({ createFormulaAction: vi.fn(), reviseFormulaAction: vi.fn() }));
vi.mock('react-chartjs-2', () => ({
  Scatter: (props: { data: { datasets: Array<{ data: Array<{ label: string; x: number; y: number }> }> } }) => (
    <div data-testid="scatter">{props.data.datasets[0].data.map((p) => `${p.label}:${p.x}:${p.y}`).join('|')}</div>
  ),
}));

import { FormulaEditor } from '@/components/formulas/FormulaEditor';
import { CostAgainstLiking } from '@/components/costs/CostAgainstLiking';
import { ProductCostCard } from '@/components/costs/ProductCostCard';
import { BatchCostCard } from '@/components/costs/BatchCostCard';
import { FillMismatchNotice } from '@/components/costs/CostSummary';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const PACK = 'a1000000-0000-4000-8000-000000000001';
// Illustrative prices (pence) for the Practical Action batch, as in tests/unit/costing/cost.test.ts:
// fruit 180 p/kg, sugar 90 p/kg, pectin 2,400 p/kg, citric acid unpriced; jar 30 p.
function basis(asOf: string, sugarPackMinor = 2250): EditorCostBasis {
  return {
    currency: 'GBP',
    asOf,
    overfillPct: 2,
    ingredientPrices: [
      { ingredientId: IDS.fruit, validFrom: '2026-01-01', packPriceMinor: 1800, packSizeG: 10_000, supplier: null },
      { ingredientId: IDS.sugar, validFrom: '2026-01-01', packPriceMinor: sugarPackMinor, packSizeG: 25_000, supplier: null },
      { ingredientId: IDS.pectin, validFrom: '2026-01-01', packPriceMinor: 2400, packSizeG: 1000, supplier: null },
    ],
    packagingPrices: [{ packagingItemId: 'jar', validFrom: '2026-01-01', unitPriceMinor: 30, supplier: null }],
    refuse: [],
    packFormats: [{ id: PACK, name: '340 g jar', netFillG: 340, items: [{ packagingItemId: 'jar', name: 'Jar', perJar: 1 }] }],
  };
}

function renderEditor(b: EditorCostBasis | undefined, jarNetFillG: number = BASE_SETTINGS.jarNetFillG) {
  return render(
    <FormulaEditor
      mode="revise"
      initial={{ formulaId: FORMULA_ID, name: 'Plum jam', revision: 1, settings: { ...BASE_SETTINGS, jarNetFillG }, lines: PRACTICAL_ACTION_STORED_LINES }}
      ingredients={LIBRARY}
      massUnits="metric"
      temperatureUnit="C"
      {...(b ? { cost: { basis: b, packFormatId: PACK } } : {})}
    />,
  );
}

describe('the cost panel in the formula editor', () => {
  it('shows per batch, per kg and per jar, says incomplete and names the unpriced line', () => {
    renderEditor(basis('2026-06-01'));
    const panel = screen.getByTestId('formula-cost');
    // Priced lines: 1,800 + 900 + 144 = 2,844 p per batch; citric acid has no price.
    expect(within(panel).getByText('at least GBP 28.44')).toBeTruthy();
    expect(within(panel).getByText('Incomplete')).toBeTruthy();
    expect(within(panel).getByRole('status').textContent).toContain('No price on 1 Jun 2026 for Citric acid powder.');
    expect(within(panel).getAllByText('unknown').length).toBeGreaterThan(0);
    expect(within(screen.getByTestId('cost-sensitivity')).getByText(/White sugar \+10 %/)).toBeTruthy();
  });

  it('recomputes on every keystroke: more sugar costs more per batch', () => {
    renderEditor(basis('2026-06-01'));
    // 11 kg of sugar: +1 kg × 90 p = +90 p → 2,934 p.
    fireEvent.change(screen.getByLabelText('Line 2: quantity'), { target: { value: '11000' } });
    expect(within(screen.getByTestId('formula-cost')).getByText('at least GBP 29.34')).toBeTruthy();
  });

  it('loads the prices of another day when the as-of date changes', async () => {
    const fetchMock = vi.fn(async () => new Response(JSON.stringify({ basis: basis('2026-03-01', 4500) }), { status: 200, headers: { 'content-type': 'application/json' } }));
    vi.stubGlobal('fetch', fetchMock);
    renderEditor(basis('2026-06-01'));
    fireEvent.change(screen.getByLabelText('Prices as of'), { target: { value: '2026-03-01' } });
    // Sugar at 180 p/kg: 1,800 + 1,800 + 144 = 3,744 p.
    await waitFor(() => expect(within(screen.getByTestId('formula-cost')).getByText('at least GBP 37.44')).toBeTruthy());
    expect(String(fetchMock.mock.calls[0]?.[0 as never])).toBe('/api/v1/costs/basis?asOf=2026-03-01');
  });

  it('warns, naming both fills, when the pack format fills another jar than the formula’s jar net fill', () => {
    renderEditor(basis('2026-06-01'), 250);
    const warning = screen.getByTestId('cost-summary-fill-mismatch');
    expect(warning.textContent).toContain('The pack format fills 340 g jars, but the formula’s jar net fill is 250 g');
    expect(warning.textContent).toContain('This cost per jar is for a 340 g jar');
  });

  it('gives no jar-size warning when the pack format fills the formula’s jar', () => {
    renderEditor(basis('2026-06-01'));
    expect(screen.queryByTestId('cost-summary-fill-mismatch')).toBeNull();
  });

  it('is not there without prices (roles without the price permission)', () => {
    renderEditor(undefined);
    expect(screen.queryByTestId('formula-cost')).toBeNull();
    expect(screen.queryByText(/GBP/)).toBeNull();
  });
});

describe('cost against liking on the Compare page', () => {
  function trialCosts(): TrialCosts {
    const prices = { ingredientPrices: historiesBy(basis('2026-06-01').ingredientPrices, (p) => p.ingredientId), packagingPrices: new Map(), overfillPct: 0, asOf: '2026-06-01', packFormat: { id: PACK, name: '340 g jar', netFillG: 340, items: [] } };
    const cost = (sugarG: number) => costFormula({ ...prices, lines: [{ ingredientId: IDS.sugar, name: 'Sugar', grams: sugarG, refusePct: 0 }], chargeG: sugarG, finishedMassG: sugarG });
    const missing = costFormula({ ...prices, lines: [{ ingredientId: IDS.citric, name: 'Citric acid', grams: 10, refusePct: 0 }], chargeG: 10, finishedMassG: 10 });
    return {
      currency: 'GBP', asOf: '2026-06-01', packFormat: { id: PACK, name: '340 g jar' },
      variants: [
        { variantId: 'va', label: 'A', result: { ok: true, cost: cost(1000) } },
        { variantId: 'vb', label: 'B', result: { ok: true, cost: cost(1000) } },
        { variantId: 'vc', label: 'C', result: { ok: true, cost: missing } },
      ],
    };
  }

  it('lists each variant’s cost per jar beside its liking, plots only complete ones with their labels', () => {
    render(<CostAgainstLiking costs={trialCosts()} means={[{ attribute: 'Overall liking', label: 'A', mean: 6.5 }, { attribute: 'Overall liking', label: 'B', mean: 7.25 }, { attribute: 'Sweetness', label: 'A', mean: 3 }]} />);
    const rows = within(screen.getByTestId('cost-liking-table')).getAllByRole('row');
    // Sugar at 90 p/kg filled 340 g per jar: 30.6 p → GBP 0.31 (30.6 rounds to 31).
    expect(rows.map((r) => r.textContent)).toEqual(['VariantCost per jarOverall liking', 'AGBP 0.316.50', 'BGBP 0.317.25', 'Cat least GBP 0.00not tasted']);
    expect(screen.getByTestId('scatter').textContent).toBe('A:0.31:6.5|B:0.31:7.25');
  });
});

describe('a cost per jar for another jar than the formula’s', () => {
  // A 250 g formula costed with the 340 g pack format (the walk's apricot spread).
  const prices = { ingredientPrices: historiesBy(basis('2026-06-01').ingredientPrices, (p) => p.ingredientId), packagingPrices: new Map(), overfillPct: 0, asOf: '2026-06-01', packFormat: { id: PACK, name: '340 g jar', netFillG: 340, items: [] } };
  const line = [{ ingredientId: IDS.sugar, name: 'Sugar', grams: 1000, refusePct: 0 }];
  const for250 = costFormula({ ...prices, lines: line, chargeG: 1000, finishedMassG: 1000, formulaJarFillG: 250 });
  const for340 = costFormula({ ...prices, lines: line, chargeG: 1000, finishedMassG: 1000, formulaJarFillG: 340 });

  it('the trial’s variants: one line per variant costed for another jar, none for the others', () => {
    render(<FillMismatchNotice testId="fill" results={[{ label: 'Variant A', result: { ok: true, cost: for250 } }, { label: 'Variant B', result: { ok: true, cost: for340 } }]} />);
    const items = within(screen.getByTestId('fill')).getAllByRole('listitem').map((li) => li.textContent);
    expect(items).toHaveLength(1);
    expect(items[0]).toMatch(/^Variant A: The pack format fills 340 g jars, but the formula’s jar net fill is 250 g/);
  });

  it('nothing at all when every variant fills its own jar', () => {
    const { container } = render(<FillMismatchNotice results={[{ label: 'Variant B', result: { ok: true, cost: for340 } }]} />);
    expect(container.textContent).toBe('');
  });

  it('the product’s versions and a batch say it too', () => {
    render(<ProductCostCard costs={{ currency: 'GBP', asOf: '2026-06-01', warningPct: 5, versions: [{ versionId: 'v1', version: 1, status: 'current', approvedAt: '2026-05-01', atApproval: null, today: { ok: true, cost: for250 }, movedPct: null, warn: false }] }} />);
    expect(screen.getByTestId('product-cost-fill').textContent).toContain('v1: The pack format fills 340 g jars, but the formula’s jar net fill is 250 g');
    render(<BatchCostCard cost={{ currency: 'GBP', planned: { ok: true, cost: for250 }, actualPerJar: null, goodJars: 10 }} writtenOff={null} />);
    expect(screen.getByTestId('batch-cost-fill').textContent).toContain('This batch: The pack format fills 340 g jars');
  });
});
