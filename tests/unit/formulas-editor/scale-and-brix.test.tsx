// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { within } from '@testing-library/dom';
import { ScalePanel } from '@/components/formulas/ScalePanel';
import { BrixHelper } from '@/components/formulas/BrixHelper';
import type { ComputableLine } from '@/lib/formulas/compute';
import { BASE_SETTINGS, LIBRARY } from './fixtures';

afterEach(cleanup);

/** Practical Action technical brief "Jams, jellies and marmalade": 10 kg fruit, 10 kg sugar, 60 g pectin, 55 g citric acid. */
const PRACTICAL_ACTION: ComputableLine[] = [
  { ingredient: LIBRARY[0], quantity: 10000, unit: 'g' },
  { ingredient: LIBRARY[1], quantity: 10000, unit: 'g' },
  { ingredient: LIBRARY[2], quantity: 60, unit: 'g' },
  { ingredient: LIBRARY[3], quantity: 55, unit: 'g' },
];

function cells(row: HTMLElement): string[] {
  return within(row).getAllByRole('cell').map((c) => c.textContent ?? '');
}

describe('ScalePanel', () => {
  it('scales the Practical Action batch to a 10 kg kettle on a 5 g scale', () => {
    render(<ScalePanel lines={PRACTICAL_ACTION} settings={{ ...BASE_SETTINGS }} massUnits="metric" />);
    fireEvent.change(screen.getByLabelText('Kettle total charge (kg)'), { target: { value: '10' } });
    fireEvent.change(screen.getByLabelText('Scale step (the smallest change your scale shows)'), { target: { value: '5' } });
    fireEvent.change(screen.getByLabelText('Scale step unit'), { target: { value: 'g' } });

    // Source: Practical Action technical brief "Jams, jellies and marmalade" (20.115 kg charge); the scaling and
    // rounding to the nearest 5 g are plain arithmetic (common practice, no published source).
    const factor = 10000 / 20115;
    // Citric acid and pectin (27.3 g, 29.8 g) go to a 1 g step: half of 5 g would move them 9 % and 8 %,
    // more than the 2 % a line may move (common practice, no published source).
    const citric = cells(screen.getByTestId('scaled-line-3'));
    expect(Number.parseFloat(citric[0])).toBeCloseTo(55 * factor, 1); // 27.3 g exact
    expect(citric[1]).toBe('27 g');
    expect(citric[2]).toBe('1 g, finer scale');
    expect(citric[3]).toBe('−0.3 g');
    expect(cells(screen.getByTestId('scaled-line-2'))[1]).toBe('30 g');
    const fruit = cells(screen.getByTestId('scaled-line-0'));
    expect(fruit[1]).toBe('4970 g'); // 4971.4 g → 4970 g
    expect(fruit[2]).toBe('5 g');
    expect(screen.getByTestId('scale-finer-lines').textContent).toMatch(new RegExp(`no line by more than 2 %: ${LIBRARY[2].name}, ${LIBRARY[3].name}\.`));

    // Rounded batch: 4970 + 4970 + 30 + 27 g, solids 497 + 4970 + 30 + 27 g; the planned evaporation is the exact one.
    const roundedCharge = 4970 + 4970 + 30 + 27;
    const roundedSolids = 497 + 4970 + 30 + 27;
    const exactFinished = (11115 * factor) / 0.68;
    const plannedEvaporation = 10000 - exactFinished;
    const expectedPct = (roundedSolids / (roundedCharge - plannedEvaporation)) * 100;
    const shown = screen.getByTestId('scale-planned-evaporation').querySelector('dd')?.textContent ?? '';
    expect(Number.parseFloat(shown)).toBeCloseTo(expectedPct, 2);
  });

  it('scales to a number of jars', () => {
    render(<ScalePanel lines={PRACTICAL_ACTION} settings={{ ...BASE_SETTINGS }} massUnits="metric" />);
    fireEvent.change(screen.getByLabelText('Scale to'), { target: { value: 'jar_count' } });
    fireEvent.change(screen.getByLabelText('Jars'), { target: { value: '24' } });
    // 24 jars × 340 g = 8160 g of finished product (arithmetic on the jar fill).
    expect(screen.getByText(/8\.160 kg exact/)).toBeTruthy();
    // On a 5 g scale the rounded batch still fills all 24 (it gave 23 when every line rounded to the nearest step).
    fireEvent.change(screen.getByLabelText('Scale step (the smallest change your scale shows)'), { target: { value: '5' } });
    expect(screen.getByText(/Jars: 24 exact, 24 rounded\./)).toBeTruthy();
  });

  it('explains invalid targets and steps', () => {
    render(<ScalePanel lines={PRACTICAL_ACTION} settings={{ ...BASE_SETTINGS }} massUnits="metric" />);
    fireEvent.change(screen.getByLabelText('Scale to'), { target: { value: 'jar_count' } });
    fireEvent.change(screen.getByLabelText('Jars'), { target: { value: '2.5' } });
    expect(screen.getByRole('alert').textContent).toBe('Enter a whole number of jars.');
    fireEvent.change(screen.getByLabelText('Jars'), { target: { value: '12' } });
    fireEvent.change(screen.getByLabelText('Scale step (the smallest change your scale shows)'), { target: { value: '0' } });
    expect(screen.getByRole('alert').textContent).toBe('A scale step must be more than 0.');
    expect(screen.queryByTestId('scale-result')).toBeNull();
  });

  it('rounds to 0.01 lb for an imperial scale', () => {
    render(<ScalePanel lines={PRACTICAL_ACTION} settings={{ ...BASE_SETTINGS }} massUnits="imperial" />);
    fireEvent.change(screen.getByLabelText('Kettle total charge (lb)'), { target: { value: '20' } });
    fireEvent.change(screen.getByLabelText('Scale step (the smallest change your scale shows)'), { target: { value: '0.01' } });
    fireEvent.change(screen.getByLabelText('Scale step unit'), { target: { value: 'lb' } });
    // Sugar: 20 lb × 10/20.115 = 9.9428 lb → 9.94 lb (1 lb = 453.59237 g; rounding is arithmetic).
    expect(cells(screen.getByTestId('scaled-line-1'))[1]).toBe('9.94 lb');
  });
});

describe('BrixHelper', () => {
  it('corrects 65 °Brix read at 15 °C by −0.38', () => {
    render(<BrixHelper temperatureUnit="C" />);
    fireEvent.change(screen.getByLabelText('Reading (°Brix)'), { target: { value: '65' } });
    fireEvent.change(screen.getByLabelText('Sample temperature (°C)'), { target: { value: '15' } });
    // Source: OIV-MA-AS2-02 (OIV Compendium of International Methods of Analysis), Table I: 15 °C, 65 % → −0.38
    expect(screen.getByTestId('brix-correction').textContent).toBe('−0.38 °Brix');
    expect(screen.getByTestId('brix-corrected').textContent).toBe('64.62 °Brix');
    expect(screen.getByText(/Source: OIV-MA-AS2-02/)).toBeTruthy();
    expect(screen.queryByText(/approximate/)).toBeNull();
  });

  it('accepts the temperature in °F (59 °F = 15 °C)', () => {
    render(<BrixHelper temperatureUnit="F" />);
    fireEvent.change(screen.getByLabelText('Reading (°Brix)'), { target: { value: '65' } });
    fireEvent.change(screen.getByLabelText('Sample temperature (°F)'), { target: { value: '59' } });
    // Source: OIV-MA-AS2-02, Table I (15 °C, 65 % → −0.38); 59 °F = 15 °C by the definition of the Fahrenheit scale.
    expect(screen.getByTestId('brix-correction').textContent).toBe('−0.38 °Brix');
  });

  it('cautions by the distance from 20 °C, never by where a table row came from, and shows the module message out of range', () => {
    render(<BrixHelper temperatureUnit="C" />);
    fireEvent.change(screen.getByLabelText('Reading (°Brix)'), { target: { value: '65' } });
    fireEvent.change(screen.getByLabelText('Sample temperature (°C)'), { target: { value: '22' } });
    // A walk found "approximate … near a limit" at 22 °C, driven by which rows were recalled: no caution 2 °C from 20 °C.
    expect(screen.queryByText(/bring the sample to 20 °C/)).toBeNull();
    expect(document.body.textContent).not.toMatch(/memory|recalled|approximate/i);
    fireEvent.change(screen.getByLabelText('Sample temperature (°C)'), { target: { value: '24' } });
    expect(screen.getByText('Read 4 °C above 20 °C: if the result is close to a limit, bring the sample to 20 °C and read again.')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Sample temperature (°C)'), { target: { value: '30' } });
    expect(screen.getByRole('alert').textContent).toBe('The correction table covers 10–25 °C; bring the sample nearer 20 °C');
    fireEvent.change(screen.getByLabelText('Sample temperature (°C)'), { target: { value: '20' } });
    fireEvent.change(screen.getByLabelText('Reading (°Brix)'), { target: { value: '80' } });
    expect(screen.getByRole('alert').textContent).toBe('The correction table covers 10–70 °Brix');
  });
});
