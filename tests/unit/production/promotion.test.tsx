// @vitest-environment jsdom
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { defaultQcSpec, computeBatch } from '@/lib/chemistry';
import { toChemistrySettings } from '@/lib/formulas/compute';
import { weighLines, identityDifferences, fruitsOf } from '@/lib/production/review';
import { requestPromotionSchema, type PromotionDraftVariant, type PromotionTargetProduct } from '@/lib/production/schema';
import { IDS, PRACTICAL_ACTION_LINES, SUGAR, PECTIN_200, line, settings } from '../formulas-library/fixtures';

const { push } = vi.hoisted(() => ({ push: vi.fn() }));
vi.mock('next/navigation', () => ({ useRouter: () => ({ push, refresh: vi.fn() }) }));
const actions = vi.hoisted(() => ({ requestPromotionAction: vi.fn(), decidePromotionAction: vi.fn() }));
vi.mock('@/lib/production/actions', () => actions);

import { PromotionForm } from '@/components/production/PromotionForm';
import { DecisionForm } from '@/components/production/DecisionForm';
import { PromotionFormula } from '@/components/production/PromotionFormula';

// jsdom has <dialog> but not its modal methods.
beforeAll(() => {
  HTMLDialogElement.prototype.showModal ??= function showModal(this: HTMLDialogElement) {
    this.setAttribute('open', '');
  };
  HTMLDialogElement.prototype.close ??= function close(this: HTMLDialogElement) {
    this.removeAttribute('open');
  };
});
afterEach(() => {
  cleanup();
  vi.clearAllMocks();
});

// Invented demo formulas: a strawberry variant, and a blackcurrant jam in production.
const STRAWBERRY = { kind: 'fruit' as const, name: 'Strawberry', solidsPct: 8, euFruitGroup: 'general' as const };
const strawberryLines = [line(IDS.fruit, STRAWBERRY, 1000), line(IDS.sugar, SUGAR, 780), line(IDS.pectin, PECTIN_200, 6)];
const computation = computeBatch(strawberryLines, toChemistrySettings(settings({ targetSolidsPct: 65 })));
const variant: PromotionDraftVariant = {
  id: '6a0e3f7c-1111-4c1e-9d1a-0b1c2d3e4f50', label: 'B', description: 'Less sugar, less pectin', complianceOverall: 'compliant',
  productClass: 'jam', preservation: null, fruits: fruitsOf(strawberryLines),
  defaults: { spec: defaultQcSpec(computation), process: { endPointSeaLevelC: 104, fillTempC: 88, cookNotes: '' }, cautions: [] },
};
const blackcurrant: PromotionTargetProduct = {
  id: '7b1f4a8d-2222-4d2f-8e2b-1c2d3e4f5a61', code: 'BCJ', name: 'Blackcurrant jam', current: { version: 1, productClass: 'jam', fruits: ['Blackcurrant'] }, nextVersion: 2,
};

function renderForm() {
  render(<PromotionForm trialId="8c2a5b9e-3333-4e3a-9f3c-2d3e4f5a6b72" variants={[variant]} products={[blackcurrant]} recommendedVariantId={variant.id} recommendationRationale="Scored best on liking." temperatureUnit="C" />);
}

describe('requesting promotion: where the variant goes', () => {
  it('chooses nothing by default: neither target is ticked and no product is pre-filled', () => {
    renderForm();
    expect((screen.getByLabelText('A new product') as HTMLInputElement).checked).toBe(false);
    expect((screen.getByLabelText('A new version of an existing product') as HTMLInputElement).checked).toBe(false);
    expect(screen.queryByLabelText('Product')).toBeNull();
    expect(screen.queryByTestId('target-comparison')).toBeNull();
  });

  it('refuses to send without a choice, and says so beside the choice', () => {
    renderForm();
    fireEvent.click(screen.getByRole('button', { name: 'Request promotion' }));
    expect(actions.requestPromotionAction).not.toHaveBeenCalled();
    expect(screen.getByText('Choose whether this is a new product or a new version of an existing one.')).toBeTruthy();
  });

  it('shows the version in production beside the variant and warns when the fruit differs', () => {
    renderForm();
    fireEvent.click(screen.getByLabelText('A new version of an existing product'));
    const select = screen.getByLabelText('Product') as HTMLSelectElement;
    expect(select.value).toBe('');
    fireEvent.change(select, { target: { value: blackcurrant.id } });
    const box = screen.getByTestId('target-comparison');
    expect(within(box).getByText('B — Jam, strawberry')).toBeTruthy();
    expect(within(box).getByText('Blackcurrant jam v1 — Jam, blackcurrant')).toBeTruthy();
    expect(box.textContent).toContain('Becomes version 2 of Blackcurrant jam and, once approved, supersedes version 1 now in production.');
    expect(box.textContent).toContain('Different fruit: the variant is strawberry; Blackcurrant jam v1 is blackcurrant.');
  });

  it('a new product becomes version 1, with nothing superseded, and the request names the target', async () => {
    actions.requestPromotionAction.mockResolvedValue({ ok: true, data: { requestId: 'r1', code: 'PR-001' } });
    renderForm();
    fireEvent.click(screen.getByLabelText('A new product'));
    fireEvent.change(screen.getByLabelText('Product name'), { target: { value: 'Strawberry jam' } });
    fireEvent.change(screen.getByLabelText('Product code'), { target: { value: 'stj' } });
    expect(screen.getByTestId('target-comparison').textContent).toContain('Becomes version 1 of Strawberry jam.');
    expect(screen.getByTestId('target-comparison').textContent).not.toMatch(/supersede/i);
    fireEvent.click(screen.getByRole('button', { name: 'Request promotion' }));
    await vi.waitFor(() => expect(actions.requestPromotionAction).toHaveBeenCalledOnce());
    expect(actions.requestPromotionAction.mock.calls[0][0]).toMatchObject({ target: 'new_product', newProductName: 'Strawberry jam', newProductCode: 'STJ' });
    expect(actions.requestPromotionAction.mock.calls[0][0]).not.toHaveProperty('productId');
  });

  it('no warning when the fruit and product class match', () => {
    expect(identityDifferences({ productClass: 'jam', fruits: ['Blackcurrant'] }, { productClass: 'jam', fruits: ['blackcurrant'] }, 'Blackcurrant jam v1')).toEqual([]);
    expect(identityDifferences({ productClass: 'extra_jam', fruits: ['Blackcurrant'] }, { productClass: 'jam', fruits: ['Blackcurrant'] }, 'Blackcurrant jam v1'))
      .toEqual(['Different product class: the variant is extra jam; Blackcurrant jam v1 is jam.']);
  });
});

describe('a new product without a name or code', () => {
  const request = (extra: Record<string, unknown>) => requestPromotionSchema.safeParse({
    trialId: '6a0e3f7c-1111-4c1e-9d1a-0b1c2d3e4f51', variantId: variant.id, target: 'new_product',
    rationale: 'Variant B set cleanly and scored best.', process: variant.defaults!.process, spec: variant.defaults!.spec, ...extra,
  });
  const messagesOf = (result: ReturnType<typeof request>, field: string) => (result.success ? [] : result.error.issues.filter((i) => i.path[0] === field).map((i) => i.message));

  it('says once to name it, whether the name is left out or left blank', () => {
    expect(messagesOf(request({ newProductCode: 'STJ' }), 'newProductName')).toEqual(['Name the new product.']);
    expect(messagesOf(request({ newProductName: '  ', newProductCode: 'STJ' }), 'newProductName')).toEqual(['Name the new product, in at least 2 characters.']);
  });

  it('says once what is wrong with the code', () => {
    expect(messagesOf(request({ newProductName: 'Strawberry jam' }), 'newProductCode')).toEqual(['Give the new product a code.']);
    expect(messagesOf(request({ newProductName: 'Strawberry jam', newProductCode: '' }), 'newProductCode')).toEqual(['Use 2–5 capital letters, e.g. QMJ.']);
  });
});

describe('the approval dialog follows the choice', () => {
  it('a new product: becomes version 1, supersedes nothing', () => {
    render(<DecisionForm requestId="r1" code="PR-004" outcome={{ kind: 'new_product', name: 'Strawberry jam', code: 'STJ' }} />);
    fireEvent.click(screen.getByRole('button', { name: 'Approve for production' }));
    const dialog = screen.getByRole('dialog', { name: 'Approve PR-004?' });
    expect(dialog.textContent).toContain('This creates the product Strawberry jam (STJ): the variant becomes version 1 of it.');
    expect(dialog.textContent).not.toMatch(/supersede/i);
  });

  it('an existing product: supersedes the numbered version now in production', () => {
    render(<DecisionForm requestId="r1" code="PR-005" outcome={{ kind: 'existing_product', name: 'Blackcurrant jam', code: 'BCJ', nextVersion: 3, currentVersion: 2 }} />);
    fireEvent.click(screen.getByRole('button', { name: 'Approve for production' }));
    expect(screen.getByRole('dialog').textContent).toContain('The variant becomes version 3 of Blackcurrant jam (BCJ) and supersedes version 2 now in production.');
  });
});

describe('the review page shows the formula and what it changes', () => {
  it('lists each line in grams and % of the batch', () => {
    // Source: Practical Action technical brief "Jams, jellies and marmalade": 10 kg fruit, 10 kg sugar, 60 g pectin,
    // 55 g citric acid; charge 20 115 g, so fruit is 10 000 / 20 115 = 49.7 % and pectin 60 / 20 115 = 0.3 %.
    const weighed = weighLines(settings(), PRACTICAL_ACTION_LINES)!;
    expect(weighed.totalChargeG).toBe(20_115);
    render(<PromotionFormula formula={{ settings: settings(), lines: PRACTICAL_ACTION_LINES, weighed }} baseline={null} variantLabel="B" massUnits="metric" temperatureUnit="C" />);
    const rows = within(screen.getByTestId('promotion-lines')).getAllByRole('row').slice(1).map((r) => [...r.children].map((c) => c.textContent));
    expect(rows[0]).toEqual(['Orchard fruit pulp', '10.00 kg', '49.7 %']);
    expect(rows[2]).toEqual(['HM pectin grade 200', '60.0 g', '0.3 %']);
    expect(screen.getByText(/nothing to compare the lines with/)).toBeTruthy();
  });

  it('keeps the decimals of a small line: 0.5 g of acid in a 2 kg batch is not "0.0 %"', () => {
    // 1000 g fruit + 1000 g sugar + 0.5 g citric acid: charge 2000.5 g; the acid is 0.5 / 2000.5 = 0.025 % of it.
    const lines = [line(IDS.fruit, PRACTICAL_ACTION_LINES[0].ingredient, 1000), line(IDS.sugar, SUGAR, 1000), line(IDS.citric, PRACTICAL_ACTION_LINES[3].ingredient, 0.5)];
    const weighed = weighLines(settings(), lines)!;
    render(<PromotionFormula formula={{ settings: settings(), lines, weighed }} baseline={null} variantLabel="B" massUnits="metric" temperatureUnit="C" />);
    const rows = within(screen.getByTestId('promotion-lines')).getAllByRole('row').slice(1).map((r) => [...r.children].map((c) => c.textContent));
    expect(rows[2].slice(1)).toEqual(['0.50 g', '0.02 %']);
  });

  it('diffs the lines against the version in production', () => {
    const variantLines = [line(IDS.fruit, PRACTICAL_ACTION_LINES[0].ingredient, 10_000), line(IDS.sugar, SUGAR, 8_000), line(IDS.pectin, PECTIN_200, 60)];
    render(
      <PromotionFormula
        formula={{ settings: settings(), lines: variantLines, weighed: weighLines(settings(), variantLines) }}
        baseline={{ id: '5f0c1d2e-3a4b-4c5d-8e6f-7a8b9c0d1e2f', version: 2, productName: 'Orchard jam', settings: settings(), lines: PRACTICAL_ACTION_LINES }}
        variantLabel="B" massUnits="metric" temperatureUnit="C"
      />,
    );
    const diff = screen.getByRole('region', { name: 'Against Orchard jam v2, line by line' });
    expect(within(diff).getByRole('columnheader', { name: 'Quantity, v2' })).toBeTruthy();
    expect(within(diff).getByRole('columnheader', { name: 'Quantity, variant B' })).toBeTruthy();
    const status = (name: string) => within(diff).getByRole('row', { name: new RegExp(`^${name}`) }).getAttribute('data-status');
    expect(status('White sugar')).toBe('changed');
    expect(status('Citric acid')).toBe('removed');
    expect(status('Orchard fruit pulp')).toBe('unchanged');
  });
});
