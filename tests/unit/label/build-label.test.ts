import { describe, expect, it } from 'vitest';
import { buildLabel, labelForLines, labelInputFor, claimReferenceFrom } from '@/lib/label';
import { computeFormula, type ComputableLine } from '@/lib/formulas/compute';
import type { FormulaSettingsInput } from '@/lib/formulas/schema';
import type { IngredientLabelData } from '@/lib/label/types';
import { SR28, CITRIC_ACID_NOTHING, labelData } from './fixtures';

const STRAWBERRY = { kind: 'fruit', name: 'Strawberry', solidsPct: 8 } as const;
const SUGAR = { kind: 'sweetener', name: 'Sugar', solidsPct: 100, sweetenerType: 'sucrose' } as const;
const PECTIN = { kind: 'pectin', name: 'Pectin', solidsPct: 100, pectinType: 'hm_rapid_set' } as const;
const CITRIC = { kind: 'acid', name: 'Citric acid', solidsPct: 100, acidType: 'citric' } as const;

/** Example (a): 1000 g strawberry + 1000 g sugar + 10 g pectin + 5 g citric acid → 1600 g (1095 g solids). */
const lines: ComputableLine[] = [
  { ingredient: STRAWBERRY, quantity: 1000, unit: 'g' },
  { ingredient: SUGAR, quantity: 1000, unit: 'g' },
  { ingredient: PECTIN, quantity: 10, unit: 'g' },
  { ingredient: CITRIC, quantity: 5, unit: 'g' },
];
const settings: FormulaSettingsInput = { productClass: 'jam', ruleSet: 'eu', ruleDate: '2026-06-01', targetSolidsPct: (1095 / 1600) * 100, jarNetFillG: 340 };
const data: IngredientLabelData[] = [
  labelData('strawberries', 'fruit', SR28.strawberry),
  labelData('sugar', 'sweetener', SR28.sugar),
  { ...labelData('pectin', 'pectin', SR28.pectin), additive: { eNumber: 'E440', className: 'gelling agent' } },
  { ...labelData('citric acid', 'acid', CITRIC_ACID_NOTHING), additive: { eNumber: 'E330', className: 'acid' } },
];

function label(d: Array<IngredientLabelData | null> = data) {
  const outcome = labelForLines(settings, lines, d);
  if (!outcome.ok) throw new Error(outcome.message);
  return outcome.label;
}

const euRow = (l: ReturnType<typeof label>, key: string) => l.eu.rows.find((r) => r.key === key)!;
const usRow = (l: ReturnType<typeof label>, key: string) => l.us.rows.find((r) => r.key === key)!;

describe('labelInputFor', () => {
  it('takes each line at its weight at the time of use and the finished mass from the mass balance', () => {
    const outcome = computeFormula(settings, lines);
    if (!outcome.ok) throw new Error(outcome.message);
    const input = labelInputFor(settings, outcome.computation.massBalance, data);
    expect(input.lines.map((l) => l.grams)).toEqual([1000, 1000, 10, 5]);
    // Source: docs/nutrition-check-values.md, example (a): input 2015 g, finished 1600 g, 415 g of water lost.
    expect(input.massBalance.finishedMassG).toBeCloseTo(1600, 6);
    expect(input.massBalance.waterToEvaporateG).toBeCloseTo(415, 6);
    expect(input.lines[0].fruitName).toBe('strawberries');
    expect(input.lines[1].fruitName).toBeUndefined();
  });

  it('counts a line without label data with every value unknown, never zero', () => {
    const outcome = computeFormula(settings, lines);
    if (!outcome.ok) throw new Error(outcome.message);
    const input = labelInputFor(settings, outcome.computation.massBalance, [data[0], data[1], null, data[3]]);
    expect(input.lines[2].ingredient.labelName).toBe('Pectin');
    expect(Object.values(input.lines[2].ingredient.nutrients).every((v) => v === null)).toBe(true);
  });
});

describe('buildLabel on the 1:1 strawberry jam', () => {
  it('declares EU energy from the Annex XIV factors, unrounded beside the label value', () => {
    const l = label();
    // Source: docs/nutrition-check-values.md, example (a): 1155.91625 kJ and 272.189375 kcal per 100 g
    // (Regulation (EU) No 1169/2011 Annex XIV, available carbohydrate = by difference − fibre).
    expect(euRow(l, 'energy_kJ').unrounded).toBeCloseTo(1155.91625, 4);
    expect(euRow(l, 'energy_kcal').unrounded).toBeCloseTo(272.189375, 4);
    // Source: European Commission guidance on tolerances and rounding (December 2012), energy to the nearest 1 kJ/kcal (memory).
    expect(euRow(l, 'energy_kJ').label).toBe('1156 kJ');
    expect(euRow(l, 'energy_kcal').label).toBe('272 kcal');
  });

  it('rounds each EU row as the 2012 guidance says, on the figures of the worked example', () => {
    const l = label();
    // Source: docs/nutrition-check-values.md, example (a) per 100 g; rounding per the European Commission
    // guidance (December 2012): ≥ 10 g to 1 g, fat/protein ≤ 0.5 g as "<0.5 g", saturates ≤ 0.1 g as "<0.1 g",
    // salt ≤ 0.0125 g as "<0.01 g" (memory).
    expect(euRow(l, 'sugars').unrounded).toBeCloseTo(65.43125, 5);
    expect(euRow(l, 'sugars').label).toBe('65 g');
    expect(euRow(l, 'carbohydrate').unrounded).toBeCloseTo(66.54875, 5);
    expect(euRow(l, 'carbohydrate').label).toBe('67 g');
    expect(euRow(l, 'fat').label).toBe('<0.5 g');
    expect(euRow(l, 'protein').label).toBe('<0.5 g');
    expect(euRow(l, 'saturates').label).toBe('<0.1 g');
    expect(euRow(l, 'salt').unrounded).toBeCloseTo(0.00625, 8);
    expect(euRow(l, 'salt').label).toBe('<0.01 g');
    // SR28 19310 has no sugars for pectin: the sugar rows say so instead of counting it as zero.
    expect(l.incomplete.map((n) => n.part)).toEqual(['EU declaration: of which sugars', 'US facts: Total Sugars']);
    expect(l.incomplete.every((n) => /pectin/.test(n.reason))).toBe(true);
  });

  it('gives the US facts per 1 tbsp (20 g) with added sugars from the sweetener only', () => {
    const l = label();
    // Source: 21 CFR 101.12(b) (jams: 1 tbsp); example (a) sugars 65.43125 g/100 g → 13.08625 g per 20 g, to the nearest gram (21 CFR 101.9(c)(6)(ii)).
    expect(l.us.servingG).toBe(20);
    expect(usRow(l, 'totalSugars').unrounded).toBeCloseTo(13.08625, 5);
    expect(usRow(l, 'totalSugars').label).toBe('13 g');
    // Source: 21 CFR 101.9(c)(6)(iii): sugar added is counted, the fruit's own sugar is not. 1000 g × 99.80 % / 1600 g × 20 g = 12.475 g → 12 g; DV 50 g → 24 %.
    expect(usRow(l, 'addedSugars').unrounded).toBeCloseTo(12.475, 5);
    expect(usRow(l, 'addedSugars').label).toBe('12 g');
    expect(usRow(l, 'addedSugars').dailyValue).toBe('24%');
    // Source: 21 CFR 101.9(c)(1): above 50 kcal to the nearest 10. (4 × 0.420625 + 4 × 67.8525 + 9 × 0.189375) × 0.2 = 54.959375.
    expect(usRow(l, 'calories').unrounded).toBeCloseTo(54.959375, 5);
    expect(usRow(l, 'calories').label).toBe('50');
  });

  it('states fruit and total sugar per 100 g', () => {
    const l = label();
    // Source: Directive 2001/113/EC Art. 2(3)–(4): 1000 g fruit in 1600 g = 62.5 g per 100 g, stated rounded down
    // (common practice, no published source); total sugar = the target refractometer value 68.4375 → 68.
    expect(l.statements.find((s) => s.kind === 'fruit')!.text).toBe('Prepared with 62 g of fruit per 100 g');
    expect(l.statements.find((s) => s.kind === 'total_sugar')!.text).toBe('Total sugar content 68 g per 100 g');
  });

  it('lists ingredients in descending order of weight with additives by class', () => {
    const text = label().ingredients.eu.runs.map((r) => r.text).join('');
    // Source: Regulation (EU) No 1169/2011 Art. 18(1) (descending weight) and Annex VII Part C (class name and E-number).
    expect(text.indexOf('strawberries')).toBeLessThan(text.indexOf('sugar'));
    expect(text).toMatch(/gelling agent/i);
  });

  it('checks the reduced-sugars claim against the typical jam and a chosen formula', () => {
    const typical = label().claims;
    expect(typical.reference).toMatch(/Typical jam/);
    // Source: Regulation (EC) No 1924/2006 Annex: "reduced" needs at least 30 % less; 65.4 g is more than 48.5 g (SR28 19297).
    expect(typical.items.find((c) => c.claim.toLowerCase().startsWith('reduced'))!.holds).toBe(false);
    const heavier = claimReferenceFrom('Heavy jam', { ...settings }, lines.map((l, i) => (i === 1 ? { ...l, quantity: 2500 } : l)), data, 'test');
    expect(heavier).not.toBeNull();
    const outcome = labelForLines(settings, lines, data, { claimReference: heavier });
    if (!outcome.ok) throw new Error(outcome.message);
    expect(outcome.label.claims.reference).toBe('Heavy jam');
  });

  it('names what is incomplete when an ingredient has no data, and shows no figure as zero', () => {
    const l = label([data[0], data[1], null, data[3]]);
    expect(l.incomplete.length).toBeGreaterThan(0);
    expect(l.incomplete.map((n) => n.reason).join(' ')).toMatch(/Pectin/);
    expect(euRow(l, 'carbohydrate').incomplete).toBe(true);
  });

  it('keeps a formula the chemistry refuses as a message, not a label', () => {
    // 100 % solids: refused by the saving rule before the chemistry would divide by zero water.
    const outcome = labelForLines({ ...settings, targetSolidsPct: 100 }, lines, data);
    expect(outcome).toEqual({ ok: false, message: expect.stringMatching(/target (soluble )?solids/i) });
  });

  it('is plain data: survives JSON as it is', () => {
    const l = label();
    expect(JSON.parse(JSON.stringify(l))).toEqual(l);
    expect(buildLabel).toBeTypeOf('function');
  });
});
