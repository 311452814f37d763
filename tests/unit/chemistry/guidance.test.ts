import { describe, it, expect } from 'vitest';
import { HOT_FILL_MIN_C, SAFETY_GOVERNANCE_SENTENCE, TRADE_PRACTICE_SOURCE, buildGuidance, computeBatch, computeMassBalance, defaultQcSpec, qcSpecCautions } from '@/lib/chemistry';
import type { FormulaLineInput, FormulaSettings, IngredientComposition } from '@/lib/chemistry';
import { PRACTICAL_ACTION_LINES, SUGAR, fruit, settings } from './fixtures';

const LM_PECTIN: IngredientComposition = { kind: 'pectin', name: 'LM amidated pectin', solidsPct: 100, pectinType: 'lm_amidated' };
const CALCIUM: IngredientComposition = { kind: 'other', name: 'Calcium citrate', solidsPct: 100, calciumSource: true };

function guidanceFor(lines: FormulaLineInput[], s: FormulaSettings, aw?: number) {
  return buildGuidance({ massBalance: computeMassBalance(lines, s), settings: s, aw });
}

function codes(lines: FormulaLineInput[], s: FormulaSettings, aw?: number): string[] {
  return guidanceFor(lines, s, aw).map((c) => c.code);
}

const SAFETY_CODES = ['PH_ABOVE_4_6', 'REDUCED_SUGAR', 'HOT_FILL'];

describe('set guidance', () => {
  it('flags HM pectin at or below 55 % solids', () => {
    // Source: HM pectin gels at soluble solids > 55 % and pH < 3.5 (McGee, On Food and Cooking, 2004)
    expect(codes(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 55 }))).toContain('HM_PECTIN_SOLIDS_TOO_LOW');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 56 }))).not.toContain('HM_PECTIN_SOLIDS_TOO_LOW');
  });

  it('flags HM pectin at pH 3.5 or above', () => {
    // Source: HM pectin gels at pH < 3.5 (McGee, On Food and Cooking, 2004)
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.5 }))).toContain('HM_PECTIN_PH_TOO_HIGH');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.2 }))).not.toContain('HM_PECTIN_PH_TOO_HIGH');
  });

  it('marks the HM optimum as common practice', () => {
    // Common practice, no published source: optimum pH 2.8–3.3 and 65–69 % final sugar
    const caution = guidanceFor(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 62, plannedPh: 3.1 })).find((c) => c.code === 'HM_PECTIN_OUTSIDE_OPTIMUM');
    // On screen a rule of thumb is named as trade practice; the provenance note stays in the code.
    expect(caution?.source).toBe(TRADE_PRACTICE_SOURCE);
    expect(codes(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 67, plannedPh: 3.1 }))).not.toContain('HM_PECTIN_OUTSIDE_OPTIMUM');
  });

  it('flags LM pectin without a calcium source', () => {
    // Source: low-methoxyl pectin gels with calcium (10–80 % solids, pH 2.5–6.5)
    const base: FormulaLineInput[] = [
      { ingredient: fruit(10), quantity: 1000, unit: 'g' },
      { ingredient: SUGAR, quantity: 300, unit: 'g' },
      { ingredient: LM_PECTIN, quantity: 10, unit: 'g' },
    ];
    expect(codes(base, settings({ targetSolidsPct: 45 }))).toContain('LM_PECTIN_NO_CALCIUM');
    expect(codes([...base, { ingredient: CALCIUM, quantity: 1, unit: 'g' }], settings({ targetSolidsPct: 45 }))).not.toContain('LM_PECTIN_NO_CALCIUM');
  });

  it('flags a pH outside 2.8–3.5', () => {
    // Source: McGee, On Food and Cooking (2004): HM pectin gels at pH 2.8–3.5
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 2.6 }))).toContain('PH_OUTSIDE_SET_RANGE');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.0 }))).not.toContain('PH_OUTSIDE_SET_RANGE');
    // With no added pectin the fruit's own (mostly high-methoxyl) pectin sets, in the same window.
    const fruitAndSugar: FormulaLineInput[] = [{ ingredient: fruit(10), quantity: 1000, unit: 'g' }, { ingredient: SUGAR, quantity: 1000, unit: 'g' }];
    expect(codes(fruitAndSugar, settings({ plannedPh: 3.6 }))).toContain('PH_OUTSIDE_SET_RANGE');
  });

  it('gives one caution per cause: an HM pectin above pH 3.5 is not warned twice', () => {
    // Source: McGee, On Food and Cooking (2004): HM pectin gels at pH < 3.5
    const found = codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.6 }));
    expect(found).toContain('HM_PECTIN_PH_TOO_HIGH');
    expect(found).not.toContain('PH_OUTSIDE_SET_RANGE');
  });

  it('holds a low-methoxyl pectin with calcium to its own window, pH 2.5 up, not the HM one', () => {
    // Source: low-methoxyl pectin gels with calcium (10–80 % solids, pH 2.5–6.5); from memory, no published source to hand
    const lm: FormulaLineInput[] = [
      { ingredient: fruit(10), quantity: 1000, unit: 'g' },
      { ingredient: SUGAR, quantity: 500, unit: 'g' },
      { ingredient: LM_PECTIN, quantity: 12, unit: 'g' },
      { ingredient: CALCIUM, quantity: 1, unit: 'g' },
    ];
    expect(codes(lm, settings({ targetSolidsPct: 45, plannedPh: 3.7 }))).not.toContain('PH_OUTSIDE_SET_RANGE');
    expect(codes(lm, settings({ targetSolidsPct: 45, plannedPh: 4.4 }))).not.toContain('PH_OUTSIDE_SET_RANGE');
    const low = guidanceFor(lm, settings({ targetSolidsPct: 45, plannedPh: 2.4 })).find((c) => c.code === 'PH_OUTSIDE_SET_RANGE');
    expect(low?.title).toBe('pH below the setting range');
    expect(low?.message).toContain('below 2.5');
  });
});

describe('safety cautions', () => {
  it('gives a danger caution at pH 4.7', () => {
    // Source: 21 CFR 114.3 — acid foods have an equilibrium pH of 4.6 or below
    const caution = guidanceFor(PRACTICAL_ACTION_LINES, settings({ plannedPh: 4.7 })).find((c) => c.code === 'PH_ABOVE_4_6');
    expect(caution?.severity).toBe('danger');
    expect(caution?.source).toContain('21 CFR 114.3');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 4.6 }))).not.toContain('PH_ABOVE_4_6');
  });

  it('explains acid preservation (a note) when aw is above 0.85 and pH is 4.6 or below', () => {
    // Source: 21 CFR 114.3 — acid foods: equilibrium pH 4.6 or below; low-acid foods: pH > 4.6 and aw > 0.85
    const at32 = guidanceFor(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.2 }), 0.86);
    expect(at32.find((c) => c.code === 'ACID_PRESERVED')?.severity).toBe('info');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 4.6 }), 0.86)).toContain('ACID_PRESERVED');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.2 }), 0.84)).not.toContain('ACID_PRESERVED');
  });

  it('cautions on reduced-sugar spreads: danger without a stated preservation, a warning with one', () => {
    // Source: EU Directive 2001/113/EC, Annex I and CXS 296-2009 (60 % soluble solids floor for the reserved names)
    const severity = (s: FormulaSettings) => guidanceFor(PRACTICAL_ACTION_LINES, s).find((c) => c.code === 'REDUCED_SUGAR')?.severity;
    expect(severity(settings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 60 }))).toBe('danger');
    expect(severity(settings({ targetSolidsPct: 50 }))).toBe('danger');
    expect(severity(settings({ targetSolidsPct: 50, preservation: 'heat_processed' }))).toBe('warning');
    expect(severity(settings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 45, preservation: 'chilled' }))).toBe('warning');
    // 60 % is the floor itself, not below it.
    expect(severity(settings({ targetSolidsPct: 60 }))).toBeUndefined();
    expect(codes(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 65 }))).not.toContain('REDUCED_SUGAR');
  });

  it('always notes hot filling, with the hot-fill minimum the QC checks use', () => {
    // Common practice, no published source: fill at 85 °C or above (HOT_FILL_MIN_C, shared with lib/chemistry/qc.ts).
    const hot = guidanceFor(PRACTICAL_ACTION_LINES, settings()).find((c) => c.code === 'HOT_FILL');
    expect(hot?.severity).toBe('info');
    expect(hot?.message).toContain(`${HOT_FILL_MIN_C} °C`);
  });

  it('ends every safety caution with the governance sentence', () => {
    const all = [
      ...guidanceFor(PRACTICAL_ACTION_LINES, settings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 45, plannedPh: 4.7 }), 0.93),
      ...guidanceFor(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.2 }), 0.93),
      ...guidanceFor(PRACTICAL_ACTION_LINES, settings(), 0.93),
    ];
    const safetyCodes = [...SAFETY_CODES, 'ACID_PRESERVED', 'PH_NOT_GIVEN'];
    const safetyCautions = all.filter((c) => safetyCodes.includes(c.code));
    expect([...new Set(safetyCautions.map((c) => c.code))].sort()).toEqual([...safetyCodes].sort());
    for (const caution of safetyCautions) {
      expect(caution.message.endsWith(SAFETY_GOVERNANCE_SENTENCE)).toBe(true);
    }
  });
});

describe('cautions graded by what is known (no alarm fatigue)', () => {
  // The textbook jam: the Practical Action worked batch (10 kg fruit at 10 % solids, 10 kg sugar) at 65 % solids.
  const jam = (overrides: Partial<FormulaSettings> = {}) => computeBatch(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 65, ...overrides }));
  const severities = (c: ReturnType<typeof jam>) => c.cautions.map((x) => `${x.code}:${x.severity}`);

  it('a 65 °Brix jam with no planned pH is asked for one: a note, no danger, no warning', () => {
    const c = jam();
    // Its estimated water activity is above 0.85 (Norrish model, lib/chemistry/water-activity.ts).
    expect(c.waterActivity.aw).toBeGreaterThan(0.85);
    expect(c.cautions.filter((x) => x.severity !== 'info')).toEqual([]);
    const ask = c.cautions.find((x) => x.code === 'PH_NOT_GIVEN');
    expect(ask?.severity).toBe('info');
    expect(ask?.message).toContain(c.waterActivity.aw.toFixed(3));
  });

  it('the same jam at pH 3.2 gets the acid-preservation note and nothing louder', () => {
    // Source: 21 CFR 114.3 — an acid food has an equilibrium pH of 4.6 or below.
    const c = jam({ plannedPh: 3.2 });
    expect(c.cautions.filter((x) => x.severity !== 'info').map((x) => x.code)).toEqual([]);
    expect(severities(c)).toContain('ACID_PRESERVED:info');
    expect(severities(c)).not.toContain('PH_NOT_GIVEN:info');
  });

  it('is a danger exactly above pH 4.6, at the 21 CFR 114 boundary', () => {
    // Source: 21 CFR 114.3(b) — acid foods have a natural pH of 4.6 or below; 4.6 itself is acid, 4.61 is not.
    expect(severities(jam({ plannedPh: 4.6 }))).not.toContain('PH_ABOVE_4_6:danger');
    expect(severities(jam({ plannedPh: 4.61 }))).toContain('PH_ABOVE_4_6:danger');
    expect(jam({ plannedPh: 4.61 }).cautions.filter((x) => x.severity === 'danger')).toHaveLength(1);
  });

  it('a QC spec whose fill minimum is below the hot-fill minimum is a danger; at the minimum it is not', () => {
    // Common practice, no published source: hot fill at 85 °C or above (HOT_FILL_MIN_C in lib/chemistry/qc.ts).
    const spec = defaultQcSpec(jam({ plannedPh: 3.2 }));
    expect(qcSpecCautions({ ...spec, minFillTempC: HOT_FILL_MIN_C }, 'jam').map((x) => x.code)).not.toContain('SPEC_FILL_BELOW_HOT_FILL');
    expect(qcSpecCautions({ ...spec, minFillTempC: HOT_FILL_MIN_C - 1 }, 'jam').find((x) => x.code === 'SPEC_FILL_BELOW_HOT_FILL')?.severity).toBe('danger');
  });

  it('a reduced-sugar spec is a danger without a stated preservation and a warning with one', () => {
    // Source: Council Directive 2001/113/EC, Annex I and CXS 296-2009 (60 % soluble solids floor).
    const spec = { ...defaultQcSpec(jam({ plannedPh: 3.2 })), solidsMinBrix: 44, solidsMaxBrix: 46 };
    expect(qcSpecCautions(spec, 'reduced_sugar_spread').find((x) => x.code === 'SPEC_REDUCED_SUGAR_STORAGE')?.severity).toBe('danger');
    expect(qcSpecCautions(spec, 'reduced_sugar_spread', 'heat_processed').find((x) => x.code === 'SPEC_REDUCED_SUGAR_STORAGE')?.severity).toBe('warning');
  });
});
