import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { convertLineForSystem, convertSettingsForSystem, convertSettingsForTemperature, friendlyComputeMessage, initialSettingsDraft, lineDraftFromStored, lineQuantityForSave, mapFieldErrors, parseDecimal, setLineText, setLineUnit, settingsFromDraft, sucroseTableSourcesFor, computeEditor, ingredientIndex, newLineDraft } from '@/components/formulas/editor-state';
import { draftFromText, formatSigned, showNumber, temperatureScale } from '@/lib/format/quantities';
import { IDS, LIBRARY } from './fixtures';

describe('typed numbers', () => {
  it('reads decimals with a point or a comma and flags junk', () => {
    expect(parseDecimal('17.64')).toBe(17.64);
    expect(parseDecimal(' 1,5 ')).toBe(1.5);
    expect(parseDecimal('')).toBeNull();
    expect(parseDecimal('12 kg')).toBeNaN();
    expect(parseDecimal('1.2.3')).toBeNaN();
  });

  it('never prints NaN', () => {
    expect(showNumber(Number.NaN, 2)).toBe('—');
    expect(showNumber(undefined, 2)).toBe('—');
    expect(formatSigned(-0.004, 2)).toBe('0.00');
    expect(formatSigned(-2.342, 1)).toBe('−2.3');
  });
});

describe('unit toggles keep full precision', () => {
  it('converts 500 g to 17.64 oz and back to exactly 500 g', () => {
    // Source: international avoirdupois ounce = 28.349523125 g (International Yard and Pound Agreement, 1959).
    const metric = lineDraftFromStored('a', { ingredientId: IDS.fruit, quantity: 500, unit: 'g' }, 'metric');
    const imperial = convertLineForSystem(metric, 'imperial');
    expect(imperial).toMatchObject({ unit: 'oz', text: '17.64', base: 500 });
    expect(lineQuantityForSave(imperial)).toBeCloseTo(500 / 28.349523125, 12);
    expect(convertLineForSystem(imperial, 'metric')).toEqual(metric);
  });

  it('does not drift over any number of round trips (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 1e6, noNaN: true }), fc.integer({ min: 1, max: 20 }), (grams, trips) => {
        let line = setLineText(newLineDraft('k', 'metric'), String(grams));
        const start = line;
        for (let i = 0; i < trips; i += 1) line = convertLineForSystem(convertLineForSystem(line, 'imperial'), 'metric');
        return line.base === start.base && line.unit === 'g';
      }),
    );
  });

  it('converts kg ↔ lb, keeps % of fruit, and reinterprets the number when the unit is changed', () => {
    const kg = setLineUnit(setLineText(newLineDraft('k', 'metric'), '10'), 'kg');
    expect(kg.base).toBe(10000);
    // Source: 1 lb = 453.59237 g exactly (International Yard and Pound Agreement, 1959): 10 kg = 22.046 lb.
    expect(convertLineForSystem(kg, 'imperial')).toMatchObject({ unit: 'lb', text: '22.046' });
    const pct = setLineUnit(setLineText(newLineDraft('p', 'metric'), '0.6'), 'pct_fruit');
    expect(convertLineForSystem(pct, 'imperial')).toBe(pct);
  });

  it('converts jar fill, altitude and boiling point with their toggles', () => {
    const draft = initialSettingsDraft({ settings: { jarNetFillG: 340, altitudeM: 304.8, measuredWaterBoilingC: 96.7 }, system: 'metric', temperatureUnit: 'C', today: '2026-03-01' });
    const imperial = convertSettingsForTemperature(convertSettingsForSystem(draft, 'imperial'), 'F');
    // Source: 1 ft = 0.3048 m exactly (International Yard and Pound Agreement, 1959).
    expect(imperial.altitude.text).toBe('1000');
    // 96.7 °C × 9/5 + 32 = 206.06 °F (definition of the Fahrenheit scale).
    expect(imperial.measuredBoiling.text).toBe('206.06');
    const back = convertSettingsForTemperature(convertSettingsForSystem(imperial, 'metric'), 'C');
    expect(settingsFromDraft(back)).toEqual(settingsFromDraft(draft));
    expect(draftFromText('212', temperatureScale('F')).base).toBeCloseTo(100, 12);
  });

  it('sends only the chosen boiling reference', () => {
    const draft = initialSettingsDraft({ settings: { altitudeM: 300, measuredWaterBoilingC: 99 }, system: 'metric', temperatureUnit: 'C' });
    expect(settingsFromDraft(draft)).toMatchObject({ altitudeM: 300, measuredWaterBoilingC: null });
    expect(settingsFromDraft({ ...draft, boilingReference: 'measured' })).toMatchObject({ altitudeM: null, measuredWaterBoilingC: 99 });
  });
});

describe('field errors', () => {
  it('maps zod paths to inputs and lines, stripping change. and data.', () => {
    const mapped = mapFieldErrors(
      {
        'change.name': ['Give the formula a name.'],
        'data.settings.plannedPh': ['pH must be at most 8.'],
        'change.lines.1.quantity': ['Quantity must be more than 0.'],
        'lines.0.ingredientId': ['Choose an ingredient from the library.'],
        'change.baseRevision': ['Expected a number.'],
      },
      ['a', 'b'],
    );
    expect(mapped.fields).toEqual({ name: ['Give the formula a name.'], 'settings.plannedPh': ['pH must be at most 8.'] });
    expect(mapped.lines).toEqual({ b: { quantity: ['Quantity must be more than 0.'] }, a: { ingredientId: ['Choose an ingredient from the library.'] } });
    expect(mapped.unplaced).toEqual(['Expected a number.']);
  });
});

describe('live computation', () => {
  it('names lines in the editor’s own numbering in chemistry messages', () => {
    expect(friendlyComputeMessage('lines[1].unit', 'lines[1].unit: fruit cannot be given as a percentage of fruit', ['Line 1 (Sugar)', 'Line 3 (Plum)'])).toBe(
      'Line 3 (Plum): fruit cannot be given as a percentage of fruit',
    );
    expect(friendlyComputeMessage('settings.targetSolidsPct', 'settings.targetSolidsPct: must be a finite number', [])).toBe('Target final soluble solids: must be a finite number');
  });

  it('leaves incomplete lines out and reports them', () => {
    const settings = initialSettingsDraft({ settings: { targetSolidsPct: 68 }, system: 'metric', temperatureUnit: 'C', today: '2026-01-15' });
    const lines = [
      setLineText(newLineDraft('a', 'metric', IDS.fruit), '10000'),
      setLineText(newLineDraft('b', 'metric', IDS.sugar), '10000'),
      newLineDraft('c', 'metric', IDS.pectin),
    ];
    const result = computeEditor(settings, lines, ingredientIndex(LIBRARY));
    expect(result.skippedLineKeys).toEqual(['c']);
    expect(result.lineKeys).toEqual(['a', 'b']);
    expect(result.outcome?.ok).toBe(true);
    // Mass balance (Practical Action technical brief "Jams, jellies and marmalade"): finished mass = solids ÷ target fraction = (1000 + 10000) g / 0.68.
    if (result.outcome?.ok) expect(result.outcome.computation.massBalance.finishedMassG).toBeCloseTo(11000 / 0.68, 6);
  });

  it('cites the published sucrose rows used for 65 % solids', () => {
    // Source: Cruess & McNair, quoted in Lowe, Experimental Cookery: 65 % sucrose boils at 103.9 °C at sea level.
    expect(sucroseTableSourcesFor(65)).toEqual(['65 %: Cruess & McNair, quoted in Lowe, Experimental Cookery']);
    expect(sucroseTableSourcesFor(68)).toHaveLength(2);
  });
});
