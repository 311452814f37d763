import { describe, it, expect } from 'vitest';
import { buildBatchSheet, sheetAmountProblem, sheetStepProblem, SHEET_MAX_CHARGE_G, type SheetSource } from '@/lib/production/sheet';
import { batchSheetQuerySchema } from '@/lib/production/schema';
import { GRAMS_PER_POUND, defaultQcSpec, computeBatch } from '@/lib/chemistry';
import { toChemistrySettings } from '@/lib/formulas/compute';
import type { RevisionLine } from '@/lib/formulas/schema';
import { PRACTICAL_ACTION_LINES, settings } from '../chemistry/fixtures';

// The Practical Action technical brief's worked batch (10 kg fruit, 10 kg sugar, 60 g pectin, 55 g citric acid), stored as a revision stores it.
const lines: RevisionLine[] = PRACTICAL_ACTION_LINES.map((l, i) => ({ ingredientId: `00000000-0000-4000-8000-00000000000${i}`, ingredient: l.ingredient, quantity: l.quantity * 1000, unit: 'g' }));
const formulaSettings = { ...settings(), ruleDate: '2026-01-15' };
const spec = defaultQcSpec(computeBatch(lines, toChemistrySettings(formulaSettings)));
const source: SheetSource = {
  productName: 'Worked example jam', productCode: 'WEJ', version: 3, settings: formulaSettings, lines, spec,
  process: { endPointSeaLevelC: 104.5, fillTempC: 88, cookNotes: '' },
};
const query = (q: Record<string, string>) => batchSheetQuerySchema.parse(q);

describe('the batch sheet', () => {
  it('without an amount it is the formula at its developed size', () => {
    const sheet = buildBatchSheet(source, query({ step: '1' }));
    expect(sheet.scaled.scaleFactor).toBeCloseTo(1, 12);
    // Source: Practical Action brief — 20.115 kg charge.
    expect(sheet.scaled.exact.totalChargeG).toBeCloseTo(20115, 6);
  });

  it('scales to a kettle in pounds and rounds to a 0.05 lb scale', () => {
    const sheet = buildBatchSheet(source, query({ target: 'total_charge', amount: '100', unit: 'lb', step: '0.05', stepUnit: 'lb' }));
    expect(sheet.scaled.exact.totalChargeG).toBeCloseTo(100 * GRAMS_PER_POUND, 6);
    for (const l of sheet.scaled.lines) {
      const steps = l.roundedInResolutionUnit / l.stepInResolutionUnit;
      expect(Math.abs(steps - Math.round(steps))).toBeLessThan(1e-6);
      expect(Math.abs(l.roundingErrorG)).toBeLessThanOrEqual(l.stepG / 2 + 1e-9);
    }
    // Fruit and sugar (49.7 lb) on the 0.05 lb step; the pectin (0.30 lb) and acid (0.27 lb) on 0.01 lb,
    // where half a step is 1.7 % and 1.8 % of them (half of 0.05 lb would be 8 % and 9 %).
    expect(sheet.scaled.lines.map((l) => Number(l.stepInResolutionUnit.toFixed(6)))).toEqual([0.05, 0.05, 0.01, 0.01]);
    // Rounding the sugar and fruit to 0.05 lb moves the solids by less than 0.1 point at this size.
    expect(Math.abs(sheet.scaled.effectOfRounding.solidsPctDeltaIfPlannedEvaporation)).toBeLessThan(0.1);
  });

  it('scales to a jar count so that at least that many jars fill', () => {
    const sheet = buildBatchSheet(source, query({ target: 'jar_count', amount: '240', step: '5', stepUnit: 'g' }));
    expect(sheet.scaled.exact.finishedMassG).toBeCloseTo(240 * 340, 6);
    expect(sheet.scaled.exact.jarsFilled).toBe(240);
    // Rounded to the 5 g scale the batch still fills them (the walk's 200 jars gave "about 199").
    expect(sheet.scaled.rounded.jarsFilled).toBeGreaterThanOrEqual(240);
    expect(buildBatchSheet(source, query({ target: 'jar_count', amount: '200', step: '5', stepUnit: 'g' })).scaled.rounded.jarsFilled).toBeGreaterThanOrEqual(200);
  });

  it('lowers the end point by the drop in the boiling point of water at the kitchen’s altitude', () => {
    // Source: ISA pressure + Antoine constants (piping-designer.com): water boils at about 96.7 °C at 1000 m.
    const sheet = buildBatchSheet(source, query({ altitudeM: '1000' }));
    expect(sheet.endPoint.waterBoilingC).toBeCloseTo(96.7, 1);
    expect(sheet.endPoint.kitchenC).toBeCloseTo(104.5 - (100 - 96.7), 1);
    expect(buildBatchSheet(source, query({})).endPoint.kitchenC).toBeCloseTo(104.5, 1);
  });

  it('puts the QC targets and the kitchen end point into the method, and carries the spec cautions', () => {
    const sheet = buildBatchSheet(source, query({ altitudeM: '1000' }));
    const method = sheet.steps.join(' ');
    expect(method).toContain(`Boil to ${sheet.endPoint.kitchenC.toFixed(1)} °C`);
    expect(method).toContain(`${spec.solidsMinBrix.toFixed(1)}–${spec.solidsMaxBrix.toFixed(1)} °Brix`);
    expect(method).toMatch(/Dry-blend the HM pectin/);
    expect(sheet.cautions.map((c) => c.code)).toContain('SPEC_PH_LIMIT');
  });

  it('refuses a nonsense query before anything is computed', () => {
    expect(batchSheetQuerySchema.safeParse({ amount: '0' }).success).toBe(false);
    expect(batchSheetQuerySchema.safeParse({ amount: 'lots' }).success).toBe(false);
    expect(batchSheetQuerySchema.safeParse({ step: '-1' }).success).toBe(false);
    expect(batchSheetQuerySchema.safeParse({ altitudeM: '9000' }).success).toBe(false);
    expect(batchSheetQuerySchema.safeParse({ colour: 'red' }).success).toBe(false);
  });
});

describe('the batch sheet amount bounds', () => {
  const jar = formulaSettings.jarNetFillG;
  it('refuses a batch that fills less than one jar, whatever it is scaled by', () => {
    expect(sheetAmountProblem(source, query({ target: 'total_charge', amount: '0.001', unit: 'g' }))).toMatch(/too small to fill one .* jar/);
    expect(sheetAmountProblem(source, query({ target: 'finished_mass', amount: String(jar - 1), unit: 'g' }))).toMatch(/too small/);
    expect(sheetAmountProblem(source, query({ target: 'finished_mass', amount: String(jar), unit: 'g' }))).toBeNull();
  });
  it('refuses a kettle charge above the stated maximum (5 t, common practice, no published source)', () => {
    expect(sheetAmountProblem(source, query({ target: 'total_charge', amount: String(SHEET_MAX_CHARGE_G / 1000 + 1), unit: 'kg' }))).toMatch(/too large/);
    expect(sheetAmountProblem(source, query({ target: 'total_charge', amount: String(SHEET_MAX_CHARGE_G / 1000), unit: 'kg' }))).toBeNull();
    expect(sheetAmountProblem(source, query({ target: 'jar_count', amount: '4000000' }))).toMatch(/too large/);
    expect(sheetAmountProblem(source, query({ target: 'total_charge', amount: '50', unit: 'kg' }))).toBeNull();
    expect(sheetAmountProblem(source, query({}))).toBeNull();
  });
  it('the query schema refuses NaN, Infinity, negatives and huge numbers before the bounds', () => {
    for (const amount of ['NaN', 'Infinity', '-Infinity', '-3', '0', '1e400', '99999999']) {
      expect(batchSheetQuerySchema.safeParse({ amount }).success, amount).toBe(false);
    }
  });
});

describe('the batch sheet scale step', () => {
  // A tenth of the kettle charge at most (common practice, no published source).
  it('refuses a scale step coarser than a tenth of the charge, scaled or at the developed size', () => {
    expect(sheetStepProblem(source, query({ target: 'total_charge', amount: '0.43', unit: 'kg', step: '10000', stepUnit: 'kg' }))).toMatch(/too coarse for a kettle charge of 430 g/);
    expect(sheetStepProblem(source, query({ target: 'total_charge', amount: '10', unit: 'kg', step: '1.01', stepUnit: 'kg' }))).toMatch(/too coarse/);
    expect(sheetStepProblem(source, query({ target: 'total_charge', amount: '10', unit: 'kg', step: '1', stepUnit: 'kg' }))).toBeNull();
    // The Practical Action batch: a 20.115 kg charge.
    expect(sheetStepProblem(source, query({ step: '2.5', stepUnit: 'kg' }))).toMatch(/too coarse/);
    expect(sheetStepProblem(source, query({ step: '5' }))).toBeNull();
  });
});
