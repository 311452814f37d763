import { describe, it, expect } from 'vitest';
import { analyseTasting, summaryTablesOf, type TastingData, type TastingDataAttribute } from '@/lib/results/analysis';
import { formatP } from '@/lib/results/words';

// Source: Montgomery, Design and Analysis of Experiments, Example 4.1 (vascular graft, RCBD):
// four treatments × six blocks; treatments F = 8.10708, p = 0.0019163. Here the treatments are
// samples and the blocks are assessors, which is the same model.
const MONTGOMERY = {
  A: [90.3, 89.2, 98.2, 93.9, 87.4, 97.9],
  B: [92.5, 89.5, 90.6, 94.7, 87.0, 95.8],
  C: [85.5, 90.8, 89.6, 86.2, 88.0, 93.4],
  D: [82.5, 89.5, 85.6, 87.4, 78.9, 90.7],
};

function ratedData(): TastingData {
  const samples = Object.keys(MONTGOMERY).map((l) => ({ sampleId: `s-${l}`, label: l, description: '' }));
  const answers = Object.entries(MONTGOMERY).flatMap(([l, values]) =>
    values.map((value, seatIndex) => ({ seatIndex, kind: 'rating' as const, attribute: 'firm', sampleId: `s-${l}`, value, rankingSampleIds: null, correct: null })),
  );
  return { method: 'rated', samples, attributes: [{ id: 'firm', name: 'Set firmness', purpose: 'intensity', highAnchor: 'Very firm' }], answers, seatCount: 6, submittedSeats: 6 };
}

describe('rated panels', () => {
  it('runs the blocked ANOVA and words a verdict with the p-value', () => {
    const a = analyseTasting(ratedData()).attributes[0];
    const treat = a.anova.rows.find((r) => r.source === 'treatments')!;
    expect(treat.f).toBeCloseTo(8.10708, 4);
    expect(treat.p).toBeCloseTo(0.0019163, 6);
    expect(a.verdict.differs).toBe(true);
    expect(a.verdict.headline).toMatch(/^Samples? .* rated higher for set firmness .* than .*D.*unlikely to be chance, p = 0\.002\.$/);
    // Six assessors is a small panel: the verdict says so.
    expect(a.verdict.cautions.join(' ')).toMatch(/Only 6 assessors/);
    expect(a.comparison.letters.A).toContain('a');
  });

  it('names only pairs the Tukey letters separate (a walk found a sample sharing a letter with one "below" it named above it)', () => {
    const a = analyseTasting(ratedData()).attributes[0];
    // Montgomery Example 4.1 with Tukey HSD at α = 0.05: A and B apart from D; C shares a letter with both sides.
    expect(a.comparison.letters).toEqual({ A: 'a', B: 'a', C: 'ab', D: 'b' });
    expect(a.verdict.headline).toBe('Samples A and B are rated higher for set firmness (towards “firm”) than D; the difference is unlikely to be chance, p = 0.002.');
  });

  it('says "no clear difference" when there is none, and never prints NaN', () => {
    const data = ratedData();
    data.answers = data.answers.map((x) => ({ ...x, value: 5 + (x.seatIndex % 3) }));
    const a = analyseTasting(data).attributes[0];
    expect(JSON.stringify(a)).not.toContain('NaN');
    expect(a.verdict.differs).not.toBe(true);
  });

  it('counts JAR groups and runs the penalty analysis against liking', () => {
    const samples = [{ sampleId: 'x', label: 'A', description: '' }];
    // Hand computation: JAR scores 3,3,3,1,5 with liking 8,8,8,5,6 → JAR mean 8;
    // too little: 1 of 5 (20 %), drop 3, weighted 0.6; too much: 1 of 5, drop 2, weighted 0.4.
    const jar = [3, 3, 3, 1, 5];
    const like = [8, 8, 8, 5, 6];
    const answers = jar.flatMap((v, i) => [
      { seatIndex: i, kind: 'rating' as const, attribute: 'sweet', sampleId: 'x', value: v, rankingSampleIds: null, correct: null },
      { seatIndex: i, kind: 'rating' as const, attribute: 'like', sampleId: 'x', value: like[i], rankingSampleIds: null, correct: null },
    ]);
    const r = analyseTasting({
      method: 'rated', samples, answers, seatCount: 5, submittedSeats: 5,
      attributes: [{ id: 'like', name: 'Overall liking', purpose: 'liking' }, { id: 'sweet', name: 'Sweetness', purpose: 'just-about-right' }],
    });
    expect(r.jarShares).toEqual([{ attributeId: 'sweet', label: 'A', n: 5, tooLittle: 1, justAboutRight: 3, tooMuch: 1 }]);
    expect(r.attributes[1].penalties!.map((x) => x.label)).toEqual(['A']);
    const p = r.attributes[1].penalties![0].result;
    expect(p.groups.tooLittle.meanDrop).toBeCloseTo(3, 12);
    expect(p.groups.tooLittle.weightedPenalty).toBeCloseTo(0.6, 12);
    expect(p.groups.tooMuch.weightedPenalty).toBeCloseTo(0.4, 12);
  });
});

describe('penalty analysis, one per sample', () => {
  // Hand-worked, invented answers: five tasters score sweetness (JAR, 1–5) and overall liking (1–9) of A and B.
  //   A: JAR 3,3,3,4,4 with liking 8,8,7,5,6 → JAR mean 23/3 = 7.667; too much n 2 (40 %), mean 5.5,
  //      drop 2.1667, weighted 0.8667; too little none.
  //   B: JAR 1,2,3,3,3 with liking 3,4,6,6,6 → JAR mean 6; too little n 2 (40 %), mean 3.5, drop 2.5,
  //      weighted 1.0; too much none.
  //   Pooled (10 answers): JAR mean 41/6 = 6.833; too much 20 %, drop 1.333, weighted 0.267 — a third of
  //   what A's tasters actually lose, which is why each sample gets its own analysis.
  const samples = [{ sampleId: 'sa', label: 'A', description: '' }, { sampleId: 'sb', label: 'B', description: '' }];
  const jar = { sa: [3, 3, 3, 4, 4], sb: [1, 2, 3, 3, 3] };
  const like = { sa: [8, 8, 7, 5, 6], sb: [3, 4, 6, 6, 6] };
  const answers = (['sa', 'sb'] as const).flatMap((sampleId) => jar[sampleId].flatMap((v, i) => [
    { seatIndex: i, kind: 'rating' as const, attribute: 'sweet', sampleId, value: v, rankingSampleIds: null, correct: null },
    { seatIndex: i, kind: 'rating' as const, attribute: 'like', sampleId, value: like[sampleId][i], rankingSampleIds: null, correct: null },
  ]));
  const data: TastingData = {
    method: 'rated', samples, answers, seatCount: 5, submittedSeats: 5,
    attributes: [{ id: 'like', name: 'Overall liking', purpose: 'liking' }, { id: 'sweet', name: 'Sweetness', purpose: 'just-about-right' }],
  };

  it('runs one analysis per sample by default and no pooled one', () => {
    const a = analyseTasting(data).attributes[1];
    expect(a.pooledPenalty).toBeUndefined();
    const [pa, pb] = a.penalties!;
    expect([pa.label, pb.label]).toEqual(['A', 'B']);
    expect(pa.result.respondentCount).toBe(5);
    expect(pa.result.groups.justAboutRight.meanLiking).toBeCloseTo(23 / 3, 12);
    expect(pa.result.groups.tooMuch.share).toBeCloseTo(0.4, 12);
    expect(pa.result.groups.tooMuch.meanDrop).toBeCloseTo(23 / 3 - 5.5, 12);
    expect(pa.result.groups.tooMuch.weightedPenalty).toBeCloseTo(0.4 * (23 / 3 - 5.5), 12);
    expect(pa.result.groups.tooLittle.count).toBe(0);
    expect(pb.result.groups.tooLittle.meanDrop).toBeCloseTo(2.5, 12);
    expect(pb.result.groups.tooLittle.weightedPenalty).toBeCloseTo(1.0, 12);
    expect(pb.result.groups.tooMuch.count).toBe(0);
    // Common practice, no published source: groups of at least 20 % of a sample's tasters are read.
    expect(pa.result.shareThreshold).toBe(0.2);
    expect(pa.result.groups.tooMuch.largeEnoughToInterpret).toBe(true);
  });

  it('pools all samples only when asked', () => {
    const pooled = analyseTasting(data, { pooledPenalty: true }).attributes[1].pooledPenalty!;
    expect(pooled.respondentCount).toBe(10);
    expect(pooled.groups.justAboutRight.meanLiking).toBeCloseTo(41 / 6, 12);
    expect(pooled.groups.tooMuch.weightedPenalty).toBeCloseTo(0.2 * (41 / 6 - 5.5), 12);
    expect(pooled.groups.tooLittle.weightedPenalty).toBeCloseTo(0.2 * (41 / 6 - 3.5), 12);
  });
});

describe('triangle panels', () => {
  it('13 of 24 correct shows a difference', () => {
    // Source: ISO 4120 / FAO docrep V7180E Appendix A: n = 24 needs 13 at α = 0.05;
    // P(X ≥ 13 | n = 24, p = 1/3) = 0.0284411281.
    const answers = Array.from({ length: 24 }, (_, i) => ({ seatIndex: i, kind: 'triangle' as const, attribute: '*', sampleId: null, value: null, rankingSampleIds: null, correct: i < 13 }));
    const r = analyseTasting({ method: 'triangle', samples: [], attributes: [], answers, seatCount: 24, submittedSeats: 24 });
    expect(r.triangle!.result.pValue).toBeCloseTo(0.0284411281, 9);
    expect(r.triangle!.verdict.headline).toBe('13 of 24 tasters picked the odd sample: a perceptible difference, p = 0.028 (at least 13 were needed).');
    const twelve = analyseTasting({ method: 'triangle', samples: [], attributes: [], answers: answers.map((x, i) => ({ ...x, correct: i < 12 })), seatCount: 24, submittedSeats: 24 });
    expect(twelve.triangle!.verdict.differs).toBe(false);
  });
});

describe('p-value wording', () => {
  it('rounds to three places and floors at 0.001', () => {
    expect(formatP(0.0019163)).toBe('p = 0.002');
    expect(formatP(0.00001)).toBe('p < 0.001');
    expect(formatP(null)).toBe('p not available');
  });
});

describe('summary tables known from the set-up', () => {
  // The results page links the CSV tables before the answers are analysed: the set-up alone must
  // name exactly the tables the analysis then fills, with or without answers.
  const LIKING: TastingDataAttribute = { id: 'like', name: 'Overall liking', purpose: 'liking' };
  const JAR: TastingDataAttribute = { id: 'sweet', name: 'Sweetness', purpose: 'just-about-right' };
  const FIRM: TastingDataAttribute = { id: 'firm', name: 'Set firmness', purpose: 'intensity' };
  const samples = [{ sampleId: 'x', label: 'A', description: '' }, { sampleId: 'y', label: 'B', description: '' }];
  const setups: Array<Pick<TastingData, 'method' | 'attributes'>> = [
    { method: 'rated', attributes: [] },
    { method: 'rated', attributes: [FIRM] },
    { method: 'rated', attributes: [JAR] },
    { method: 'rated', attributes: [LIKING] },
    { method: 'rated', attributes: [LIKING, JAR] },
    { method: 'rated', attributes: [JAR, FIRM, LIKING] },
    { method: 'ranking', attributes: [LIKING, JAR] },
    { method: 'triangle', attributes: [] },
  ];
  const answersFor = (setup: Pick<TastingData, 'method' | 'attributes'>): TastingData['answers'] =>
    setup.method === 'rated'
      ? setup.attributes.flatMap((a) => samples.flatMap((s, i) => [0, 1, 2].map((seatIndex) => ({ seatIndex, kind: 'rating' as const, attribute: a.id, sampleId: s.sampleId, value: 2 + ((seatIndex + i) % 3), rankingSampleIds: null, correct: null }))))
      : setup.method === 'ranking'
        ? [0, 1, 2].map((seatIndex) => ({ seatIndex, kind: 'ranking' as const, attribute: 'ranking', sampleId: null, value: null, rankingSampleIds: seatIndex ? ['x', 'y'] : ['y', 'x'], correct: null }))
        : [0, 1, 2].map((seatIndex) => ({ seatIndex, kind: 'triangle' as const, attribute: 'triangle', sampleId: null, value: null, rankingSampleIds: null, correct: seatIndex > 0 }));

  it.each(setups.flatMap((setup) => [{ setup, answered: false }, { setup, answered: true }]))('$setup.method with $setup.attributes.length attributes (answered: $answered)', ({ setup, answered }) => {
    const analysis = analyseTasting({ ...setup, samples, answers: answered ? answersFor(setup) : [], seatCount: 3, submittedSeats: answered ? 3 : 0 });
    const filled = ['means', 'anova', ...(analysis.attributes.some((a) => a.penalties) ? ['penalty'] : []), ...(analysis.triangle ? ['triangle'] : []), ...(analysis.ranking ? ['ranking'] : [])];
    expect(summaryTablesOf(setup)).toEqual(filled);
  });

  it('names penalties only for a rated tasting with liking and a just-about-right attribute', () => {
    expect(summaryTablesOf({ method: 'rated', attributes: [LIKING, JAR] })).toContain('penalty');
    expect(summaryTablesOf({ method: 'rated', attributes: [JAR] })).not.toContain('penalty');
    expect(summaryTablesOf({ method: 'ranking', attributes: [LIKING, JAR] })).toEqual(['means', 'anova', 'ranking']);
  });
});
