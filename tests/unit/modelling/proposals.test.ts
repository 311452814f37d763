/**
 * The optimiser's proposals over a family model: the base formula moved to a factor point, the rule
 * set's fruit minimum and the pH window held, every proposal inside the data's region; and the form's
 * checks of bad goals. The desirability functions themselves are checked against Derringer & Suich
 * (1980) in tests/unit/models/desirability.test.ts; here the glue is checked.
 */
import { describe, it, expect } from 'vitest';
import { findTypicalIngredient, type IngredientComposition } from '@/lib/chemistry';
import { fitResponseSurface, predictResponse } from '@/lib/models';
import { formulaFeatures } from '@/lib/modelling/features';
import { formulaAtPoint, fruitMinimumOf, pointsAround, proposeFormulas, type ProposalBase } from '@/lib/modelling/proposals';
import { DEFAULT_MODEL_FACTORS, type FamilyModel, type ModelFactor } from '@/lib/modelling/schema';
import type { RevisionLine } from '@/lib/formulas/schema';
import { defaultDraft, readProposalDraft } from '@/components/modelling/proposal-draft';

function composition(key: string): IngredientComposition {
  const { key: _key, source: _source, ...rest } = findTypicalIngredient(key)!;
  void _key; void _source;
  return rest;
}
const line = (key: string, grams: number, n: number): RevisionLine => ({ ingredientId: `00000000-0000-4000-8000-00000000000${n}`, ingredient: composition(key), quantity: grams, unit: 'g' });

const base: ProposalBase = {
  settings: { productClass: 'reduced_sugar_spread', ruleSet: 'eu', ruleDate: '2026-11-20', targetSolidsPct: 46, jarNetFillG: 250, altitudeM: null, measuredWaterBoilingC: null, plannedPh: null, preservation: null },
  lines: [line('apricot', 1000, 1), line('sucrose', 400, 2), line('pectin_lm_amidated', 10, 3), line('calcium_citrate', 1, 4), line('lemon_juice', 40, 5)],
};
const features = formulaFeatures(base.settings, base.lines);
if (!features.ok || !features.features.family) throw new Error('base has no family');
const centre = features.features.factors;

// Invented runs: a 2⁴ factorial at ±15 % around the base plus three centre runs, with fixed scatter.
const points: Array<Record<ModelFactor, number>> = [];
for (let r = 0; r < 16; r++) points.push(Object.fromEntries(DEFAULT_MODEL_FACTORS.map((f, j) => [f, centre[f] * ((r >> j) & 1 ? 1.15 : 0.85)])) as Record<ModelFactor, number>);
for (let c = 0; c < 3; c++) points.push({ ...centre });
const scatter = (i: number) => 0.04 * Math.sin(3 * i + 1);
const coded = (p: Record<ModelFactor, number>, f: ModelFactor) => (p[f] / centre[f] - 1) / 0.15;
const fit = (truth: (p: Record<ModelFactor, number>) => number) =>
  fitResponseSurface({ factors: [...DEFAULT_MODEL_FACTORS], kind: 'two_factor_interactions', runs: points.map((point, i) => ({ point, response: truth(point) + scatter(i) })) });

const liking = fit((p) => 6 + 0.6 * coded(p, 'sugarRatio') + 0.3 * coded(p, 'pectinPct') - 0.2 * coded(p, 'acidPct'));
const firmness = fit((p) => 5 + 1.5 * coded(p, 'pectinPct') + 0.6 * coded(p, 'targetSolidsPct'));
const ph = fit((p) => 3.55 - 0.15 * coded(p, 'acidPct') - 0.02 * coded(p, 'sugarRatio'));

const response = (key: string, name: string, surface: typeof liking, libraryKey: string | null, scale: { min: number; max: number } | null) => ({
  key: key as `lab:measuredPh`, name, unit: 'u', kind: scale ? ('sensory' as const) : ('lab' as const), decimals: 2, libraryKey, scale, surface, weighting: '', newRunWeight: null,
});
const MODEL: FamilyModel = {
  family: features.features.family,
  factors: [...DEFAULT_MODEL_FACTORS],
  runs: points.length,
  responses: [
    response('attribute:00000000-0000-4000-8000-0000000000a1', 'Overall liking', liking, 'overall-liking', { min: 1, max: 9 }),
    response('attribute:00000000-0000-4000-8000-0000000000a2', 'Set firmness', firmness, 'set-firmness', { min: 0, max: 10 }),
    response('lab:measuredPh', 'Measured pH', ph, null, null),
  ],
  unfitted: [],
  fruitContent: null,
  fittedAt: '2026-12-03T12:00:00.000Z',
};
const LIKING = MODEL.responses[0].key;
const ranges = DEFAULT_MODEL_FACTORS.map((name) => ({ name, low: centre[name] * 0.85, high: centre[name] * 1.15 }));

describe('formulaAtPoint', () => {
  it('writes a point back into the base formula: its features are the point', () => {
    const point = { sugarRatio: centre.sugarRatio * 0.9, targetSolidsPct: 44, pectinPct: centre.pectinPct * 1.1, acidPct: centre.acidPct * 0.95 };
    const made = formulaAtPoint(base, point);
    expect(made.ok).toBe(true);
    if (!made.ok) return;
    const f = formulaFeatures(made.settings, made.lines, made.computation);
    if (!f.ok) throw new Error(f.message);
    expect(f.features.factors.sugarRatio).toBeCloseTo(point.sugarRatio, 9);
    expect(f.features.factors.targetSolidsPct).toBe(44);
    expect(f.features.factors.pectinPct).toBeCloseTo(point.pectinPct, 3);
    expect(f.features.factors.acidPct).toBeCloseTo(point.acidPct, 3);
    // Fruit and the calcium stay as they were.
    expect(made.lines[0].quantity).toBe(1000);
    expect(made.lines[3].quantity).toBe(1);
  });

  it('refuses a share that cannot be reached', () => {
    expect(formulaAtPoint(base, { pectinPct: 90 })).toEqual({ ok: false, message: expect.stringMatching(/cannot be made/) });
  });
});

describe('fruitMinimumOf', () => {
  it('offers the EU jam minimum as the benchmark for a reduced-sugar spread, and says so', () => {
    // Source: Council Directive 2001/113/EC as amended by Directive (EU) 2024/1438: jam 450 g per 1000 g from 14 June 2026 (lib/chemistry/rule-sets.ts).
    const minimum = fruitMinimumOf(base);
    expect(minimum?.value).toBe(450);
    expect(minimum?.basis).toMatch(/^No fruit minimum for this product class in the rule set; the jam minimum is the benchmark/);
  });
});

describe('proposeFormulas', () => {
  const goals = [
    { response: LIKING, goal: { kind: 'maximise' as const, low: 5, high: 8 }, importance: 3 },
    { response: MODEL.responses[1].key, goal: { kind: 'band' as const, low: 3, bandLow: 4.5, bandHigh: 6, high: 8 }, importance: 2 },
  ];

  it('proposes formulas inside the data that hold the fruit minimum and the pH window', () => {
    const fruitMin = 680;
    const outcome = proposeFormulas(MODEL, base, { factors: ranges, goals, fruitMinimumPer1000g: fruitMin, ph: { low: 3.45, high: 3.6 } });
    expect(outcome.notes).toEqual([]);
    expect(outcome.proposals.length).toBeGreaterThan(0);
    for (const p of outcome.proposals) {
      expect(p.fruitPer1000g).toBeGreaterThanOrEqual(fruitMin - 1e-6);
      expect(p.ph!.estimate).toBeGreaterThanOrEqual(3.45 - 1e-9);
      expect(p.ph!.estimate).toBeLessThanOrEqual(3.6 + 1e-9);
      for (const r of MODEL.responses) expect(predictResponse(r.surface, p.point).inRegion).toBe(true);
      const made = formulaAtPoint(base, p.point);
      expect(made.ok && made.computation.massBalance.fruitPer1000gFinishedG).toBeCloseTo(p.fruitPer1000g, 9);
    }
    // Without the fruit minimum the best proposal has less fruit than the minimum asks: the constraint bites.
    const free = proposeFormulas(MODEL, base, { factors: ranges, goals, ph: { low: 3.45, high: 3.6 } });
    expect(free.proposals[0].fruitPer1000g).toBeLessThan(fruitMin);
  });

  it('says plainly when the family has no pH model, and does not pretend to hold the window', () => {
    const noPh = { ...MODEL, responses: MODEL.responses.slice(0, 2) };
    const outcome = proposeFormulas(noPh, base, { factors: ranges, goals, ph: { low: 3.0, high: 3.6 } });
    expect(outcome.notes[0]).toMatch(/no model of measured pH/);
    expect(outcome.proposals[0].ph).toBeNull();
  });

  it('gives a few points around a proposal, all inside the data', () => {
    const outcome = proposeFormulas(MODEL, base, { factors: ranges, goals });
    const around = pointsAround(MODEL, base, outcome.proposals[0].point, ranges);
    expect(around.length).toBeGreaterThan(0);
    expect(around.length).toBeLessThanOrEqual(4);
    for (const p of around) for (const r of MODEL.responses) expect(predictResponse(r.surface, p).inRegion).toBe(true);
  });
});

describe('the proposal form checks goals before it searches', () => {
  const draft = defaultDraft(MODEL, 450);
  const key = LIKING;

  it('starts with liking maximised and firmness in a band, and reads them', () => {
    expect(draft.goals[key].kind).toBe('maximise');
    expect(draft.goals[MODEL.responses[1].key].kind).toBe('band');
    expect('lab:measuredPh' in draft.goals).toBe(false);
    const read = readProposalDraft(MODEL, draft);
    expect(read.ok).toBe(true);
  });

  it.each([
    ['low at or above high', { low: '8', high: '8' }, `goal.${key}.low`, 'The lower limit of Overall liking must be below its upper limit.'],
    ['a weight of zero', { importance: '0' }, `goal.${key}.importance`, 'The importance of Overall liking must be above 0.'],
    ['a negative weight', { importance: '-2' }, `goal.${key}.importance`, 'The importance of Overall liking must be above 0.'],
    ['text that is no number', { low: 'NaN' }, `goal.${key}.low`, 'Lower limit of Overall liking: enter a number.'],
    ['Infinity', { high: 'Infinity' }, `goal.${key}.high`, 'Upper limit of Overall liking: enter a number.'],
  ])('names %s', (_what, patch, field, message) => {
    const bad = { ...draft, goals: { ...draft.goals, [key]: { ...draft.goals[key], ...patch } } };
    const read = readProposalDraft(MODEL, bad);
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.errors[field]).toBe(message);
  });

  it('names a band outside its limits, a reversed pH window and a reversed factor range', () => {
    const firm = MODEL.responses[1].key;
    const bad = {
      ...draft,
      goals: { ...draft.goals, [firm]: { ...draft.goals[firm], bandLow: '9' } },
      phLow: '3.8', phHigh: '3.2',
      factors: { ...draft.factors, pectinPct: { low: '0.9', high: '0.5' } },
    };
    const read = readProposalDraft(MODEL, bad);
    if (read.ok) throw new Error('should refuse');
    expect(read.errors[`goal.${firm}.bandLow`]).toMatch(/band of Set firmness must lie between/);
    expect(read.errors.ph).toBe('The lowest pH must be below the highest.');
    expect(read.errors['factor.pectinPct.low']).toBe('The lowest pectin must be below the highest.');
  });

  it('needs at least one goal', () => {
    const none = { ...draft, goals: Object.fromEntries(Object.entries(draft.goals).map(([k, g]) => [k, { ...g, kind: 'none' as const }])) };
    const read = readProposalDraft(MODEL, none);
    expect(read.ok || read.errors.goals).toBe('State at least one goal.');
  });
});

describe('a proposal states the interval of one new variant', () => {
  it('uses the response model\'s new-run weight (a panel mean), as the editor does', () => {
    const weighted: FamilyModel = { ...MODEL, responses: MODEL.responses.map((r, i) => (i === 0 ? { ...r, newRunWeight: 9 } : r)) };
    const goals = [{ response: LIKING, goal: { kind: 'maximise' as const, low: 5, high: 8 }, importance: 1 }];
    const outcome = proposeFormulas(weighted, base, { factors: ranges, goals });
    const p = outcome.proposals[0];
    const expected = predictResponse(liking, p.point, { newRunWeight: 9 });
    if (!expected.inRegion || !expected.prediction) throw new Error('should predict');
    expect(p.responses[0].prediction!.low).toBeCloseTo(expected.prediction.low, 12);
    expect(p.responses[0].prediction!.high).toBeCloseTo(expected.prediction.high, 12);
    const unweighted = predictResponse(liking, p.point);
    if (!unweighted.inRegion || !unweighted.prediction) throw new Error('should predict');
    expect(p.responses[0].prediction!.high - p.responses[0].prediction!.low).toBeLessThan(unweighted.prediction.high - unweighted.prediction.low);
  });
});
