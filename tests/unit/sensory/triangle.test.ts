import { describe, expect, it } from 'vitest';
import {
  DUO_TRIO_BALANCED_ORDERS,
  PAIRED_ORDERS,
  TRIANGLE_ORDERS,
  balancedOrderCycle,
  buildDuoTrioServingPlan,
  buildPairedServingPlan,
  buildTriangleServingPlan,
  createSeededRandomInt,
  isAllowedBlindingCode,
  isDuoTrioAnswerCorrect,
  isTriangleAnswerCorrect,
  sampleIdForCode,
  triangleOddLabel,
} from '@/lib/sensory';

const pair = { sampleIdA: 'apricot-batch-low-pectin', sampleIdB: 'apricot-batch-high-pectin' };

function expectEachOrderOncePerBlock(orders: readonly string[], allOrders: readonly string[]): void {
  const blockSize = allOrders.length;
  for (let start = 0; start + blockSize <= orders.length; start += blockSize) {
    expect([...orders.slice(start, start + blockSize)].sort()).toEqual([...allOrders].sort());
  }
}

describe('triangle test orders', () => {
  it('uses the six possible orders', () => {
    // Source: ISO 4120 (triangle test) — six possible serving orders of two samples in three cups (memory)
    expect([...TRIANGLE_ORDERS].sort()).toEqual(['AAB', 'ABA', 'ABB', 'BAA', 'BAB', 'BBA']);
    for (const order of TRIANGLE_ORDERS) {
      expect(order).toHaveLength(3);
      expect(new Set(order).size).toBe(2);
    }
  });

  it('names the cup that appears once as the odd one', () => {
    // Source: ISO 4120 — the odd sample is the one that differs from the other two
    expect(TRIANGLE_ORDERS.map(triangleOddLabel)).toEqual(['B', 'B', 'B', 'A', 'A', 'A']);
  });

  it('balances the six orders in every full cycle of 6 seats, for many seeds', () => {
    // Source: ISO 4120 — the six orders are used equally often across assessors (memory)
    for (let seed = 0; seed < 100; seed++) {
      const plan = buildTriangleServingPlan({ ...pair, seatCount: 24, random: createSeededRandomInt(seed) });
      expectEachOrderOncePerBlock(plan.seats.map((seat) => seat.order), TRIANGLE_ORDERS);
      expect(plan.isFullyBalanced).toBe(true);
    }
    expect(buildTriangleServingPlan({ ...pair, seatCount: 14 }).isFullyBalanced).toBe(false);
  });

  it('randomises the starting permutation', () => {
    // Common practice, no published source: the order cycle starts at a random permutation
    const firstCycles = new Set<string>();
    for (let seed = 0; seed < 60; seed++) {
      firstCycles.add(balancedOrderCycle(TRIANGLE_ORDERS, 6, createSeededRandomInt(seed)).join(' '));
    }
    expect(firstCycles.size).toBeGreaterThan(20);
  });

  it('gives each cup its own code, unique across the session and outside the exclude list', () => {
    // Source: ISO 13299 — three-digit random codes; common practice, no published source: unique within a session
    const excludeCodes = ['583', '947'];
    const plan = buildTriangleServingPlan({ ...pair, seatCount: 36, excludeCodes, random: createSeededRandomInt(12) });
    const allCodes = plan.seats.flatMap((seat) => seat.cups.map((cup) => cup.code));
    expect(allCodes).toHaveLength(36 * 3);
    expect(new Set(allCodes).size).toBe(allCodes.length);
    expect(plan.usedCodes.sort()).toEqual([...allCodes].sort());
    for (const code of allCodes) {
      expect(isAllowedBlindingCode(code)).toBe(true);
      expect(excludeCodes).not.toContain(code);
    }
  });

  it('keeps the sample behind each code in serving order', () => {
    // Source: ISO 4120 — each seat gets two cups of one sample and one of the other in the planned order
    const plan = buildTriangleServingPlan({ ...pair, seatCount: 12, random: createSeededRandomInt(8) });
    for (const seat of plan.seats) {
      expect(seat.cups.map((cup) => cup.label).join('')).toBe(seat.order);
      for (const cup of seat.cups) {
        expect(cup.sampleId).toBe(cup.label === 'A' ? pair.sampleIdA : pair.sampleIdB);
        expect(sampleIdForCode(seat, cup.code)).toBe(cup.sampleId);
      }
      const oddCups = seat.cups.filter((cup) => cup.label === triangleOddLabel(seat.order));
      expect(oddCups).toHaveLength(1);
      expect(seat.oddCode).toBe(oddCups[0].code);
    }
  });

  it('scores a chosen code as correct only for the odd cup', () => {
    // Source: ISO 4120 — a response is correct when the assessor identifies the odd sample
    const plan = buildTriangleServingPlan({ ...pair, seatCount: 6, random: createSeededRandomInt(21) });
    for (const seat of plan.seats) {
      const oddLabel = triangleOddLabel(seat.order);
      for (const cup of seat.cups) expect(isTriangleAnswerCorrect(seat, cup.code)).toBe(cup.label === oddLabel);
      expect(isTriangleAnswerCorrect(seat, ` ${seat.oddCode} `)).toBe(true);
    }
    const codeFromAnotherSeat = plan.seats[1].cups[0].code;
    expect(() => isTriangleAnswerCorrect(plan.seats[0], codeFromAnotherSeat)).toThrow(/not served/);
  });

  it('fails clearly when the session has too few codes left or the samples are the same', () => {
    // Common practice, no published source: unique codes per session make the pool finite
    expect(() => buildTriangleServingPlan({ ...pair, seatCount: 400 })).toThrow(/Cannot draw 1200 unique blinding codes/);
    expect(() => buildTriangleServingPlan({ sampleIdA: 'x', sampleIdB: 'x', seatCount: 6 })).toThrow(/different/);
  });
});

describe('duo-trio orders', () => {
  it('balances reference and serving order every 4 seats, and scores the matching cup as correct', () => {
    // Source: ISO 10399 (duo-trio test) — balanced reference: each sample serves as reference equally often (memory)
    const plan = buildDuoTrioServingPlan({ ...pair, seatCount: 16, random: createSeededRandomInt(2) });
    expectEachOrderOncePerBlock(plan.seats.map((seat) => seat.order), DUO_TRIO_BALANCED_ORDERS);
    for (const seat of plan.seats) {
      expect(seat.cups).toHaveLength(2);
      expect(seat.cups.map((cup) => cup.label).join('')).toBe(seat.order.slice(2));
      expect(seat.reference.label).toBe(seat.order[0]);
      for (const cup of seat.cups) {
        expect(isDuoTrioAnswerCorrect(seat, cup.code)).toBe(cup.sampleId === seat.reference.sampleId);
      }
    }
  });

  it('keeps sample A as reference in constant-reference mode', () => {
    // Source: ISO 10399 — constant-reference mode uses the same sample as reference throughout (memory)
    const plan = buildDuoTrioServingPlan({ ...pair, seatCount: 8, referenceMode: 'constant', random: createSeededRandomInt(3) });
    expect(plan.cycleLength).toBe(2);
    expectEachOrderOncePerBlock(plan.seats.map((seat) => seat.order), ['A:AB', 'A:BA']);
    for (const seat of plan.seats) expect(seat.reference.sampleId).toBe(pair.sampleIdA);
  });
});

describe('paired comparison orders', () => {
  it('balances AB and BA every 2 seats with two distinct codes per seat', () => {
    // Source: ISO 5495 (paired comparison) — both presentation orders used equally often (memory)
    const plan = buildPairedServingPlan({ ...pair, seatCount: 10, random: createSeededRandomInt(4) });
    expectEachOrderOncePerBlock(plan.seats.map((seat) => seat.order), PAIRED_ORDERS);
    for (const seat of plan.seats) {
      expect(seat.cups.map((cup) => cup.label).join('')).toBe(seat.order);
      expect(new Set(seat.cups.map((cup) => cup.sampleId))).toEqual(new Set([pair.sampleIdA, pair.sampleIdB]));
    }
    expect(new Set(plan.usedCodes).size).toBe(20);
  });
});
