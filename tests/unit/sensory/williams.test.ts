import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  assignWilliamsServingOrders,
  createSeededRandomInt,
  servingOrderForSeat,
  williamsCycleLength,
  williamsDesign,
  williamsDesignLetters,
  williamsFirstRow,
} from '@/lib/sensory';

/** How often each treatment sits at each position across the given rows: counts[position][treatment]. */
function positionCounts(rows: number[][], treatmentCount: number): number[][] {
  const counts = Array.from({ length: treatmentCount }, () => Array<number>(treatmentCount).fill(0));
  for (const row of rows) row.forEach((treatment, position) => counts[position][treatment]++);
  return counts;
}

/** How often treatment `before` is served directly before `after`: counts[before][after]. */
function adjacentPairCounts(rows: number[][], treatmentCount: number): number[][] {
  const counts = Array.from({ length: treatmentCount }, () => Array<number>(treatmentCount).fill(0));
  for (const row of rows) {
    for (let i = 0; i + 1 < row.length; i++) counts[row[i]][row[i + 1]]++;
  }
  return counts;
}

function expectEachTreatmentOncePerPosition(rows: number[][], treatmentCount: number): void {
  expect(rows).toHaveLength(treatmentCount);
  for (const row of rows) expect([...row].sort((a, b) => a - b)).toEqual([...Array(treatmentCount).keys()]);
  for (const perPosition of positionCounts(rows, treatmentCount)) {
    expect(perPosition).toEqual(Array(treatmentCount).fill(1));
  }
}

function expectCarryOverBalanced(rows: number[][], treatmentCount: number, timesEachPair: number): void {
  const counts = adjacentPairCounts(rows, treatmentCount);
  for (let before = 0; before < treatmentCount; before++) {
    for (let after = 0; after < treatmentCount; after++) {
      expect(counts[before][after], `pair ${before}→${after}`).toBe(before === after ? 0 : timesEachPair);
    }
  }
}

describe('Williams Latin square', () => {
  it('gives ABDC / BCAD / CDBA / DACB for 4 samples', () => {
    // Source: MacFie et al. 1989, J. Sensory Studies 4:129–148 (Williams 1949 design, 4 treatments)
    expect(williamsDesignLetters(4)).toEqual(['ABDC', 'BCAD', 'CDBA', 'DACB']);
  });

  it('starts with 1, 2, n, 3, n−1, 4, … (1-based)', () => {
    // Source: Williams 1949; MacFie et al. 1989 — first-row construction 1, 2, n, 3, n−1, 4, …
    expect(williamsFirstRow(5).map((t) => t + 1)).toEqual([1, 2, 5, 3, 4]);
    expect(williamsFirstRow(6).map((t) => t + 1)).toEqual([1, 2, 6, 3, 5, 4]);
    expect(williamsFirstRow(7).map((t) => t + 1)).toEqual([1, 2, 7, 3, 6, 4, 5]);
  });

  it('builds each later row by adding 1 mod n', () => {
    // Source: Williams 1949; MacFie et al. 1989 — each row adds 1 mod n to the previous
    const design = williamsDesign(6);
    for (let r = 1; r < design.length; r++) {
      expect(design[r]).toEqual(design[r - 1].map((t) => (t + 1) % 6));
    }
  });

  it('appends the mirrored square for odd n (2n rows)', () => {
    // Source: Williams 1949; MacFie et al. 1989 — odd n needs the mirror square
    const design = williamsDesign(5);
    expect(design).toHaveLength(10);
    for (let r = 0; r < 5; r++) expect(design[5 + r]).toEqual([...design[r]].reverse());
    expect(williamsCycleLength(5)).toBe(10);
    expect(williamsCycleLength(4)).toBe(4);
  });

  for (const n of [4, 6]) {
    it(`for ${n} samples: each sample once per position, each ordered pair once`, () => {
      // Source: Williams 1949; MacFie et al. 1989 — even n: one square balances position and first-order carry-over
      const design = williamsDesign(n);
      expectEachTreatmentOncePerPosition(design, n);
      expectCarryOverBalanced(design, n, 1);
    });
  }

  for (const n of [3, 5]) {
    it(`for ${n} samples: each square has each sample once per position; 2n rows hold each ordered pair twice`, () => {
      // Source: Williams 1949; MacFie et al. 1989 — odd n: two squares together balance carry-over
      const design = williamsDesign(n);
      expectEachTreatmentOncePerPosition(design.slice(0, n), n);
      expectEachTreatmentOncePerPosition(design.slice(n), n);
      expectCarryOverBalanced(design, n, 2);
    });
  }

  it('keeps position and carry-over balance for any n from 2 to 16', () => {
    // Source: Williams 1949; MacFie et al. 1989 — balance properties of the design, checked generally
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 16 }), (n) => {
        const design = williamsDesign(n);
        const squares = n % 2 === 0 ? [design] : [design.slice(0, n), design.slice(n)];
        for (const square of squares) expectEachTreatmentOncePerPosition(square, n);
        expectCarryOverBalanced(design, n, squares.length);
      }),
    );
  });

  it('cycles seats through the rows', () => {
    // Source: MacFie et al. 1989 — assessors take successive rows of the design
    const design = williamsDesign(4);
    for (let seat = 0; seat < 12; seat++) expect(servingOrderForSeat(seat, 4)).toEqual(design[seat % 4]);
    expect(servingOrderForSeat(13, 5)).toEqual(williamsDesign(5)[3]);
    expect(() => servingOrderForSeat(-1, 4)).toThrow(RangeError);
  });
});

describe('assignWilliamsServingOrders', () => {
  const sampleIds = ['batch-plum-01', 'batch-plum-02', 'batch-plum-03', 'batch-plum-04'];

  it('serves every seat the design row, mapped through one random sample-to-letter mapping', () => {
    // Source: MacFie et al. 1989 — design rows cycle across assessors
    const plan = assignWilliamsServingOrders({ sampleIds, seatCount: 8, random: createSeededRandomInt(7) });
    const expectedLetters = williamsDesignLetters(4);
    const sampleByLetter = new Map(plan.treatments.map((t) => [t.letter, t.sampleId]));
    expect([...sampleByLetter.values()].sort()).toEqual([...sampleIds].sort());
    plan.seats.forEach((seat, index) => {
      expect(seat.letters).toBe(expectedLetters[index % 4]);
      expect(seat.sampleIds).toEqual([...seat.letters].map((letter) => sampleByLetter.get(letter)));
    });
    expect(plan.isFullyBalanced).toBe(true);
  });

  it('balances carry-over between real sample ids over a full cycle', () => {
    // Source: Williams 1949; MacFie et al. 1989 — carry-over balance survives relabelling of treatments
    const five = [...sampleIds, 'batch-plum-05'];
    const plan = assignWilliamsServingOrders({ sampleIds: five, seatCount: 20, random: createSeededRandomInt(3) });
    const pairCounts = new Map<string, number>();
    for (const seat of plan.seats) {
      for (let i = 0; i + 1 < seat.sampleIds.length; i++) {
        const key = `${seat.sampleIds[i]}>${seat.sampleIds[i + 1]}`;
        pairCounts.set(key, (pairCounts.get(key) ?? 0) + 1);
      }
    }
    // 20 seats = two cycles of 10 rows, each ordered pair twice per cycle.
    expect(pairCounts.size).toBe(5 * 4);
    for (const count of pairCounts.values()) expect(count).toBe(4);
  });

  it('draws the sample-to-letter mapping from the injected source', () => {
    // Common practice, no published source: the letter mapping is randomised so no sample is always first
    const mappings = new Set<string>();
    for (let seed = 0; seed < 50; seed++) {
      const plan = assignWilliamsServingOrders({ sampleIds, seatCount: 4, random: createSeededRandomInt(seed) });
      mappings.add(plan.treatments.map((t) => t.sampleId).join(','));
    }
    expect(mappings.size).toBeGreaterThan(10);
    const replay = (seed: number) =>
      assignWilliamsServingOrders({ sampleIds, seatCount: 4, random: createSeededRandomInt(seed) }).treatments;
    expect(replay(11)).toEqual(replay(11));
  });

  it('flags plans whose seat count is not a whole number of cycles', () => {
    // Source: MacFie et al. 1989 — balance requires complete replicates of the design
    expect(assignWilliamsServingOrders({ sampleIds, seatCount: 6 }).isFullyBalanced).toBe(false);
    expect(assignWilliamsServingOrders({ sampleIds: sampleIds.slice(0, 3), seatCount: 6 }).isFullyBalanced).toBe(true);
    expect(() => assignWilliamsServingOrders({ sampleIds: ['a', 'a'], seatCount: 2 })).toThrow(/unique/);
  });
});
