import { describe, it, expect } from 'vitest';
import { SAFETY_GOVERNANCE_SENTENCE, buildGuidance, computeMassBalance } from '@/lib/chemistry';
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

const SAFETY_CODES = ['PH_ABOVE_4_6', 'AW_ABOVE_0_85', 'REDUCED_SUGAR', 'HOT_FILL'];

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
    expect(caution?.source).toBe('Common practice, no published source');
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

  it('cautions when aw is above 0.85', () => {
    // Source: 21 CFR 114.3 — low-acid foods: pH > 4.6 and aw > 0.85
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.2 }), 0.86)).toContain('AW_ABOVE_0_85');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ plannedPh: 3.2 }), 0.84)).not.toContain('AW_ABOVE_0_85');
  });

  it('cautions on reduced-sugar spreads', () => {
    // Source: EU Directive 2001/113/EC, Annex I and CXS 296-2009 (60 % soluble solids floor for the reserved names)
    expect(codes(PRACTICAL_ACTION_LINES, settings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 60 }))).toContain('REDUCED_SUGAR');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 50 }))).toContain('REDUCED_SUGAR');
    expect(codes(PRACTICAL_ACTION_LINES, settings({ targetSolidsPct: 65 }))).not.toContain('REDUCED_SUGAR');
  });

  it('always notes hot filling', () => {
    expect(codes(PRACTICAL_ACTION_LINES, settings())).toContain('HOT_FILL');
  });

  it('ends every safety caution with the governance sentence', () => {
    const all = guidanceFor(PRACTICAL_ACTION_LINES, settings({ productClass: 'reduced_sugar_spread', targetSolidsPct: 45, plannedPh: 4.7 }), 0.93);
    const safetyCautions = all.filter((c) => SAFETY_CODES.includes(c.code));
    expect(safetyCautions.map((c) => c.code).sort()).toEqual([...SAFETY_CODES].sort());
    for (const caution of safetyCautions) {
      expect(caution.message.endsWith(SAFETY_GOVERNANCE_SENTENCE)).toBe(true);
    }
  });
});
