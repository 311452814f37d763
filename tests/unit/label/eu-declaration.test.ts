import { describe, it, expect } from 'vitest';
import { finishedNutrients } from '@/lib/label/nutrition';
import { availableCarbohydrate, euDeclaration, euEnergyAmounts, euGramAmount, type EuDeclaration } from '@/lib/label/eu-declaration';
import type { FinishedNutrients, NutrientValues } from '@/lib/label/types';
import { CITRIC_ACID_NOTHING, NO_FIGURES, SR28, apricotJam, strawberryJam } from './fixtures';

// REF = docs/nutrition-check-values.md; GUIDANCE = European Commission, December 2012,
// "Guidance document for competent authorities … setting of tolerances for nutrient values
// declared on a label", section 4 (rounding). The "0"/"<…" limits match secondary summaries of
// its table; the 10 g and 1 g (salt) step limits are from memory (the table was not re-read).

const finished = (values: Partial<NutrientValues>, unknownFrom: FinishedNutrients['unknownFrom'] = {}): FinishedNutrients => ({ ...NO_FIGURES, ...values, unknownFrom });
const rowOf = (d: EuDeclaration, nutrient: string) => {
  const found = d.rows.find((r) => r.nutrient === nutrient);
  if (!found) throw new Error(`no ${nutrient} row`);
  return found;
};

describe('EU declaration: example (a) strawberry jam 1:1', () => {
  const d = euDeclaration(finishedNutrients(strawberryJam()));

  it('computes energy by the Annex XIV factors from available carbohydrate', () => {
    // Source: REF example (a), EU energy: 1155.91625 kJ and 272.189375 kcal per 100 g.
    expect(d.energyKj).toBeCloseTo(1155.91625, 9);
    expect(d.energyKcal).toBeCloseTo(272.189375, 9);
    // Source: GUIDANCE, energy to the nearest 1 kJ / 1 kcal.
    expect(rowOf(d, 'energy').label).toBe('1156 kJ / 272 kcal');
  });

  it('declares carbohydrate as carbohydrate by difference minus fibre', () => {
    // Source: REF example (a): available carbohydrate 1064.78 g per batch ÷ 16; Regulation (EU) 1169/2011 Annex I point 7.
    expect(d.availableCarbohydrateG).toBeCloseTo(1064.78 / 16, 9);
    // Source: GUIDANCE, ≥ 10 g to the nearest 1 g.
    expect(rowOf(d, 'carbohydrate').label).toBe('67 g');
  });

  it('gives salt as sodium × 2.5', () => {
    // Source: REF example (a): salt 0.00625 g; Regulation (EU) 1169/2011 Annex I point 11.
    expect(d.saltG).toBeCloseTo(0.00625, 12);
    // Source: GUIDANCE, salt ≤ 0.0125 g may read "<0.01 g".
    expect(rowOf(d, 'salt').label).toBe('<0.01 g');
  });

  it('lists the rows in Annex XV order with Annex XV names', () => {
    // Source: Regulation (EU) 1169/2011 Annex XV (energy, fat, saturates, carbohydrate, sugars, fibre, protein, salt).
    expect(d.rows.map((r) => r.name)).toEqual(['Energy', 'Fat', 'of which saturates', 'Carbohydrate', 'of which sugars', 'Fibre', 'Protein', 'Salt']);
    expect(d.rows.filter((r) => r.subRow).map((r) => r.nutrient)).toEqual(['saturates', 'sugars']);
  });

  it('rounds each row per the 2012 guidance', () => {
    // Source: REF example (a) per-100 g values, rounded per GUIDANCE.
    expect(rowOf(d, 'fat').label).toBe('<0.5 g'); // 0.189 g
    expect(rowOf(d, 'saturates').label).toBe('<0.1 g'); // 0.0097 g
    expect(rowOf(d, 'sugars').label).toBe('65 g'); // 65.43 g
    expect(rowOf(d, 'fibre').label).toBe('1.3 g'); // 1.30375 g
    expect(rowOf(d, 'protein').label).toBe('<0.5 g'); // 0.42 g
  });

  it('flags the sugars figure as incomplete because pectin has none, and nothing else', () => {
    // Source: REF table: SR28 19310 (pectin) lists no sugars.
    expect(rowOf(d, 'sugars').incomplete).toBe(true);
    expect(rowOf(d, 'sugars').note).toBe('Incomplete: no figure for pectin');
    expect(d.rows.filter((r) => r.incomplete).map((r) => r.nutrient)).toEqual(['sugars']);
    expect(d.complete).toBe(false);
  });

  it('adds 13 kJ/3 kcal per gram when the citric acid is counted as organic acid', () => {
    // Source: REF example (a): "+65 kJ/+15 kcal per batch → 1159.97875 kJ and 273.126875 kcal".
    const withAcid = euDeclaration(finishedNutrients(strawberryJam({ ...CITRIC_ACID_NOTHING, organicAcidsG: 100 })));
    expect(withAcid.energyKj).toBeCloseTo(1159.97875, 9);
    expect(withAcid.energyKcal).toBeCloseTo(273.126875, 9);
    // The acid is not taken out of the declared carbohydrate.
    expect(withAcid.availableCarbohydrateG).toBeCloseTo(d.availableCarbohydrateG!, 12);
  });

  it('sits inside the plausibility band of SR28 19297 "Jams and preserves"', () => {
    // Source: REF (c): water, carbohydrate and EU energy agree with 19297 within about 2 %.
    const n = finishedNutrients(strawberryJam());
    const ref = euDeclaration(finished(SR28.jamsAndPreserves19297));
    expect(Math.abs(n.waterG! / 30.47 - 1)).toBeLessThan(0.02);
    expect(Math.abs(n.carbohydrateG! / 68.86 - 1)).toBeLessThan(0.02);
    expect(Math.abs(d.energyKj! / ref.energyKj! - 1)).toBeLessThan(0.02);
    // Source: REF (c): EU energy of 19297 is 1169.60 kJ / 275.35 kcal.
    expect(ref.energyKj).toBeCloseTo(1169.6, 6);
    expect(ref.energyKcal).toBeCloseTo(275.35, 6);
    // Source: REF (c): sugars differ by about 17 g, so they are outside the band.
    expect(n.sugarsG! - 48.5).toBeCloseTo(16.93, 2);
  });
});

describe('EU declaration: example (b) apricot jam', () => {
  const d = euDeclaration(finishedNutrients(apricotJam()));

  it('gives the worked energy, salt and rounded rows', () => {
    // Source: REF example (b): 1168.732653 kJ, 275.210204 kcal, salt 0.003061 g per 100 g.
    expect(d.energyKj).toBeCloseTo(1168.732653, 5);
    expect(d.energyKcal).toBeCloseTo(275.210204, 5);
    expect(d.saltG).toBeCloseTo(0.003061, 6);
    // Source: REF example (b) per-100 g values rounded per GUIDANCE.
    expect(d.rows.map((r) => r.label)).toEqual(['1169 kJ / 275 kcal', '<0.5 g', '<0.1 g', '67 g', '67 g', '1.2 g', '0.9 g', '<0.01 g']);
    expect(d.complete).toBe(true);
  });
});

describe('EU rounding: both sides of every threshold', () => {
  const label = (value: number, rounding: 'macronutrient' | 'saturates' | 'salt') => euGramAmount(value, rounding).label;

  it('fat, carbohydrate, sugars, fibre, polyols and protein', () => {
    // Source: GUIDANCE: ≥ 10 g → 1 g; < 10 g → 0.1 g; ≤ 0.5 g → "0" or "<0.5 g".
    expect(label(10, 'macronutrient')).toBe('10 g');
    expect(label(10.5, 'macronutrient')).toBe('11 g');
    expect(label(9.94, 'macronutrient')).toBe('9.9 g');
    expect(label(9.96, 'macronutrient')).toBe('10.0 g');
    expect(label(0.51, 'macronutrient')).toBe('0.5 g');
    expect(label(0.55, 'macronutrient')).toBe('0.6 g');
    expect(label(0.5, 'macronutrient')).toBe('<0.5 g');
    expect(label(0.0001, 'macronutrient')).toBe('<0.5 g');
    expect(label(0, 'macronutrient')).toBe('0 g');
    expect(euGramAmount(0.5, 'macronutrient').labelValue).toBeNull();
    expect(euGramAmount(10.5, 'macronutrient').labelValue).toBe(11);
  });

  it('saturates', () => {
    // Source: GUIDANCE: ≥ 10 g → 1 g; < 10 g → 0.1 g; ≤ 0.1 g → "0" or "<0.1 g".
    expect(label(10, 'saturates')).toBe('10 g');
    expect(label(9.94, 'saturates')).toBe('9.9 g');
    expect(label(0.15, 'saturates')).toBe('0.2 g');
    expect(label(0.11, 'saturates')).toBe('0.1 g');
    expect(label(0.1, 'saturates')).toBe('<0.1 g');
    expect(label(0, 'saturates')).toBe('0 g');
  });

  it('salt', () => {
    // Source: GUIDANCE: ≥ 1 g → 0.1 g; < 1 g → 0.01 g; ≤ 0.0125 g → "0" or "<0.01 g".
    expect(label(1, 'salt')).toBe('1.0 g');
    expect(label(1.05, 'salt')).toBe('1.1 g');
    expect(label(0.994, 'salt')).toBe('0.99 g');
    expect(label(0.015, 'salt')).toBe('0.02 g');
    expect(label(0.0126, 'salt')).toBe('0.01 g');
    expect(label(0.0125, 'salt')).toBe('<0.01 g');
    expect(label(0, 'salt')).toBe('0 g');
  });

  it('energy to the nearest kJ and kcal', () => {
    // Source: GUIDANCE: energy to the nearest 1 kJ / 1 kcal.
    expect(euEnergyAmounts(1155.5, 272.49).map((a) => a.label)).toEqual(['1156 kJ', '272 kcal']);
    expect(euEnergyAmounts(1155.49, 272.5).map((a) => a.label)).toEqual(['1155 kJ', '273 kcal']);
  });
});

describe('EU energy: which carbohydrate feeds it', () => {
  it('takes fibre out of carbohydrate by difference and counts it at 8 kJ/2 kcal', () => {
    // Source: Regulation (EU) 1169/2011 Annex I point 7 (carbohydrate metabolised) and Annex XIV (17 kJ/4 kcal; fibre 8 kJ/2 kcal).
    const noFibre = euDeclaration(finished({ carbohydrateG: 60, fibreG: 0, proteinG: 0, fatG: 0 }));
    const tenFibre = euDeclaration(finished({ carbohydrateG: 60, fibreG: 10, proteinG: 0, fatG: 0 }));
    expect(noFibre.energyKj).toBeCloseTo(60 * 17, 12);
    expect(tenFibre.energyKj).toBeCloseTo(50 * 17 + 10 * 8, 12);
    expect(tenFibre.energyKcal).toBeCloseTo(50 * 4 + 10 * 2, 12);
    expect(availableCarbohydrate(finished({ carbohydrateG: 60, fibreG: 10 }))).toBe(50);
  });

  it('keeps polyols inside the declared carbohydrate but at 10 kJ/2.4 kcal', () => {
    // Source: Regulation (EU) 1169/2011 Annex I point 7 ("includes polyols") and Annex XIV (polyols 10 kJ/2.4 kcal).
    const d = euDeclaration(finished({ carbohydrateG: 60, fibreG: 0, polyolsG: 20, proteinG: 0, fatG: 0, sugarsG: 30, sodiumMg: 0 }));
    expect(d.energyKj).toBeCloseTo(40 * 17 + 20 * 10, 12);
    expect(d.energyKcal).toBeCloseTo(40 * 4 + 20 * 2.4, 12);
    expect(rowOf(d, 'carbohydrate').label).toBe('60 g');
    expect(d.rows.map((r) => r.nutrient)).toEqual(['energy', 'fat', 'saturates', 'carbohydrate', 'sugars', 'polyols', 'fibre', 'protein', 'salt']);
    expect(rowOf(d, 'polyols').name).toBe('of which polyols');
  });

  it('marks energy incomplete when a line lacks carbohydrate, fibre, protein or fat, and unknown when none has it', () => {
    // Source: lib/label/types.ts contract (unknown is never zero); Annex XIV needs all four.
    const d = euDeclaration(finished({ carbohydrateG: 60, fibreG: 1, proteinG: 1, fatG: 0 }, { fibreG: ['blackcurrants'] }));
    expect(rowOf(d, 'energy').incomplete).toBe(true);
    expect(rowOf(d, 'energy').note).toBe('Incomplete: no figure for blackcurrants');
    expect(rowOf(d, 'carbohydrate').unknownFrom).toEqual(['blackcurrants']);
    const none = euDeclaration(finished({ carbohydrateG: 60, fibreG: 1, fatG: 0 }, { proteinG: ['a', 'b'] }));
    expect(rowOf(none, 'energy').label).toBe('not known');
    expect(rowOf(none, 'protein').label).toBe('not known');
    expect(none.energyKj).toBeNull();
  });

  it('leaves out the fibre row when no ingredient has a fibre figure', () => {
    // Source: Regulation (EU) 1169/2011 Art. 30(2): fibre is a voluntary addition to the declaration.
    const d = euDeclaration(finished({ carbohydrateG: 60, proteinG: 0, fatG: 0 }, { fibreG: ['x'] }));
    expect(d.rows.some((r) => r.nutrient === 'fibre')).toBe(false);
  });
});
