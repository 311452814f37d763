// @vitest-environment jsdom
import { afterEach, describe, it, expect } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { within } from '@testing-library/dom';
import { IngredientTable, sortHref } from '@/components/ingredients/IngredientTable';
import type { IngredientView } from '@/lib/ingredients/schema';
import { typicalRow } from './fixtures';

afterEach(cleanup);

const ROWS: IngredientView[] = [
  typicalRow('strawberry'),
  typicalRow('quince', { origin: 'edited', solidsPct: 14, updatedByName: 'Test Maker', updatedAt: '2026-03-02T10:00:00.000Z' }),
  typicalRow('pectin_hm_rapid_150', { id: '7d1e2f3a-4b5c-4d6e-8f7a-9b0c1d2e3f4a', name: 'House pectin blend', origin: 'custom', source: null, updatedByName: 'Test Maker' }),
];

function headerFor(name: RegExp) {
  const link = screen.getByRole('link', { name });
  const th = link.closest('th');
  if (!th) throw new Error('sort link is not inside a header cell');
  return { link, th };
}

function hrefParams(href: string | null) {
  return new URL(href ?? '', 'http://localhost').searchParams;
}

describe('IngredientTable', () => {
  it('shows the origin badges, with the handbook source of a typical value', () => {
    render(<IngredientTable rows={ROWS} query={{}} canEdit massUnits="metric" />);
    const strawberry = screen.getByTestId(`ingredient-row-${ROWS[0].id}`);
    expect(within(strawberry).getByText('Typical value')).toBeTruthy();
    // Source: 21 CFR 101.30(h)(1) Brix table for single-strength juices (memory): strawberry 8.0 °Brix
    expect(within(strawberry).getByText('8 %')).toBeTruthy();
    expect(within(strawberry).getByText(/21 CFR 101\.30\(h\)\(1\) Brix table/)).toBeTruthy();
    // Source: National Center for Home Food Preservation guidance: strawberries are a low-pectin fruit
    expect(within(strawberry).getByText('Low pectin')).toBeTruthy();
    // Source: 21 CFR 150.160(b)(1): strawberry is a Group I fruit
    expect(within(strawberry).getByText('US Group I')).toBeTruthy();

    const quince = screen.getByTestId(`ingredient-row-${ROWS[1].id}`);
    expect(within(quince).getByText('Edited')).toBeTruthy();
    expect(within(quince).getByText('Test Maker')).toBeTruthy();
    expect(within(quince).getByText('2 Mar 2026')).toBeTruthy();
    // Source: Council Directive 2001/113/EC, Annex I: quince is among the reduced-minimum fruits
    expect(within(quince).getByText(/EU: Redcurrant, rowanberry, sea-buckthorn, blackcurrant, rosehip, quince/)).toBeTruthy();

    const own = screen.getByTestId(`ingredient-row-${ROWS[2].id}`);
    expect(within(own).getByText('Own')).toBeTruthy();
    expect(within(own).getByText('High-methoxyl, rapid set, grade 150')).toBeTruthy();
    expect(within(own).queryByText(/Source:/)).toBeNull();
  });

  it('links row names to the edit page only for editors, and offers the CSV export', () => {
    const { unmount } = render(<IngredientTable rows={ROWS} query={{}} canEdit massUnits="metric" />);
    expect(screen.getByRole('link', { name: 'Strawberry' }).getAttribute('href')).toBe(`/ingredients/${ROWS[0].id}`);
    expect(screen.getByRole('link', { name: 'Download CSV' }).getAttribute('href')).toBe('/api/v1/ingredients/export');
    unmount();
    render(<IngredientTable rows={ROWS} query={{}} canEdit={false} massUnits="metric" />);
    expect(screen.queryByRole('link', { name: 'Strawberry' })).toBeNull();
    expect(screen.getByText('Strawberry')).toBeTruthy();
  });

  it('keeps search and filter in a GET form', () => {
    render(<IngredientTable rows={ROWS} query={{ q: 'berry', kind: 'fruit', sort: 'kind', dir: 'desc' }} canEdit massUnits="metric" />);
    const form = screen.getByRole('search');
    expect(form.getAttribute('method')).toBe('get');
    expect((screen.getByLabelText('Search by name') as HTMLInputElement).value).toBe('berry');
    expect((screen.getByLabelText('Kind') as HTMLSelectElement).value).toBe('fruit');
    expect((form.querySelector('input[name="sort"]') as HTMLInputElement).value).toBe('kind');
    expect((form.querySelector('input[name="dir"]') as HTMLInputElement).value).toBe('desc');
  });

  it('renders sort links that toggle the direction and marks the sorted header with aria-sort', () => {
    const { unmount } = render(<IngredientTable rows={ROWS} query={{ q: 'berry', sort: 'solidsPct', dir: 'asc' }} canEdit massUnits="metric" />);
    // Source: WAI-ARIA 1.2, aria-sort (values "ascending" / "descending", on the sorted header only)
    const solids = headerFor(/Soluble solids/);
    expect(solids.th.getAttribute('aria-sort')).toBe('ascending');
    let params = hrefParams(solids.link.getAttribute('href'));
    expect(params.get('sort')).toBe('solidsPct');
    expect(params.get('dir')).toBe('desc');
    expect(params.get('q')).toBe('berry');
    const name = headerFor(/^Name/);
    expect(name.th.getAttribute('aria-sort')).toBeNull();
    params = hrefParams(name.link.getAttribute('href'));
    expect(params.get('sort')).toBe('name');
    expect(params.get('dir')).toBe('asc');
    unmount();

    render(<IngredientTable rows={ROWS} query={{ sort: 'solidsPct', dir: 'desc' }} canEdit massUnits="metric" />);
    const solidsDesc = headerFor(/Soluble solids/);
    expect(solidsDesc.th.getAttribute('aria-sort')).toBe('descending');
    params = hrefParams(solidsDesc.link.getAttribute('href'));
    expect(params.get('dir')).toBe('asc');
    expect(params.has('q')).toBe(false);
  });

  it('marks a last-change sort without a direction as descending, as the server sorts it', () => {
    render(<IngredientTable rows={ROWS} query={{ sort: 'updatedAt' }} canEdit massUnits="metric" />);
    expect(headerFor(/Last change/).th.getAttribute('aria-sort')).toBe('descending');
    expect(headerFor(/^Name/).th.getAttribute('aria-sort')).toBeNull();
  });

  it('treats a URL without a sort as name A → Z', () => {
    render(<IngredientTable rows={ROWS} query={{}} canEdit massUnits="metric" />);
    expect(headerFor(/^Name/).th.getAttribute('aria-sort')).toBe('ascending');
    expect(sortHref({}, 'name')).toBe('/ingredients?sort=name&dir=desc');
    // The server lists the last change newest first by default, so the first click asks for that.
    expect(sortHref({ kind: 'pectin', archived: 'include' }, 'updatedAt')).toBe('/ingredients?kind=pectin&archived=include&sort=updatedAt&dir=desc');
    expect(sortHref({ sort: 'updatedAt' }, 'updatedAt')).toBe('/ingredients?sort=updatedAt&dir=asc');
  });

  it('says when nothing matches the search, with a way back', () => {
    render(<IngredientTable rows={[]} query={{ q: 'cloudberry' }} canEdit massUnits="metric" />);
    expect(screen.getByText('No ingredient matches “cloudberry”.')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Clear the search' }).getAttribute('href')).toBe('/ingredients');
    expect(screen.queryByRole('table')).toBeNull();
    expect(screen.queryByText('Add your first ingredient')).toBeNull();
  });

  it('invites an editor to add the first ingredient of an empty library', () => {
    const { unmount } = render(<IngredientTable rows={[]} query={{}} canEdit massUnits="metric" />);
    expect(screen.getByRole('link', { name: 'Add your first ingredient' }).getAttribute('href')).toBe('/ingredients/new');
    expect(screen.queryByText(/No ingredient matches/)).toBeNull();
    unmount();
    render(<IngredientTable rows={[]} query={{}} canEdit={false} massUnits="metric" />);
    expect(screen.queryByRole('link', { name: 'Add your first ingredient' })).toBeNull();
  });
});
