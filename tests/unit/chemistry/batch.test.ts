import { describe, it, expect } from 'vitest';
import { ChemistryInputError, TYPICAL_INGREDIENTS, US_FRUIT_GROUPS, computeBatch } from '@/lib/chemistry';
import type { FormulaLineInput } from '@/lib/chemistry';
import { PRACTICAL_ACTION_LINES, settings } from './fixtures';

describe('computeBatch', () => {
  const result = computeBatch(PRACTICAL_ACTION_LINES, settings({ altitudeM: 1000, plannedPh: 3.1 }));

  it('runs the whole chain on the Practical Action batch', () => {
    // Source: Practical Action technical brief "Jams, jellies and marmalade" (11.115 kg solids → 16.35 kg at 68 %)
    expect(result.massBalance.finishedMassG / 1000).toBeCloseTo(16.35, 2);
    // Source: International Standard Atmosphere with the Antoine equation for water: 96.7 °C at 1000 m
    expect(result.endPoint.waterBoilingC).toBeCloseTo(96.7, 1);
    expect(result.endPoint.waterBoilingBasis).toBe('altitude');
    expect(result.waterActivity.isEstimate).toBe(true);
    // Source: Beuchat (1981): jams and jellies at aw 0.80–0.87
    expect(result.waterActivity.aw).toBeGreaterThan(0.8);
    expect(result.waterActivity.aw).toBeLessThan(0.87);
    expect(result.compliance.overall).toBe('compliant');
    expect(result.cautions.some((c) => c.code === 'HOT_FILL')).toBe(true);
  });

  it('is plain JSON', () => {
    const roundTrip = JSON.parse(JSON.stringify(result));
    expect(roundTrip).toEqual(result);
    const numbers: number[] = [];
    JSON.stringify(result, (_key, value) => {
      if (typeof value === 'number') numbers.push(value);
      return value;
    });
    expect(numbers.length).toBeGreaterThan(20);
    expect(numbers.every((n) => Number.isFinite(n))).toBe(true);
  });

  it('gives lower aw for the same solids with invert sugar than with sucrose', () => {
    // Source: Ross's rule over Norrish binaries; monosaccharides depress aw more per gram than sucrose
    const invert = TYPICAL_INGREDIENTS.find((i) => i.key === 'invert_syrup');
    if (!invert) throw new Error('invert syrup missing from the starter library');
    const lines: FormulaLineInput[] = PRACTICAL_ACTION_LINES.map((line, i) =>
      i === 1 ? { ingredient: invert, quantity: 10 / 0.75, unit: 'kg' } : line);
    expect(computeBatch(lines, settings()).waterActivity.aw).toBeLessThan(computeBatch(PRACTICAL_ACTION_LINES, settings()).waterActivity.aw);
  });

  it('throws ChemistryInputError with the field for bad input', () => {
    expect(() => computeBatch(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 0 }))).toThrow(ChemistryInputError);
    try {
      computeBatch(PRACTICAL_ACTION_LINES, settings({ altitudeM: Number.NaN }));
      throw new Error('expected a ChemistryInputError');
    } catch (error) {
      expect(error).toBeInstanceOf(ChemistryInputError);
      expect((error as ChemistryInputError).field).toBe('settings.altitudeM');
    }
  });
});

describe('starter ingredient library', () => {
  it('holds about twenty generic ingredients, each with a source', () => {
    expect(TYPICAL_INGREDIENTS.length).toBeGreaterThanOrEqual(20);
    expect(new Set(TYPICAL_INGREDIENTS.map((i) => i.key)).size).toBe(TYPICAL_INGREDIENTS.length);
    for (const ingredient of TYPICAL_INGREDIENTS) {
      expect(ingredient.source.length).toBeGreaterThan(10);
      expect(ingredient.solidsPct).toBeGreaterThanOrEqual(0);
      expect(ingredient.solidsPct).toBeLessThanOrEqual(100);
    }
  });

  it('puts the EU exception fruits in the reduced-minimum group', () => {
    // Source: EU Directive 2001/113/EC, Annex I (redcurrants, blackcurrants and quinces among the 250 g jam fruits)
    for (const key of ['redcurrant', 'blackcurrant', 'quince']) {
      expect(TYPICAL_INGREDIENTS.find((i) => i.key === key)?.euFruitGroup).toBe('reduced_minimum_fruits');
    }
  });

  it('follows the NCHFP pectin lists', () => {
    // Source: National Center for Home Food Preservation — high: tart apples, currants, quinces; low: apricots, raspberries, strawberries
    const level = (key: string) => TYPICAL_INGREDIENTS.find((i) => i.key === key)?.pectinLevel;
    expect(['apple_tart', 'redcurrant', 'blackcurrant', 'quince'].map(level)).toEqual(['high', 'high', 'high', 'high']);
    expect(['apricot', 'raspberry', 'strawberry'].map(level)).toEqual(['low', 'low', 'low']);
  });
});

describe('starter library US fruit groups', () => {
  // Source: 21 CFR 150.160(b)(1) Group I and Group II fruit lists
  it('matches the regulation lists', () => {
    const group = (key: string) => TYPICAL_INGREDIENTS.find((i) => i.key === key)?.usFruitGroup;
    expect(US_FRUIT_GROUPS['1']).toContain('Strawberry');
    expect(['strawberry', 'raspberry', 'blackberry'].map(group)).toEqual(['1', '1', '1']);
    expect(US_FRUIT_GROUPS['2']).toContain('Quince');
    expect(['apricot', 'quince', 'plum', 'redcurrant'].map(group)).toEqual(['2', '2', '2', '2']);
    // Apple and blackcurrant are in neither list.
    expect([...US_FRUIT_GROUPS['1'], ...US_FRUIT_GROUPS['2']].some((name) => /^apple/i.test(name))).toBe(false);
    expect(group('apple_tart')).toBeUndefined();
    expect(group('blackcurrant')).toBeUndefined();
  });
});
