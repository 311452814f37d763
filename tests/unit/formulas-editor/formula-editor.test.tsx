// @vitest-environment jsdom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { renderToString } from 'react-dom/server';
import { waitFor, within } from '@testing-library/dom';
import { BASE_SETTINGS, FORMULA_ID, IDS, LIBRARY, PRACTICAL_ACTION_STORED_LINES } from './fixtures';

const router = vi.hoisted(() => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }));
const actions = vi.hoisted(() => ({ createFormulaAction: vi.fn(), reviseFormulaAction: vi.fn() }));

vi.mock('next/navigation', () => ({
  useRouter: () => router,
  usePathname: () => '/',
  useSearchParams: () => new URLSearchParams(),
}));
vi.mock('@/lib/formulas/actions', () => actions);

import { FormulaEditor } from '@/components/formulas/FormulaEditor';

afterEach(() => {
  cleanup();
  vi.clearAllMocks();
});
beforeEach(() => {
  actions.createFormulaAction.mockResolvedValue({ ok: true, data: { formulaId: FORMULA_ID, revision: 1 } });
  actions.reviseFormulaAction.mockResolvedValue({ ok: true, data: { formulaId: FORMULA_ID, revision: 4 } });
});

function type(label: string | RegExp, value: string) {
  fireEvent.change(screen.getByLabelText(label), { target: { value } });
}

/** Picks an ingredient on line `n` as a person does: the picker takes focus (Tab or a tap) before it opens. */
function choose(n: number, ingredientId: string) {
  const picker = screen.getByLabelText(`Line ${n}: ingredient`);
  fireEvent.focus(picker);
  fireEvent.change(picker, { target: { value: ingredientId } });
}

function reviseEditor(overrides: { lines?: typeof PRACTICAL_ACTION_STORED_LINES; massUnits?: 'metric' | 'imperial' } = {}) {
  return (
    <FormulaEditor
      mode="revise"
      initial={{ formulaId: FORMULA_ID, name: 'Plum jam, trial', revision: 3, settings: { ...BASE_SETTINGS }, lines: overrides.lines ?? PRACTICAL_ACTION_STORED_LINES }}
      ingredients={LIBRARY}
      massUnits={overrides.massUnits ?? 'metric'}
      temperatureUnit="C"
    />
  );
}

function renderRevise(overrides: { lines?: typeof PRACTICAL_ACTION_STORED_LINES; massUnits?: 'metric' | 'imperial' } = {}) {
  return render(reviseEditor(overrides));
}

/** The number shown in a result cell, e.g. "16.346 kg" → 16.346. */
function shownNumber(testId: string): number {
  return Number.parseFloat(screen.getByTestId(testId).textContent ?? '');
}

describe('FormulaEditor: live results', () => {
  it('starts with the "Add your first ingredient" state and no numbers', () => {
    render(<FormulaEditor mode="create" ingredients={LIBRARY} massUnits="metric" temperatureUnit="C" />);
    expect(screen.getByText('Add your first ingredient')).toBeTruthy();
    expect(screen.queryByTestId('result-finished-mass')).toBeNull();
    expect(document.body.textContent).not.toMatch(/NaN|undefined/);
  });

  it('updates the finished mass while a quantity is typed (Practical Action batch)', () => {
    render(<FormulaEditor mode="create" ingredients={LIBRARY} massUnits="metric" temperatureUnit="C" />);
    type('Target final soluble solids (%)', '68');
    const picks = [IDS.fruit, IDS.sugar, IDS.pectin, IDS.citric];
    picks.forEach(() => fireEvent.click(screen.getByRole('button', { name: 'Add line' })));
    picks.forEach((id, i) => choose(i + 1, id));

    type('Line 1: quantity', '10000');
    // Without sugar yet the fruit alone gives 1000 g of solids: 1000 / 0.68 = 1470.6 g.
    expect(screen.getByTestId('result-finished-mass').textContent).toBe('1.471 kg');

    type('Line 2: quantity', '5000');
    type('Line 3: quantity', '60');
    type('Line 4: quantity', '55');
    // (1000 + 5000 + 60 + 55) g / 0.68 = 8992.6 g, independent arithmetic on the same batch.
    expect(screen.getByTestId('result-finished-mass').textContent).toBe('8.993 kg');

    type('Line 2: quantity', '10000');
    // Source: Practical Action technical brief "Jams, jellies and marmalade": 10 kg fruit at 10 % solids
    // + 10 kg sugar + 0.06 kg pectin + 0.055 kg citric acid = 11.115 kg solids → 16.35 kg of jam at 68 %.
    expect(screen.getByTestId('result-solids-in').textContent).toBe('11.115 kg');
    expect(shownNumber('result-finished-mass')).toBeCloseTo(16.35, 2);
    expect(screen.getByTestId('result-total-charge').textContent).toBe('20.115 kg');
    // Same source: the 60 g of pectin is about 0.37 % of the finished jam.
    expect(screen.getByTestId('result-pectin').textContent).toMatch(/ \/ 0\.37 %$/);
    // Water to evaporate = charge − finished = 20.115 − 16.346 kg (same source, by subtraction).
    expect(shownNumber('result-water-to-evaporate')).toBeCloseTo(20.115 - 11.115 / 0.68, 3);
    expect(screen.getByRole('region', { name: 'Batch results' }).getAttribute('aria-live')).toBe('polite');
    expect(document.body.textContent).not.toMatch(/NaN|undefined/);
  });

  it('lists each rule with requirement, actual, status and source', () => {
    renderRevise();
    // Source: Council Directive 2001/113/EC, Annex I: jam ≥ 350 g fruit per 1000 g; soluble dry matter ≥ 60 %.
    const jam = screen.getByTestId('rule-eu.2001.jam.fruit');
    expect(jam.textContent).toContain('Required: ≥ 350 g fruit per 1000 g');
    // 10 kg fruit ÷ 16.346 kg finished × 1000 = 611.8 g (Practical Action technical brief "Jams, jellies and marmalade" batch).
    expect(jam.textContent).toContain('Actual: 611.8 g fruit per 1000 g');
    expect(jam.textContent).toContain('Pass');
    expect(jam.textContent).toContain('Source: Council Directive 2001/113/EC, Annex I');
    expect(screen.getByTestId('compliance-overall').textContent).toBe('Meets the rules checked');
    expect(screen.getByText(/Rule edition for 2026-01-15/).textContent).toContain('before 14 June 2026');
  });

  it('names the water-activity model and labels aw as an estimate', () => {
    renderRevise();
    const label = screen.getByText(/Estimated water activity/);
    expect(label.textContent).toMatch(/estimate/i);
    expect(screen.getByText(/Model: /).textContent).toMatch(/Norrish|Ross/);
  });

  it('shows a message instead of numbers when the formula cannot be computed', () => {
    renderRevise({ lines: [{ ingredientId: IDS.sugar, quantity: 1000, unit: 'g' }] });
    expect(screen.getByTestId('results-problem').textContent).toBe('Add a fruit line to see results.');
    expect(screen.queryByTestId('result-finished-mass')).toBeNull();
  });

  // The user walk: pH 9–14 and altitude 5,000–9,000 m gave live results ("Water boils at 69.7 °C")
  // that saving then refused. The live results now apply the save schema (formulaSettingsSchema).
  it.each([
    ['Planned pH (optional)', '9', 'pH must be at most 8.'],
    ['Planned pH (optional)', '14', 'pH must be at most 8.'],
    ['Kitchen altitude (m)', '9000', 'Altitude must be at most 5000 m.'],
    ['Rule date (production or labelling)', '1850-01-01', 'Use a year from 1900 to 2200.'],
    ['Rule date (production or labelling)', '1950-01-01', 'Choose a rule date from 1 Jan 2000 to 31 Dec 2099.'],
  ])('%s of %s: no live results, and the save’s message at the field', (label, value, message) => {
    renderRevise();
    type(label, value);
    expect(screen.queryByTestId('result-finished-mass')).toBeNull();
    expect(screen.queryByText(/Water boils at/)).toBeNull();
    expect(screen.getByTestId('results-problem').textContent).toContain(message);
    const input = screen.getByLabelText(label);
    const described = (input.getAttribute('aria-describedby') ?? '').split(' ').filter(Boolean).map((id) => document.getElementById(id)?.textContent ?? '').join(' ');
    expect(described).toContain(message);
  });

  it('the rule date input offers only days the save accepts', () => {
    renderRevise();
    const input = screen.getByLabelText('Rule date (production or labelling)');
    expect([input.getAttribute('min'), input.getAttribute('max')]).toEqual(['2000-01-01', '2099-12-31']);
  });

  it('shows the danger caution for a planned pH of 4.8', () => {
    renderRevise();
    type('Planned pH (optional)', '4.8');
    // Source: 21 CFR 114.3 (acid foods have an equilibrium pH of 4.6 or below).
    const alerts = screen.getAllByRole('alert');
    const danger = alerts.find((a) => /pH above 4\.6/.test(a.textContent ?? ''));
    expect(danger).toBeTruthy();
    expect(danger?.closest('li')?.getAttribute('data-severity')).toBe('danger');
    expect(danger?.textContent).toContain('Planned pH 4.80 is above 4.6');
    expect(danger?.textContent).toContain('Local food-safety codes and licensed practice govern.');
    // Danger comes before every warning and note.
    const cautions = within(screen.getByRole('list', { name: 'Cautions' })).getAllByRole('listitem');
    expect(cautions[0].getAttribute('data-severity')).toBe('danger');
  });
});

describe('FormulaEditor: what the server sends', () => {
  it('renders the lines and their batch results on the server, and the panels below them only in the browser', () => {
    const html = renderToString(reviseEditor());
    // The first screen: the lines and the live results beside them.
    expect(html).toContain('id="line-l0-ingredient"');
    expect(html).toContain('data-testid="result-finished-mass"');
    // Below them, a placeholder that says what is coming instead of the scaling, refractometer and label
    // panels (no cost here: this editor is given no prices).
    expect(html).toMatch(/Loading (<!-- -->)?the scaling and label(<!-- -->)?…/);
    expect(html).not.toMatch(/Loading (<!-- -->)?the cost/);
    expect(html).not.toContain('id="live-label-title"');
    expect(html).not.toMatch(/Scale this formula|Refractometer/);

    renderRevise();
    expect(screen.getByRole('heading', { name: 'Label' })).toBeTruthy();
    expect(screen.queryByText('Loading the scaling and label…')).toBeNull();
  });
});

describe('FormulaEditor: unit toggles', () => {
  it('shows 500 g as 17.64 oz and restores exactly 500 g when toggled back', async () => {
    renderRevise({ lines: [{ ingredientId: IDS.fruit, quantity: 500, unit: 'g' }, { ingredientId: IDS.sugar, quantity: 500, unit: 'g' }] });
    const qty = () => screen.getByLabelText('Line 1: quantity') as HTMLInputElement;
    const unit = () => screen.getByLabelText('Line 1: unit') as HTMLSelectElement;

    fireEvent.click(screen.getByRole('button', { name: 'Imperial' }));
    // Source: international avoirdupois ounce = 28.349523125 g (International Yard and Pound Agreement, 1959): 500 g = 17.637 oz.
    expect(qty().value).toBe('17.64');
    expect(unit().value).toBe('oz');
    expect(screen.getByTestId('result-total-charge').textContent).toMatch(/ (lb|oz)$/);
    // 1000 g charge = 2.205 lb (1 lb = 453.59237 g, same agreement).
    expect(screen.getByTestId('result-total-charge').textContent).toBe('2.205 lb');
    expect((screen.getByLabelText('Jar net fill (oz)') as HTMLInputElement).value).toBe('11.99');

    for (let i = 0; i < 5; i += 1) {
      fireEvent.click(screen.getByRole('button', { name: 'Metric' }));
      fireEvent.click(screen.getByRole('button', { name: 'Imperial' }));
    }
    fireEvent.click(screen.getByRole('button', { name: 'Metric' }));
    expect(qty().value).toBe('500');
    expect(unit().value).toBe('g');
    expect((screen.getByLabelText('Jar net fill (g)') as HTMLInputElement).value).toBe('340');
    expect(screen.getByTestId('result-total-charge').textContent).toBe('1.000 kg');

    fireEvent.click(screen.getByRole('button', { name: 'Save new revision' }));
    await waitFor(() => expect(actions.reviseFormulaAction).toHaveBeenCalledTimes(1));
    const sent = actions.reviseFormulaAction.mock.calls[0][1];
    expect(sent.lines[0]).toEqual({ ingredientId: IDS.fruit, quantity: 500, unit: 'g' });
    expect(sent.settings.jarNetFillG).toBe(340);
  });

  it('sends imperial lines in their entered unit at full precision', async () => {
    renderRevise({ lines: [{ ingredientId: IDS.fruit, quantity: 500, unit: 'g' }, { ingredientId: IDS.sugar, quantity: 500, unit: 'g' }], massUnits: 'imperial' });
    expect((screen.getByLabelText('Line 1: quantity') as HTMLInputElement).value).toBe('17.64');
    fireEvent.click(screen.getByRole('button', { name: 'Save new revision' }));
    await waitFor(() => expect(actions.reviseFormulaAction).toHaveBeenCalledTimes(1));
    const line = actions.reviseFormulaAction.mock.calls[0][1].lines[0];
    expect(line.unit).toBe('oz');
    // Source: 1 oz = 28.349523125 g exactly (International Yard and Pound Agreement, 1959).
    expect(line.quantity * 28.349523125).toBeCloseTo(500, 9);
  });

  it('shows temperatures in °F after the temperature toggle', () => {
    renderRevise();
    fireEvent.click(screen.getByRole('button', { name: '°F' }));
    // Water at 101.325 kPa boils at 100 °C = 212 °F (memory).
    expect(screen.getByTestId('result-water-boiling').textContent).toBe('212.0 °F');
    // Common practice, no published source: setting point = water bp + 8 °F, i.e. 220 °F at sea level.
    expect(screen.getByTestId('result-rule-of-thumb').textContent).toBe('220.0 °F');
  });
});

describe('FormulaEditor: lines', () => {
  it('moves a line down and undoes a removal', () => {
    renderRevise();
    fireEvent.click(screen.getByRole('button', { name: 'Move line 1 down' }));
    expect((screen.getByLabelText('Line 1: ingredient') as HTMLSelectElement).value).toBe(IDS.sugar);
    expect((screen.getByLabelText('Line 2: ingredient') as HTMLSelectElement).value).toBe(IDS.fruit);

    fireEvent.click(screen.getByRole('button', { name: 'Remove line 2' }));
    expect(screen.queryByLabelText('Line 4: ingredient')).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Undo remove' }));
    expect((screen.getByLabelText('Line 2: ingredient') as HTMLSelectElement).value).toBe(IDS.fruit);
    expect((screen.getByLabelText('Line 2: quantity') as HTMLInputElement).value).toBe('10000');
  });

  it('defaults a new line to oz for imperial users', () => {
    render(<FormulaEditor mode="create" ingredients={LIBRARY} massUnits="imperial" temperatureUnit="F" />);
    fireEvent.click(screen.getByRole('button', { name: 'Add line' }));
    expect((screen.getByLabelText('Line 1: unit') as HTMLSelectElement).value).toBe('oz');
  });

  it('groups the ingredient picker by kind', () => {
    render(<FormulaEditor mode="create" ingredients={LIBRARY} massUnits="metric" temperatureUnit="C" />);
    fireEvent.click(screen.getByRole('button', { name: 'Add line' }));
    const picker = screen.getByLabelText('Line 1: ingredient');
    fireEvent.focus(picker);
    const groups = picker.querySelectorAll('optgroup');
    expect([...groups].map((g) => g.label)).toEqual(['Fruit, juice or purée', 'Sweetener', 'Pectin', 'Acid']);
  });

  it('builds the ingredient list only when a picker is about to open (focus, a press or a key)', () => {
    renderRevise();
    const optionTexts = (n: number) => [...screen.getByLabelText(`Line ${n}: ingredient`).querySelectorAll('option')].map((o) => o.textContent);
    // Closed pickers hold the placeholder and their chosen ingredient only, and show it chosen.
    expect(optionTexts(1)).toEqual(['Choose an ingredient…', `${LIBRARY.find((i) => i.id === IDS.fruit)!.name} (${LIBRARY.find((i) => i.id === IDS.fruit)!.solidsPct} % solids)`]);
    expect((screen.getByLabelText('Line 1: ingredient') as HTMLSelectElement).value).toBe(IDS.fruit);
    const everything = LIBRARY.length + 1;
    fireEvent.pointerDown(screen.getByLabelText('Line 1: ingredient'));
    expect(optionTexts(1)).toHaveLength(everything);
    expect((screen.getByLabelText('Line 1: ingredient') as HTMLSelectElement).value).toBe(IDS.fruit);
    expect(optionTexts(2)).toHaveLength(2);
    fireEvent.keyDown(screen.getByLabelText('Line 2: ingredient'), { key: 'ArrowDown' });
    expect(optionTexts(2)).toHaveLength(everything);
  });
});

describe('FormulaEditor: saving', () => {
  function describedText(input: HTMLElement): string {
    const ids = (input.getAttribute('aria-describedby') ?? '').split(' ').filter(Boolean);
    return ids.map((id) => document.getElementById(id)?.textContent ?? '').join(' ');
  }

  it('creates a formula, then shows the revision and navigates to it', async () => {
    actions.createFormulaAction.mockResolvedValue({ ok: true, data: { formulaId: FORMULA_ID, revision: 1 } });
    render(<FormulaEditor mode="create" ingredients={LIBRARY} massUnits="metric" temperatureUnit="C" defaults={{ targetSolidsPct: 68 }} />);
    type('Name', 'Damson trial A');
    fireEvent.click(screen.getByRole('button', { name: 'Add line' }));
    choose(1, IDS.fruit);
    type('Line 1: quantity', '1000');
    fireEvent.click(screen.getByRole('button', { name: 'Save formula' }));
    await screen.findByText('Saved as revision 1.');
    const input = actions.createFormulaAction.mock.calls[0][0];
    expect(input).toMatchObject({ name: 'Damson trial A', lines: [{ ingredientId: IDS.fruit, quantity: 1000, unit: 'g' }] });
    expect(input.settings.targetSolidsPct).toBe(68);
    expect(router.push).toHaveBeenCalledWith(`/formulas/${FORMULA_ID}`);
    expect(router.refresh).toHaveBeenCalled();
  });

  it('disables the save button while saving', async () => {
    let resolve: (v: unknown) => void = () => {};
    actions.reviseFormulaAction.mockReturnValue(new Promise((r) => (resolve = r)));
    renderRevise();
    fireEvent.click(screen.getByRole('button', { name: 'Save new revision' }));
    const busy = await screen.findByRole('button', { name: 'Saving…' });
    expect((busy as HTMLButtonElement).disabled).toBe(true);
    resolve({ ok: true, data: { formulaId: FORMULA_ID, revision: 4 } });
    await screen.findByText('Saved as revision 4.');
  });

  it('puts 422 field errors next to the right inputs', async () => {
    actions.createFormulaAction.mockResolvedValue({
      ok: false,
      status: 422,
      error: 'Some fields are not valid.',
      fields: {
        name: ['A formula with this name already exists.'],
        'settings.targetSolidsPct': ['Target solids must be below 100 %.'],
        'lines.1.quantity': ['Quantity is implausibly large.'],
        'lines.0.ingredientId': ['Choose an ingredient from the library.'],
      },
    });
    render(<FormulaEditor mode="create" ingredients={LIBRARY} massUnits="metric" temperatureUnit="C" />);
    type('Name', 'Damson trial A');
    fireEvent.click(screen.getByRole('button', { name: 'Add line' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add line' }));
    choose(1, IDS.fruit);
    choose(2, IDS.sugar);
    type('Line 1: quantity', '1000');
    type('Line 2: quantity', '900');
    fireEvent.click(screen.getByRole('button', { name: 'Save formula' }));
    await screen.findByText('Some fields are not valid.');

    const name = screen.getByLabelText('Name');
    expect(name.getAttribute('aria-invalid')).toBe('true');
    expect(describedText(name)).toContain('A formula with this name already exists.');
    expect(describedText(screen.getByLabelText('Target final soluble solids (%)'))).toContain('Target solids must be below 100 %.');
    expect(describedText(screen.getByLabelText('Line 2: quantity'))).toContain('Quantity is implausibly large.');
    expect(describedText(screen.getByLabelText('Line 1: ingredient'))).toContain('Choose an ingredient from the library.');
    expect(screen.getByLabelText('Line 1: quantity').getAttribute('aria-invalid')).toBeNull();
    expect(router.push).not.toHaveBeenCalled();
  });

  it('strips the change. prefix of reviseFormulaAction field errors', async () => {
    actions.reviseFormulaAction.mockResolvedValue({
      ok: false,
      status: 422,
      error: 'Some fields are not valid.',
      fields: { 'change.lines.2.quantity': ['Quantity must be more than 0.'], 'change.settings.jarNetFillG': ['Jar fill must be at most 50 kg.'] },
    });
    renderRevise();
    fireEvent.click(screen.getByRole('button', { name: 'Save new revision' }));
    await screen.findByText('Some fields are not valid.');
    expect(describedText(screen.getByLabelText('Line 3: quantity'))).toContain('Quantity must be more than 0.');
    expect(describedText(screen.getByLabelText('Jar net fill (g)'))).toContain('Jar fill must be at most 50 kg.');
  });

  it('keeps the work on a 409 and re-sends with force: true', async () => {
    actions.reviseFormulaAction
      .mockResolvedValueOnce({ ok: false, status: 409, error: 'Someone saved revision 4 after you opened revision 3.' })
      .mockResolvedValueOnce({ ok: true, data: { formulaId: FORMULA_ID, revision: 5 } });
    renderRevise();
    type('Line 2: quantity', '9500');
    type('What changed (short note)', 'Less sugar');
    fireEvent.click(screen.getByRole('button', { name: 'Save new revision' }));

    const force = await screen.findByRole('button', { name: 'Save mine on top anyway' });
    expect(screen.getByText('Someone saved revision 4 after you opened revision 3.')).toBeTruthy();
    expect((screen.getByLabelText('Line 2: quantity') as HTMLInputElement).value).toBe('9500');
    expect((screen.getByLabelText('What changed (short note)') as HTMLInputElement).value).toBe('Less sugar');
    const first = actions.reviseFormulaAction.mock.calls[0];
    expect(first[0]).toBe(FORMULA_ID);
    expect(first[1].force).toBeUndefined();
    expect(first[1].baseRevision).toBe(3);

    fireEvent.click(force);
    await screen.findByText('Saved as revision 5.');
    const second = actions.reviseFormulaAction.mock.calls[1];
    expect(second[1]).toMatchObject({ baseRevision: 3, force: true, note: 'Less sugar' });
    expect(second[1].lines[1]).toEqual({ ingredientId: IDS.sugar, quantity: 9500, unit: 'g' });
  });

  it('blocks a save the shared schema refuses and says why, without calling the server', async () => {
    renderRevise();
    type('Name', '   ');
    fireEvent.click(screen.getByRole('button', { name: 'Save new revision' }));
    await screen.findByText('Give the formula a name.');
    expect(actions.reviseFormulaAction).not.toHaveBeenCalled();
  });

  it('drops "Some fields need attention" once the marked fields are fixed', async () => {
    renderRevise();
    type('Name', '   ');
    fireEvent.click(screen.getByRole('button', { name: 'Save new revision' }));
    await screen.findByText('Some fields need attention; they are marked below.');
    type('Name', 'Plum jam, trial 2');
    expect(screen.queryByText('Give the formula a name.')).toBeNull();
    expect(screen.queryByText('Some fields need attention; they are marked below.')).toBeNull();
  });

  it('asks before leaving with unsaved changes', () => {
    renderRevise();
    const clean = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(clean);
    expect(clean.defaultPrevented).toBe(false);
    type('Line 1: quantity', '9000');
    const dirty = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(dirty);
    expect(dirty.defaultPrevented).toBe(true);
  });
});
