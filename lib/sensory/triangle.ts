/**
 * Serving plans for the discrimination tests: triangle (ISO 4120), duo-trio and paired
 * comparison. Every cup gets its own blinding code, unique across the whole session, and
 * the plan keeps which sample is behind each code for the serving sheet.
 */
import { drawBlindingCodes } from './blinding-codes';
import { cryptoRandomInt, shuffled, type RandomIntSource } from './random';

export type SampleLabel = 'A' | 'B';

/** The six possible triangle orders: two cups of one sample, one odd cup of the other. */
export const TRIANGLE_ORDERS = Object.freeze(['AAB', 'ABA', 'BAA', 'ABB', 'BAB', 'BBA'] as const);
export type TriangleOrder = (typeof TRIANGLE_ORDERS)[number];

/** Duo-trio orders written as "reference:first second". */
export const DUO_TRIO_BALANCED_ORDERS = Object.freeze(['A:AB', 'A:BA', 'B:AB', 'B:BA'] as const);
export type DuoTrioOrder = (typeof DUO_TRIO_BALANCED_ORDERS)[number];
/** Constant-reference duo-trio: sample A is always the reference (e.g. the current recipe). */
export const DUO_TRIO_CONSTANT_ORDERS: readonly DuoTrioOrder[] = Object.freeze(['A:AB', 'A:BA']);

export const PAIRED_ORDERS = Object.freeze(['AB', 'BA'] as const);
export type PairedOrder = (typeof PAIRED_ORDERS)[number];

export interface CodedCup {
  code: string;
  label: SampleLabel;
  sampleId: string;
}

/** A pair of samples under test; A and B are labels only, not a ranking. */
export interface SamplePair {
  sampleIdA: string;
  sampleIdB: string;
}

export interface DiscriminationPlanOptions extends SamplePair {
  seatCount: number;
  /** Codes already used in this session; never drawn again. */
  excludeCodes?: Iterable<string | number>;
  /** Injected randomness for the order cycle and the codes; defaults to Web Crypto. */
  random?: RandomIntSource;
}

interface SeatBase<Order extends string> {
  /** 0-based seat number. */
  seatIndex: number;
  order: Order;
  /** Coded cups in serving order, left to right. */
  cups: CodedCup[];
}

export type TriangleSeat = SeatBase<TriangleOrder> & {
  /** Code of the cup that differs from the other two. */
  oddCode: string;
};

export type DuoTrioSeat = SeatBase<DuoTrioOrder> & {
  /** The reference cup is marked as reference rather than coded. */
  reference: { label: SampleLabel; sampleId: string };
  /** Code of the coded cup that matches the reference. */
  matchingCode: string;
};

export type PairedSeat = SeatBase<PairedOrder>;

export interface DiscriminationServingPlan<Seat> {
  sampleIdA: string;
  sampleIdB: string;
  seats: Seat[];
  /** Seats per cycle in which every order appears once. */
  cycleLength: number;
  /** Orders are exactly balanced only when the seat count is a whole number of cycles. */
  isFullyBalanced: boolean;
  /** Every code used, for the session's exclusion list. */
  usedCodes: string[];
}

/**
 * Shuffles the orders once, then repeats that permutation seat by seat, so each run of
 * `orders.length` consecutive seats (starting at seat 0) holds every order exactly once.
 */
export function balancedOrderCycle<Order>(
  orders: readonly Order[],
  seatCount: number,
  random: RandomIntSource = cryptoRandomInt,
): Order[] {
  assertSeatCount(seatCount);
  if (orders.length === 0) throw new RangeError('An order cycle needs at least one order.');
  const cycle = shuffled(orders, random);
  return Array.from({ length: seatCount }, (_, seatIndex) => cycle[seatIndex % cycle.length]);
}

function assertSeatCount(seatCount: number): void {
  if (!Number.isInteger(seatCount) || seatCount < 0) {
    throw new RangeError(`Seat count must be a whole number of 0 or more; received ${seatCount}.`);
  }
}

function assertDistinctPair(pair: SamplePair): void {
  if (pair.sampleIdA === pair.sampleIdB) {
    throw new Error('A discrimination test compares two different samples.');
  }
}

function sampleIdForLabel(pair: SamplePair, label: SampleLabel): string {
  return label === 'A' ? pair.sampleIdA : pair.sampleIdB;
}

/** Builds coded cups for several seats with one draw, so no code repeats in the session. */
function codeCups(
  labelsPerSeat: readonly (readonly SampleLabel[])[],
  options: DiscriminationPlanOptions,
  random: RandomIntSource,
): { cupsPerSeat: CodedCup[][]; usedCodes: string[] } {
  const cupCount = labelsPerSeat.reduce((total, labels) => total + labels.length, 0);
  const codes = drawBlindingCodes(cupCount, { exclude: options.excludeCodes, random });
  let next = 0;
  const cupsPerSeat = labelsPerSeat.map((labels) =>
    labels.map((label) => ({ code: codes[next++], label, sampleId: sampleIdForLabel(options, label) })),
  );
  return { cupsPerSeat, usedCodes: codes };
}

/** The label of the odd cup in a triangle order: the one that appears once. */
export function triangleOddLabel(order: TriangleOrder): SampleLabel {
  const countA = [...order].filter((label) => label === 'A').length;
  return countA === 1 ? 'A' : 'B';
}

/** Triangle serving plan: 3 distinct codes per seat, six orders balanced every 6 seats. */
export function buildTriangleServingPlan(
  options: DiscriminationPlanOptions,
): DiscriminationServingPlan<TriangleSeat> {
  assertDistinctPair(options);
  const random = options.random ?? cryptoRandomInt;
  const orders = balancedOrderCycle(TRIANGLE_ORDERS, options.seatCount, random);
  const labelsPerSeat = orders.map((order) => [...order] as SampleLabel[]);
  const { cupsPerSeat, usedCodes } = codeCups(labelsPerSeat, options, random);

  const seats = orders.map((order, seatIndex) => {
    const cups = cupsPerSeat[seatIndex];
    const oddLabel = triangleOddLabel(order);
    const oddCup = cups.find((cup) => cup.label === oddLabel);
    if (!oddCup) throw new Error(`Triangle order ${order} has no odd cup.`);
    return { seatIndex, order, cups, oddCode: oddCup.code };
  });

  return {
    sampleIdA: options.sampleIdA,
    sampleIdB: options.sampleIdB,
    seats,
    cycleLength: TRIANGLE_ORDERS.length,
    isFullyBalanced: options.seatCount % TRIANGLE_ORDERS.length === 0,
    usedCodes,
  };
}

/** The sample behind a code at one seat; throws if the code was not served there. */
export function sampleIdForCode(seat: { cups: readonly CodedCup[] }, code: string): string {
  const cup = seat.cups.find((candidate) => candidate.code === code.trim());
  if (!cup) throw new Error(`Code ${code} was not served at this seat.`);
  return cup.sampleId;
}

/**
 * True when the taster picked the odd cup. A code that was not served at this seat is a
 * data-entry error, not a wrong answer, so it throws.
 */
export function isTriangleAnswerCorrect(seat: TriangleSeat, chosenCode: string): boolean {
  sampleIdForCode(seat, chosenCode);
  return chosenCode.trim() === seat.oddCode;
}

export interface DuoTrioPlanOptions extends DiscriminationPlanOptions {
  /**
   * "balanced": each sample is the reference at half the seats (4 orders).
   * "constant": sample A is always the reference (2 orders), for when tasters know A well.
   */
  referenceMode?: 'balanced' | 'constant';
}

/** Duo-trio serving plan: an uncoded reference, then two coded cups, one matching it. */
export function buildDuoTrioServingPlan(
  options: DuoTrioPlanOptions,
): DiscriminationServingPlan<DuoTrioSeat> {
  assertDistinctPair(options);
  const random = options.random ?? cryptoRandomInt;
  const orderSet = options.referenceMode === 'constant' ? DUO_TRIO_CONSTANT_ORDERS : DUO_TRIO_BALANCED_ORDERS;
  const orders = balancedOrderCycle(orderSet, options.seatCount, random);
  const labelsPerSeat = orders.map((order) => [...order.slice(2)] as SampleLabel[]);
  const { cupsPerSeat, usedCodes } = codeCups(labelsPerSeat, options, random);

  const seats = orders.map((order, seatIndex) => {
    const referenceLabel = order[0] as SampleLabel;
    const cups = cupsPerSeat[seatIndex];
    const matchingCup = cups.find((cup) => cup.label === referenceLabel);
    if (!matchingCup) throw new Error(`Duo-trio order ${order} has no matching cup.`);
    return {
      seatIndex,
      order,
      cups,
      reference: { label: referenceLabel, sampleId: sampleIdForLabel(options, referenceLabel) },
      matchingCode: matchingCup.code,
    };
  });

  return {
    sampleIdA: options.sampleIdA,
    sampleIdB: options.sampleIdB,
    seats,
    cycleLength: orderSet.length,
    isFullyBalanced: options.seatCount % orderSet.length === 0,
    usedCodes,
  };
}

/** True when the taster picked the coded cup that matches the reference. */
export function isDuoTrioAnswerCorrect(seat: DuoTrioSeat, chosenCode: string): boolean {
  sampleIdForCode(seat, chosenCode);
  return chosenCode.trim() === seat.matchingCode;
}

/**
 * Paired comparison serving plan: two coded cups, AB and BA balanced every 2 seats.
 * Whether a choice is "correct" depends on the question (directional or preference), so
 * answers are resolved with `sampleIdForCode`.
 */
export function buildPairedServingPlan(
  options: DiscriminationPlanOptions,
): DiscriminationServingPlan<PairedSeat> {
  assertDistinctPair(options);
  const random = options.random ?? cryptoRandomInt;
  const orders = balancedOrderCycle(PAIRED_ORDERS, options.seatCount, random);
  const labelsPerSeat = orders.map((order) => [...order] as SampleLabel[]);
  const { cupsPerSeat, usedCodes } = codeCups(labelsPerSeat, options, random);

  return {
    sampleIdA: options.sampleIdA,
    sampleIdB: options.sampleIdB,
    seats: orders.map((order, seatIndex) => ({ seatIndex, order, cups: cupsPerSeat[seatIndex] })),
    cycleLength: PAIRED_ORDERS.length,
    isFullyBalanced: options.seatCount % PAIRED_ORDERS.length === 0,
    usedCodes,
  };
}
