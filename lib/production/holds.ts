/**
 * Where a batch stands after it was recorded, and what may follow. Pure.
 *
 * A batch that failed a check (kept for rework or on hold) or is incomplete (a check the spec
 * requires was not measured) is held. While held it can be re-tested — new readings checked against
 * the same spec, merged over the recorded ones — and then released (only when the latest check
 * passes) or rejected. A batch discarded at recording is final; so are a release and a reject.
 *
 * A batch kept for rework is re-boiled or blended and filled again: every reading taken before is
 * of another product. Its re-tests carry nothing over from the recording: a check not measured
 * again since the rework is "not measured", so the batch stays incomplete and held until each has
 * been read afresh (in one re-test or over several).
 */
import { checkBatchAgainstSpec, outcomeOfChecks, type BatchCheckResult, type BatchReadings, type QcCheck, type QcCheckKey, type QcSpec } from '@/lib/chemistry/qc';
import type { BatchOutcome, BatchStatus, Disposition } from './vocabulary';

/** The readings a re-test takes again; any left out keep their recorded value. */
export interface BatchRetestReadings {
  brixReading?: number | null;
  brixSampleTempC?: number | null;
  ph?: number | null;
  fillTempC?: number | null;
  netFillMeanG?: number | null;
  netFillMinG?: number | null;
  setTestScore?: number | null;
}

export interface RecordedBatch {
  readings: BatchReadings;
  checks: readonly QcCheck[];
  disposition: Disposition | null;
}

export interface BatchDecisionFact {
  kind: 'retest' | 'release' | 'reject';
  readings: BatchRetestReadings | null;
  checks: readonly QcCheck[] | null;
}

export interface BatchStanding {
  status: BatchStatus;
  /** The outcome of the latest checks (the last re-test's, or the recording's). */
  outcome: BatchOutcome;
  checks: readonly QcCheck[];
  /** The readings the latest checks were made on. */
  readings: BatchReadings;
  canRetest: boolean;
  canRelease: boolean;
  canReject: boolean;
  /** A reworked batch's checks not measured again since the rework (empty otherwise). */
  staleSinceRework: string[];
}

/** The jars a batch can sell: none once it is rejected or discarded (every jar goes with it), else those filled less those rejected. */
export function goodJarsOf(status: BatchStatus, jarsFilled: number, jarsRejected: number): number {
  return status === 'rejected' || status === 'discarded' ? 0 : Math.max(0, jarsFilled - jarsRejected);
}

/** The recorded readings with a re-test's values laid over them. */
export function mergeRetest(readings: BatchReadings, retest: BatchRetestReadings): BatchReadings {
  const merged: BatchReadings = { ...readings };
  for (const [key, value] of Object.entries(retest) as Array<[keyof BatchRetestReadings, number | null | undefined]>) {
    if (value !== undefined && value !== null) merged[key] = value;
  }
  return merged;
}

/** The readings that make each check fresh after a rework (a re-boil changes solids, acidity and set; the re-fill the rest). */
const RETAKEN_AFTER_REWORK: Record<QcCheckKey, ReadonlyArray<keyof BatchRetestReadings>> = {
  solids: ['brixReading'], ph: ['ph'], fill_temperature: ['fillTempC'], net_fill: ['netFillMeanG', 'netFillMinG'], set: ['setTestScore'],
};

/** The checks the re-tests since a rework have not measured again, in the spec's order. */
export function staleSinceRework(checks: readonly QcCheck[], retestsSinceRework: readonly BatchRetestReadings[]): QcCheck[] {
  return checks.filter((c) => !RETAKEN_AFTER_REWORK[c.key].some((k) => retestsSinceRework.some((r) => r[k] != null)));
}

/**
 * A re-test's checks after a rework: a check whose reading was not taken again since the rework is
 * not measured (its old value belongs to the batch before the re-boil). Other re-tests pass as they are.
 */
function afterRework(checks: readonly QcCheck[], retestsSinceRework: readonly BatchRetestReadings[]): QcCheck[] {
  const stale = new Set(staleSinceRework(checks, retestsSinceRework).map((c) => c.key));
  return checks.map((c) => (stale.has(c.key)
    ? { ...c, value: null, status: 'not_measured' as const, reason: `Not measured again since the rework: a re-boil or blend changes it, so the reading before does not count.` }
    : c));
}

/**
 * A re-test's checks: the merged readings against the spec the batch was made to. For a batch kept
 * for rework, `earlierRetests` are the re-tests before this one (all made after the rework).
 */
export function checkRetest(
  spec: QcSpec, readings: BatchReadings, retest: BatchRetestReadings, rework: { earlierRetests: readonly BatchRetestReadings[] } | null = null,
): BatchCheckResult & { readings: BatchReadings } {
  const merged = mergeRetest(readings, retest);
  const result = checkBatchAgainstSpec(spec, merged);
  if (!rework) return { ...result, readings: merged };
  const checks = afterRework(result.checks, [...rework.earlierRetests, retest]);
  return { ...result, checks, outcome: outcomeOfChecks(checks), readings: merged };
}

export function batchStanding(batch: RecordedBatch, decisions: readonly BatchDecisionFact[]): BatchStanding {
  let checks = batch.checks;
  let readings = batch.readings;
  const retests: BatchRetestReadings[] = [];
  for (const d of decisions) {
    if (d.kind === 'retest' && d.checks && d.readings) {
      retests.push(d.readings);
      // The same rule as at the re-test, so a re-test stored before it cannot release a reworked batch either.
      checks = batch.disposition === 'rework' ? afterRework(d.checks, retests) : d.checks;
      readings = mergeRetest(readings, d.readings);
    }
  }
  const outcome = outcomeOfChecks(checks);
  const recorded = outcomeOfChecks(batch.checks);
  const final = decisions.find((d) => d.kind === 'release' || d.kind === 'reject');
  const status: BatchStatus = final
    ? final.kind === 'release' ? 'released' : 'rejected'
    : recorded === 'pass' ? 'passed'
      : batch.disposition === 'discard' ? 'discarded'
        : 'held';
  const held = status === 'held';
  const stale = batch.disposition === 'rework' ? staleSinceRework(checks, retests).map((c) => c.label) : [];
  return { status, outcome, checks, readings, canRetest: held, canRelease: held && outcome === 'pass', canReject: held, staleSinceRework: stale };
}
