// @vitest-environment jsdom
/** The formula editor's live label follows every keystroke, and leaves unknowns unknown. */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { emptyLabelFields } from '@/lib/ingredients/label-data';
import type { IngredientView } from '@/lib/ingredients/schema';
import { IDS, LIBRARY } from '../formulas-editor/fixtures';
import { SR28 } from './fixtures';

vi.mock('next/navigation', () => ({ useRouter: () => ({ push: vi.fn(), refresh: vi.fn(), replace: vi.fn() }), usePathname: () => '/', useSearchParams: () => new URLSearchParams() }));
vi.mock('@/lib/formulas/actions', () => ({ createFormulaAction: vi.fn(), reviseFormulaAction: vi.fn() }));
import { FormulaEditor } from '@/components/formulas/FormulaEditor';

afterEach(cleanup);

// Fruit and sugar carry SR28 figures (strawberry 09316, sugar 19335); pectin and citric acid none at all.
const library: IngredientView[] = LIBRARY.map((v) =>
  v.id === IDS.fruit ? { ...v, labelData: { ...emptyLabelFields(), labelName: 'strawberries', nutrients: SR28.strawberry } }
    : v.id === IDS.sugar ? { ...v, labelData: { ...emptyLabelFields(), labelName: 'sugar', nutrients: SR28.sugar } }
      : v);

const type = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });
/** The picker takes focus before it opens (it builds its list then), as with Tab or a tap. */
function pick(line: number, id: string) {
  const picker = screen.getByLabelText(`Line ${line}: ingredient`);
  fireEvent.focus(picker);
  fireEvent.change(picker, { target: { value: id } });
}
const liveRow = (header: string) => {
  const eu = within(document.getElementById('live-label')!).getByRole('region', { name: 'EU nutrition declaration' });
  return within(eu).getByRole('rowheader', { name: header }).closest('tr')!.textContent ?? '';
};

describe('the live label in the formula editor', () => {
  it('waits for results, then recomputes the declaration and statements as the sugar is typed', () => {
    render(<FormulaEditor mode="create" ingredients={library} massUnits="metric" temperatureUnit="C" />);
    expect(screen.getByText('The label appears once the formula has results.')).toBeTruthy();
    type('Target final soluble solids (%)', '65');
    [IDS.fruit, IDS.sugar].forEach(() => fireEvent.click(screen.getByRole('button', { name: 'Add line' })));
    [IDS.fruit, IDS.sugar].forEach((id, i) => pick(i + 1, id));
    type('Line 1: quantity', '1000');
    type('Line 2: quantity', '1000');
    const live = document.getElementById('live-label')!;
    // 1000 g fruit at 10 % solids + 1000 g sugar = 1100 g solids at 65 % → 1692.3 g; 1000/1692.3 = 59.09 g fruit per 100 g,
    // stated rounded down (Directive 2001/113/EC Art. 2(3); rounding down is common practice, no published source).
    expect(within(live).getByText('Prepared with 59 g of fruit per 100 g')).toBeTruthy();
    const sugarsBefore = liveRow('of which sugars');
    type('Line 2: quantity', '600');
    // 700 g solids → 1076.9 g finished: 92.86 g of fruit per 100 g.
    expect(within(live).getByText('Prepared with 92 g of fruit per 100 g')).toBeTruthy();
    expect(liveRow('of which sugars')).not.toBe(sugarsBefore);
  });

  it('shows what no ingredient knows as unknown and names the gaps', () => {
    render(<FormulaEditor mode="create" ingredients={library} massUnits="metric" temperatureUnit="C" />);
    type('Target final soluble solids (%)', '65');
    [IDS.fruit, IDS.sugar, IDS.pectin].forEach(() => fireEvent.click(screen.getByRole('button', { name: 'Add line' })));
    [IDS.fruit, IDS.sugar, IDS.pectin].forEach((id, i) => pick(i + 1, id));
    type('Line 1: quantity', '1000');
    type('Line 2: quantity', '1000');
    type('Line 3: quantity', '10');
    const live = document.getElementById('live-label')!;
    expect(within(live).getByTestId('label-incomplete').textContent).toMatch(/Pectin grade 200/);
    expect(liveRow('Carbohydrate')).toContain('(incomplete)');
    expect(live.textContent).not.toMatch(/NaN|undefined/);
  });
});
