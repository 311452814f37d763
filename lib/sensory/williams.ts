/**
 * Williams Latin squares: serving orders balanced for position and first-order carry-over
 * (Williams 1949; MacFie et al. 1989, J. Sensory Studies 4:129–148).
 *
 * Treatments are 0-based indices here; letters (A, B, C…) are for display and serving sheets.
 */
import { cryptoRandomInt, shuffled, type RandomIntSource } from './random';

/** Letters limit display to 26 treatments; far beyond what one tasting can hold. */
export const MAX_LETTERED_TREATMENTS = 26;

function assertTreatmentCount(treatmentCount: number): void {
  if (!Number.isInteger(treatmentCount) || treatmentCount < 1) {
    throw new RangeError(
      `Treatment count must be a whole number of 1 or more; received ${treatmentCount}.`,
    );
  }
}

/** Display letter for a 0-based treatment index: 0 → "A". */
export function treatmentLetter(treatmentIndex: number): string {
  if (!Number.isInteger(treatmentIndex) || treatmentIndex < 0 || treatmentIndex >= MAX_LETTERED_TREATMENTS) {
    throw new RangeError(`Treatment index ${treatmentIndex} has no letter (A–Z only).`);
  }
  return String.fromCharCode(65 + treatmentIndex);
}

/**
 * First row of the square as 0-based indices: the 1-based sequence 1, 2, n, 3, n−1, 4, …
 * alternates between the low and the high end.
 */
export function williamsFirstRow(treatmentCount: number): number[] {
  assertTreatmentCount(treatmentCount);
  const row: number[] = [];
  let low = 0;
  let high = treatmentCount - 1;
  for (let position = 0; position < treatmentCount; position++) {
    // Positions 0, 1, 3, 5… take from the low end; 2, 4, 6… from the high end.
    if (position === 0 || position % 2 === 1) row.push(low++);
    else row.push(high--);
  }
  return row;
}

/**
 * Full design as 0-based treatment indices. Each row after the first adds 1 mod n.
 * For even n one square is balanced; for odd n the mirrored (reversed) square is appended,
 * giving 2n rows, because a single odd square cannot balance carry-over.
 */
export function williamsDesign(treatmentCount: number): number[][] {
  const firstRow = williamsFirstRow(treatmentCount);
  const square = Array.from({ length: treatmentCount }, (_, shift) =>
    firstRow.map((treatment) => (treatment + shift) % treatmentCount),
  );
  if (treatmentCount % 2 === 0 || treatmentCount === 1) return square;
  return [...square, ...square.map((row) => row.slice().reverse())];
}

/** Design rows as letter strings, e.g. ["ABDC", "BCAD", "CDBA", "DACB"] for 4 treatments. */
export function williamsDesignLetters(treatmentCount: number): string[] {
  if (treatmentCount > MAX_LETTERED_TREATMENTS) {
    throw new RangeError(`Letters only cover ${MAX_LETTERED_TREATMENTS} treatments.`);
  }
  return williamsDesign(treatmentCount).map((row) => row.map(treatmentLetter).join(''));
}

/** Number of seats that completes one balanced cycle of the design (n, or 2n for odd n). */
export function williamsCycleLength(treatmentCount: number): number {
  return williamsDesign(treatmentCount).length;
}

/**
 * Serving order (0-based treatment indices) for a 0-based seat. Seats cycle through the
 * design rows, so every full cycle of seats is balanced.
 */
export function servingOrderForSeat(seatIndex: number, treatmentCount: number): number[] {
  if (!Number.isInteger(seatIndex) || seatIndex < 0) {
    throw new RangeError(`Seat index must be a whole number of 0 or more; received ${seatIndex}.`);
  }
  const design = williamsDesign(treatmentCount);
  return design[seatIndex % design.length];
}

export interface TreatmentAssignment {
  /** 0-based treatment index in the design. */
  treatmentIndex: number;
  /** Display letter (A, B, …). */
  letter: string;
  sampleId: string;
}

export interface SeatServingOrder {
  /** 0-based seat number. */
  seatIndex: number;
  /** 0-based row of the design this seat follows. */
  designRowIndex: number;
  /** Sample ids in the order they are served. */
  sampleIds: string[];
  /** The same order as treatment letters, for the serving sheet. */
  letters: string;
}

export interface WilliamsServingPlan {
  /** Which sample stands behind which letter; drawn at random so no sample is always "A". */
  treatments: TreatmentAssignment[];
  seats: SeatServingOrder[];
  /** Seats per balanced cycle (n for even n, 2n for odd n). */
  cycleLength: number;
  /** Balance holds exactly only when the seat count is a whole number of cycles. */
  isFullyBalanced: boolean;
}

export interface WilliamsPlanOptions {
  /** Unique ids of the samples being compared. */
  sampleIds: readonly string[];
  seatCount: number;
  /** Injected randomness for the sample-to-letter mapping; defaults to Web Crypto. */
  random?: RandomIntSource;
}

/** Assigns every seat its serving order, with a random mapping of samples onto letters. */
export function assignWilliamsServingOrders(options: WilliamsPlanOptions): WilliamsServingPlan {
  const { sampleIds, seatCount } = options;
  if (sampleIds.length < 1) throw new RangeError('A serving plan needs at least one sample.');
  if (sampleIds.length > MAX_LETTERED_TREATMENTS) {
    throw new RangeError(`A serving plan can hold at most ${MAX_LETTERED_TREATMENTS} samples.`);
  }
  if (new Set(sampleIds).size !== sampleIds.length) {
    throw new Error('Sample ids in a serving plan must be unique.');
  }
  if (!Number.isInteger(seatCount) || seatCount < 0) {
    throw new RangeError(`Seat count must be a whole number of 0 or more; received ${seatCount}.`);
  }

  const treatmentCount = sampleIds.length;
  const samplesByTreatment = shuffled(sampleIds, options.random ?? cryptoRandomInt);
  const design = williamsDesign(treatmentCount);

  const treatments = samplesByTreatment.map((sampleId, treatmentIndex) => ({
    treatmentIndex,
    letter: treatmentLetter(treatmentIndex),
    sampleId,
  }));
  const seats = Array.from({ length: seatCount }, (_, seatIndex) => {
    const designRowIndex = seatIndex % design.length;
    const row = design[designRowIndex];
    return {
      seatIndex,
      designRowIndex,
      sampleIds: row.map((treatment) => samplesByTreatment[treatment]),
      letters: row.map(treatmentLetter).join(''),
    };
  });

  return {
    treatments,
    seats,
    cycleLength: design.length,
    isFullyBalanced: seatCount % design.length === 0,
  };
}
