/**
 * The optimiser's proposals over a family model: the base formula moved to a factor point, the rule
 * set's fruit minimum and the pH window held, every proposal inside the data's region; and the form's
 * checks of bad goals. The desirability functions themselves are checked against Derringer & Suich
 * (1980) in tests/unit/models/desirability.test.ts; here the glue is checked.
 */
import { describe, it, expect } from 'vitest';
import { predictResponse } from '@/lib/models';
import { formulaFeatures } from '@/lib/modelling/features';
import { costAtPoint, costCeilingConstraint, costPerJarProblem, formulaAtPoint, fruitMinimumOf, pointsAround, proposalCosting, proposeFormulas } from '@/lib/modelling/proposals';
import { base, basis, centre, id, liking, LIKING, MODEL, ranges } from './fixtures';
import type { FamilyModel } from '@/lib/modelling/schema';
import { defaultDraft, readProposalDraft } from '@/components/modelling/proposal-draft';

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
    const { points: around, overCeiling } = pointsAround(MODEL, base, outcome.proposals[0].point, ranges);
    expect(overCeiling).toBe(0);
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

describe('the cost ceiling per jar', () => {
  const costing = proposalCosting(basis, 'pf');
  // Hand-worked. Soluble solids of the base: apricot 1000 g × 11.7 % + sucrose 400 + pectin 10 + calcium
  // citrate 1 + lemon juice 40 g × 4.5 % = 529.8 g; at 46 % target the finished mass is 529.8 / 0.46 g.
  // Ingredients per batch 300 + 40 + 200 + 5 + 8 = 553; per 250 g jar 553 × 250 / finished mass, plus 38 of packaging.
  const atBase = (553 * 250) / (529.8 / 0.46) + 38; // 158.04
  // At sugar ratio 0.3 (sucrose 300 g): solids 429.8 g, ingredients 543 per batch — less sugar, fewer jars, dearer jars.
  const atLowSugar = (543 * 250) / (429.8 / 0.46) + 38; // 183.29

  it('prices the formula at a point as the editor does, with hand-worked figures', () => {
    const here = costAtPoint(base, {}, costing);
    const low = costAtPoint(base, { sugarRatio: 0.3 }, costing);
    if (!here.ok || !low.ok) throw new Error('should cost');
    expect(here.cost.perJar).toEqual({ minor: expect.closeTo(atBase, 6), complete: true });
    expect(low.cost.perJar!.minor).toBeCloseTo(atLowSugar, 6);
  });

  it('excludes the points whose cost per jar is above the ceiling', () => {
    const ceiling = costCeilingConstraint(base, costing, 170);
    expect(ceiling.violation({})).toBe(0);
    expect(ceiling.violation({ sugarRatio: 0.3 })).toBeCloseTo(atLowSugar - 170, 6);
    // Every proposal under a ceiling costs at most the ceiling, and the ceiling bites: the free search's best is dearer.
    const goals = [{ response: LIKING, goal: { kind: 'minimise' as const, low: 4, high: 8 }, importance: 1 }];
    const free = proposeFormulas(MODEL, base, { factors: ranges, goals }, costing);
    const freeCost = free.proposals[0].costPerJarMinor!;
    const cap = freeCost - 3;
    const held = proposeFormulas(MODEL, base, { factors: ranges, goals, costCeilingPerJarMinor: cap }, costing);
    expect(held.proposals.length).toBeGreaterThan(0);
    for (const p of held.proposals) {
      expect(p.costPerJarMinor!).toBeLessThanOrEqual(cap + 1e-9);
      const priced = costAtPoint(base, p.point, costing);
      expect(priced.ok && priced.cost.perJar!.minor).toBeCloseTo(p.costPerJarMinor!, 9);
    }
    expect(held.proposals[0].desirability).toBeLessThan(free.proposals[0].desirability);
  });

  it('holds the trial\'s points around a proposal to the ceiling, and counts those left out', () => {
    const goals = [{ response: LIKING, goal: { kind: 'minimise' as const, low: 4, high: 8 }, importance: 1 }];
    const free = proposeFormulas(MODEL, base, { factors: ranges, goals }, costing);
    const cap = free.proposals[0].costPerJarMinor! - 3;
    const held = proposeFormulas(MODEL, base, { factors: ranges, goals, costCeilingPerJarMinor: cap }, costing);
    const proposal = held.proposals[0].point;
    // Every step of every factor (count 8 = four factors down and up), with and without the ceiling.
    const all = pointsAround(MODEL, base, proposal, ranges, { count: 8 });
    const kept = pointsAround(MODEL, base, proposal, ranges, { count: 8, ceiling: { costing, perJarMinor: cap } });
    // The proposal sits on the ceiling: a step towards less sugar (dearer jars, see above) breaks it.
    expect(kept.overCeiling).toBeGreaterThan(0);
    expect(kept.points.length + kept.overCeiling).toBe(all.points.length);
    for (const point of kept.points) {
      const priced = costAtPoint(base, point, costing);
      expect(priced.ok && priced.cost.perJar!.minor).toBeLessThanOrEqual(cap);
    }
    for (const point of all.points.filter((p) => !kept.points.some((k) => JSON.stringify(k) === JSON.stringify(p)))) {
      const priced = costAtPoint(base, point, costing);
      expect(priced.ok && priced.cost.perJar!.minor).toBeGreaterThan(cap);
    }
  });

  it('refuses a ceiling above 1,000,000 in the currency\'s major units (the screen\'s own bound)', () => {
    // EUR has two minor digits (ISO 4217): 1,000,000.00 EUR is 100,000,000 minor units.
    expect(costCeilingConstraint(base, costing, 100_000_000).violation({})).toBe(0);
    expect(() => costCeilingConstraint(base, costing, 100_000_001)).toThrow('The cost ceiling per jar must be at most 1,000,000.');
  });

  it('refuses a ceiling when a price is unknown, naming the line, and never counts it as zero', () => {
    const noPectin = proposalCosting({ ...basis, ingredientPrices: basis.ingredientPrices.filter((p) => p.ingredientId !== id(3)) }, 'pf');
    expect(() => costCeilingConstraint(base, noPectin, 170)).toThrow(/incomplete on 2026-12-03: no price for .*pectin/i);
    const noLid = proposalCosting({ ...basis, packagingPrices: basis.packagingPrices.slice(0, 1) }, 'pf');
    expect(() => costCeilingConstraint(base, noLid, 170)).toThrow(/no price for Lid/);
    // Without a ceiling the proposals still come, without a cost per jar.
    const goals = [{ response: LIKING, goal: { kind: 'maximise' as const, low: 5, high: 8 }, importance: 1 }];
    expect(proposeFormulas(MODEL, base, { factors: ranges, goals }, noPectin).proposals[0].costPerJarMinor).toBeNull();
  });

  it('refuses a ceiling without a pack format, a currency or prices to see', () => {
    expect(() => costCeilingConstraint(base, proposalCosting(basis, null), 170)).toThrow('This formula has no pack format, so it has no cost per jar: choose its pack format (jar and packaging) first.');
    expect(() => costCeilingConstraint(base, proposalCosting({ ...basis, currency: null }, 'pf'), 170)).toThrow(/workspace currency/);
    expect(() => costCeilingConstraint(base, null, 170)).toThrow(/permission to see prices/);
    expect(costPerJarProblem(base, costing)).toBeNull();
  });

  it('the form reads the ceiling in the workspace currency, decimal comma accepted', () => {
    const draft = defaultDraft(MODEL, 450);
    const read = readProposalDraft(MODEL, { ...draft, costCeiling: '1,65' }, 'EUR');
    expect(read.ok && read.request.costCeilingPerJarMinor).toBeCloseTo(165, 9);
    const blank = readProposalDraft(MODEL, draft, 'EUR');
    expect(blank.ok && blank.request.costCeilingPerJarMinor).toBeUndefined();
    for (const [text, message] of [
      ['0', 'The cost ceiling per jar must be above 0.'],
      ['-1', 'The cost ceiling per jar must be above 0.'],
      ['abc', 'Cost ceiling per jar: enter a number.'],
      ['1e300', 'The cost ceiling per jar must be at most 1,000,000.'],
    ]) {
      const bad = readProposalDraft(MODEL, { ...draft, costCeiling: text }, 'EUR');
      expect(bad.ok || bad.errors.costCeiling).toBe(message);
    }
    const noCurrency = readProposalDraft(MODEL, { ...draft, costCeiling: '2' }, null);
    expect(noCurrency.ok || noCurrency.errors.costCeiling).toMatch(/workspace currency/);
  });
});
