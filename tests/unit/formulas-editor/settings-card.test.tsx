// @vitest-environment jsdom
/**
 * The settings card's numeric fields, driven from one table: each keeps its label (with the user's
 * unit), id, name, hint, the change it reports (the draft in storage units and the error key it
 * clears) and its errors.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { SettingsCard } from '@/components/formulas/editor/SettingsCard';
import { initialSettingsDraft, type SettingsDraft } from '@/components/formulas/editor-state';
import { BASE_SETTINGS } from './fixtures';

afterEach(cleanup);

function renderCard(options: { system?: 'metric' | 'imperial'; temperatureUnit?: 'C' | 'F'; draft?: Partial<SettingsDraft>; errors?: Record<string, string[]> } = {}) {
  const system = options.system ?? 'metric';
  const temperatureUnit = options.temperatureUnit ?? 'C';
  const settings = { ...initialSettingsDraft({ settings: BASE_SETTINGS, system, temperatureUnit }), ...options.draft };
  const onChange = vi.fn();
  render(<SettingsCard settings={settings} system={system} temperatureUnit={temperatureUnit} errors={options.errors ?? {}} onChange={onChange} />);
  return onChange;
}

const input = (label: string) => screen.getByLabelText(label) as HTMLInputElement;
function describedText(element: HTMLElement): string {
  const ids = (element.getAttribute('aria-describedby') ?? '').split(' ').filter(Boolean);
  return ids.map((id) => document.getElementById(id)?.textContent ?? '').join(' ');
}

describe('SettingsCard numeric settings', () => {
  it('labels each field with its unit and keeps its id and name (metric, °C, boiling point from the altitude)', () => {
    renderCard();
    const expected = [
      ['Target final soluble solids (%)', 'setting-targetSolidsPct', 'settings.targetSolidsPct', '68'],
      ['Jar net fill (g)', 'setting-jarNetFill', 'settings.jarNetFillG', '340'],
      ['Planned pH (optional)', 'setting-plannedPh', 'settings.plannedPh', ''],
      ['Sucrose inverted in the boil (%)', 'setting-sucroseInversion', 'settings.sucroseInversionPct', ''],
      ['Kitchen altitude (m)', 'setting-altitude', 'settings.altitudeM', ''],
    ];
    for (const [label, id, name, value] of expected) {
      const field = input(label);
      expect([field.id, field.name, field.value, field.inputMode]).toEqual([id, name, value, 'decimal']);
    }
    expect(describedText(input('Kitchen altitude (m)'))).toBe('Leave empty for sea level.');
    expect(screen.queryByLabelText(/Measured water boiling point/)).toBeNull();
    expect(describedText(input('Sucrose inverted in the boil (%)'))).toMatch(/^Optional, for the water-activity estimate: .*Leave empty to assume none; the estimate then errs high, on the safe side\.$/);
    // The grid keeps its order: the four numbers after the rule date, before the preservation choice.
    const order = [...document.querySelectorAll('input, select')].map((e) => e.id);
    expect(order.slice(0, 8)).toEqual(['setting-productClass', 'setting-ruleSet', 'setting-ruleDate', 'setting-targetSolidsPct', 'setting-jarNetFill', 'setting-plannedPh', 'setting-sucroseInversion', 'setting-preservation']);
  });

  it('shows the measured boiling point instead of the altitude, in the user’s units (imperial, °F)', () => {
    renderCard({ system: 'imperial', temperatureUnit: 'F', draft: { boilingReference: 'measured' } });
    expect(input('Jar net fill (oz)').value).toBe('11.99');
    const boiling = input('Measured water boiling point (°F)');
    expect([boiling.id, boiling.name]).toEqual(['setting-measuredBoiling', 'settings.measuredWaterBoilingC']);
    expect(describedText(boiling)).toContain('Boil plain water in your pan');
    expect(screen.queryByLabelText(/Kitchen altitude/)).toBeNull();
  });

  it('reports each change as a draft in storage units with the error key it clears', () => {
    const onChange = renderCard({ system: 'imperial', temperatureUnit: 'F', draft: { boilingReference: 'measured' } });
    fireEvent.change(input('Target final soluble solids (%)'), { target: { value: '65,5' } });
    expect(onChange).toHaveBeenLastCalledWith({ targetSolids: { text: '65,5', base: 65.5 } }, 'settings.targetSolidsPct');
    fireEvent.change(input('Jar net fill (oz)'), { target: { value: '16' } });
    // Source: 1 oz (avoirdupois) = 28.349523125 g exactly, NIST SP 811 (2008) B.8; 16 oz = 1 lb = 453.59237 g.
    expect(onChange.mock.lastCall?.[0].jarFill.base).toBeCloseTo(453.59237, 6);
    expect(onChange.mock.lastCall?.[1]).toBe('settings.jarNetFillG');
    fireEvent.change(input('Measured water boiling point (°F)'), { target: { value: '212' } });
    // Source: t/°C = (t/°F − 32)/1.8, NIST SP 811 (2008) B.8, so 212 °F is 100 °C.
    expect(onChange.mock.lastCall?.[0].measuredBoiling.base).toBeCloseTo(100, 9);
    expect(onChange.mock.lastCall?.[1]).toBe('settings.measuredWaterBoilingC');
    fireEvent.change(input('Planned pH (optional)'), { target: { value: '3.4' } });
    expect(onChange).toHaveBeenLastCalledWith({ plannedPh: { text: '3.4', base: 3.4 } }, 'settings.plannedPh');
    fireEvent.change(input('Sucrose inverted in the boil (%)'), { target: { value: '25,5' } });
    expect(onChange).toHaveBeenLastCalledWith({ sucroseInversion: { text: '25,5', base: 25.5 } }, 'settings.sucroseInversionPct');
    fireEvent.change(input('Jar net fill (oz)'), { target: { value: '' } });
    expect(onChange).toHaveBeenLastCalledWith({ jarFill: { text: '', base: null } }, 'settings.jarNetFillG');
  });

  it('says "Enter a number." for typed text that is not one, beside the schema’s or the server’s errors', () => {
    renderCard({
      draft: { plannedPh: { text: 'four', base: Number.NaN }, altitude: { text: '-50000', base: -50000 } },
      errors: { 'settings.plannedPh': ['pH must be between 0 and 14.'], 'settings.altitudeM': ['Altitude must be above −500 m.'] },
    });
    const ph = input('Planned pH (optional)');
    expect(ph.getAttribute('aria-invalid')).toBe('true');
    expect(describedText(ph)).toBe('Enter a number. pH must be between 0 and 14.');
    // An error takes the hint's place.
    expect(describedText(input('Kitchen altitude (m)'))).toBe('Altitude must be above −500 m.');
    expect(input('Jar net fill (g)').getAttribute('aria-invalid')).toBeNull();
  });
});
