// @vitest-environment jsdom
import { afterEach, describe, it, expect } from 'vitest';
import { cleanup, render, screen } from '@testing-library/react';
import { within } from '@testing-library/dom';
import { FormulaPrintSheet, PRINT_FOOTER } from '@/components/formulas/FormulaPrintSheet';
import { computeFormula } from '@/lib/formulas/compute';
import type { FormulaDetail, FormulaSettingsInput, RevisionLine } from '@/lib/formulas/schema';
import { IDS, PRACTICAL_ACTION_LINES, SUGAR, line, revision, settings } from './fixtures';

afterEach(cleanup);

function detail(lines: RevisionLine[], formulaSettings: FormulaSettingsInput): FormulaDetail {
  const outcome = computeFormula(formulaSettings, lines);
  return {
    id: '9a1b2c3d-4e5f-4a6b-8c7d-8e9f0a1b2c3d',
    name: 'Orchard jam trial',
    description: null,
    current: revision(3, lines, { settings: formulaSettings }),
    computation: outcome.ok ? outcome.computation : null,
    computationError: outcome.ok ? null : outcome.message,
  };
}

/** The value shown under a key-figure label. */
function figure(label: string): string {
  const dt = screen.getByText(label, { selector: 'dt' });
  return dt.nextElementSibling?.textContent ?? '';
}

describe('FormulaPrintSheet', () => {
  it('prints the worked batch with its finished mass, lines and compliance source', () => {
    render(<FormulaPrintSheet formula={detail(PRACTICAL_ACTION_LINES, settings())} massUnits="metric" temperatureUnit="C" printedAt="2026-02-04T12:00:00.000Z" />);
    expect(screen.getByRole('heading', { level: 1 }).textContent).toBe('Orchard jam trial');
    expect(screen.getByText(/^3, saved 3 Feb 2026 by Test Maker$/)).toBeTruthy();
    expect(screen.getByText('Jam')).toBeTruthy();
    expect(screen.getByText(/EU \(Directive 2001\/113\/EC, as amended\), rules of 2026-01-15/)).toBeTruthy();
    // Source: Practical Action technical brief "Jams, jellies and marmalade": 11.115 kg solids at 68 % → 16.35 kg
    expect(figure('Finished mass')).toBe('16.35 kg');
    expect(screen.getByText(/11\.12 kg soluble solids in ÷ 68 % target/)).toBeTruthy();
    // Source: Practical Action technical brief "Jams, jellies and marmalade": 60 g pectin in the batch, about 0.37 %
    expect(figure('Pectin in finished product')).toBe('0.37 %');

    const pectinRow = screen.getByRole('rowheader', { name: 'HM pectin grade 200' }).closest('tr') as HTMLElement;
    expect(within(pectinRow).getByText('60 g', { selector: 'td.text-right' })).toBeTruthy();
    // 60 g of a 20 115 g charge (the same worked batch): 0.3 %
    expect(within(pectinRow).getByText('0.3 %')).toBeTruthy();

    // Source: Council Directive 2001/113/EC, Annex I: jam needs ≥ 350 g fruit per 1000 g (general fruit)
    const fruitRule = screen.getByRole('rowheader', { name: /Jam: minimum fruit/ }).closest('tr') as HTMLElement;
    expect(within(fruitRule).getByText('≥ 350 g fruit per 1000 g')).toBeTruthy();
    expect(within(fruitRule).getByText('Pass')).toBeTruthy();
    expect(within(fruitRule).getByText(/Council Directive 2001\/113\/EC, Annex I/)).toBeTruthy();
    // Source: Council Directive 2001/113/EC, Annex I, Part II: soluble dry matter ≥ 60 %
    const solidsRule = screen.getByRole('rowheader', { name: 'Soluble dry matter' }).closest('tr') as HTMLElement;
    expect(within(solidsRule).getByText('Pass')).toBeTruthy();

    expect(screen.getByText(PRINT_FOOTER)).toBeTruthy();
    expect(screen.queryByRole('navigation')).toBeNull();
  });

  it('gives the end point from the sucrose table with the water boiling point and its basis', () => {
    render(<FormulaPrintSheet formula={detail(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 65 }))} massUnits="metric" temperatureUnit="C" printedAt="2026-02-04T12:00:00.000Z" />);
    // Source: Cruess & McNair, quoted in Lowe, Experimental Cookery: 65 °Brix boils at 103.9 °C at sea level
    expect(figure('End point')).toBe('103.9 °C');
    expect(screen.getByText(/Water boils at 100\.0 °C, sea level/)).toBeTruthy();
  });

  it('uses °F for a Fahrenheit user and the altitude for the water boiling point', () => {
    render(<FormulaPrintSheet formula={detail(PRACTICAL_ACTION_LINES, settings({ altitudeM: 1000 }))} massUnits="imperial" temperatureUnit="F" printedAt="2026-02-04T12:00:00.000Z" />);
    // Source: International Standard Atmosphere with the Antoine equation for water: 96.7 °C at 1000 m
    const water = /Water boils at ([\d.]+) °F, at 3281 ft/.exec(screen.getByText(/Water boils at/).textContent ?? '');
    expect(water).not.toBeNull();
    expect(((Number(water?.[1]) - 32) * 5) / 9).toBeCloseTo(96.7, 1);
    // Source: Practical Action technical brief "Jams, jellies and marmalade": 16.35 kg = 36.04 lb (1 lb = 453.59237 g, exact)
    expect(figure('Finished mass')).toBe('36.04 lb');
  });

  it('estimates water activity of a plain 65 % sucrose syrup with the model named', () => {
    const syrup = [line(IDS.sugar, SUGAR, 650), line('5a6b7c8d-9e0f-4a1b-8c2d-3e4f5a6b7c8d', { kind: 'water', name: 'Water', solidsPct: 0 }, 350)];
    render(<FormulaPrintSheet formula={detail(syrup, settings({ targetSolidsPct: 65 }))} massUnits="metric" temperatureUnit="C" printedAt="2026-02-04T12:00:00.000Z" />);
    // Source: Norrish equation with K = 6.47 for sucrose (Chirife et al. 1980, memory): aw ≈ 0.865 at 65 % w/w;
    // Beuchat (1981) lists 65 % sucrose at about aw 0.87
    expect(Number(figure('Estimated water activity (aw)'))).toBeCloseTo(0.865, 2);
    expect(screen.getByText(/Estimate by Norrish \(sucrose\)/)).toBeTruthy();
    // Source: Council Directive 2001/113/EC, Annex I: a formula without fruit has 0 g fruit per 1000 g
    expect(figure('Fruit per 1000 g finished')).toBe('0 g');
  });

  it('puts every caution in the box, a pH above 4.6 as an alert with the governance sentence', () => {
    render(<FormulaPrintSheet formula={detail(PRACTICAL_ACTION_LINES, settings({ plannedPh: 4.8 }))} massUnits="metric" temperatureUnit="C" printedAt="2026-02-04T12:00:00.000Z" />);
    const box = screen.getByRole('region', { name: 'Cautions' });
    const items = within(box).getAllByRole('listitem');
    // Source: 21 CFR 114.3: acid foods have an equilibrium pH of 4.6 or below
    const alert = within(box).getByRole('alert');
    expect(alert.textContent).toContain('pH above 4.6');
    expect(alert.textContent).toContain('Local food-safety codes and licensed practice govern.');
    expect(items[0].contains(alert)).toBe(true); // danger first
    // Source: McGee, On Food and Cooking (2004): HM pectin gels at pH < 3.5, so at 4.8 this HM formula will not set
    expect(within(box).getByText(/Warning: pH too high for a high-methoxyl set/)).toBeTruthy();
    expect(within(box).getByText(/Note: Hot filling/)).toBeTruthy();
    const computed = detail(PRACTICAL_ACTION_LINES, settings({ plannedPh: 4.8 })).computation;
    expect(items).toHaveLength(computed?.cautions.length ?? -1);
  });

  it('says why there are no figures when the batch cannot be computed', () => {
    const waterOnly = [line('5a6b7c8d-9e0f-4a1b-8c2d-3e4f5a6b7c8d', { kind: 'water', name: 'Water', solidsPct: 0 }, 500)];
    const formula = detail(waterOnly, settings());
    expect(formula.computation).toBeNull();
    render(<FormulaPrintSheet formula={formula} massUnits="metric" temperatureUnit="C" printedAt="2026-02-04T12:00:00.000Z" />);
    const alert = screen.getByRole('alert');
    expect(alert.textContent).toContain('could not be computed');
    expect(alert.textContent).toContain(formula.computationError as string);
    expect(screen.queryByText('Key figures')).toBeNull();
    expect(screen.queryByText('Finished mass')).toBeNull();
    // The lines are still printed as written.
    expect(screen.getByRole('rowheader', { name: 'Water' })).toBeTruthy();
    expect(screen.getByText(PRINT_FOOTER)).toBeTruthy();
  });

  it('print styles: the sheet carries no inline <style> (the CSP would refuse it); margins and white paper come from the stylesheet', async () => {
    const { container } = render(<FormulaPrintSheet formula={detail(PRACTICAL_ACTION_LINES, settings())} massUnits="metric" temperatureUnit="C" printedAt="2026-02-04T12:00:00.000Z" />);
    expect(container.querySelector('style')).toBeNull();
    expect(container.querySelector('[style]')).toBeNull();
    const css = (await import('node:fs')).readFileSync('app/globals.css', 'utf8');
    expect(css).toMatch(/@page \{\s*margin: 14mm;\s*\}/);
    expect(css).toMatch(/@media print \{\s*html,\s*body \{\s*background: #fff !important;/);
  });
});
